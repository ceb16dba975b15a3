/** Query keys of the personal API tokens feature, general → specific. */
export const apiTokenKeys = {
  all: ['api-tokens'] as const,
  list: () => [...apiTokenKeys.all, 'list'] as const,
};

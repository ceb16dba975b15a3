/** Query keys of the reports feature, general → specific. */
export const reportKeys = {
  all: ['reports'] as const,
  version: () => [...reportKeys.all, 'version'] as const,
};

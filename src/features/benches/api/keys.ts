/** Query keys of the benches feature, general → specific. */
export const benchKeys = {
  all: ['benches'] as const,
  lists: () => [...benchKeys.all, 'list'] as const,
  details: () => [...benchKeys.all, 'detail'] as const,
  detail: (benchId: string) => [...benchKeys.details(), benchId] as const,
};

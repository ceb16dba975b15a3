/** Query keys of the members feature, general → specific. */
export const memberKeys = {
  all: ['members'] as const,
  lists: () => [...memberKeys.all, 'list'] as const,
  list: (benchId: string) => [...memberKeys.lists(), benchId] as const,
};

/** Query keys of the share-links feature, general → specific. */
export const shareLinkKeys = {
  all: ['share-links'] as const,
  lists: () => [...shareLinkKeys.all, 'list'] as const,
  list: (benchId: string) => [...shareLinkKeys.lists(), benchId] as const,
  shared: (token: string) => [...shareLinkKeys.all, 'shared', token] as const,
};

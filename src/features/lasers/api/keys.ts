/** Query keys of the lasers feature, general → specific. */
export const laserKeys = {
  all: ['lasers'] as const,
  lists: () => [...laserKeys.all, 'list'] as const,
  list: (benchId: string) => [...laserKeys.lists(), benchId] as const,
};

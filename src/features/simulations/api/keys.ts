/** Query keys of the simulations feature, general → specific. */
export const simulationKeys = {
  all: ['simulations'] as const,
  lists: () => [...simulationKeys.all, 'list'] as const,
  list: (benchId: string) => [...simulationKeys.lists(), benchId] as const,
};

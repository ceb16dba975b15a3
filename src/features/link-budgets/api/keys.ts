/** Query keys of the link-budgets feature, general → specific. */
export const linkBudgetKeys = {
  all: ['link-budgets'] as const,
  lists: () => [...linkBudgetKeys.all, 'list'] as const,
  list: (benchId: string) => [...linkBudgetKeys.lists(), benchId] as const,
};

/** DELETE /api/link-budgets/:id (an owner, or the analyst who saved it) → 204. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { linkBudgetKeys } from './keys';

export function deleteLinkBudget(budgetId: string): Promise<void> {
  return api.delete(apiPaths.linkBudgets.detail(budgetId));
}

export function useDeleteLinkBudget(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteLinkBudget,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: linkBudgetKeys.list(benchId) }),
  });
}

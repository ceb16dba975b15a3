/** POST /api/benches/:benchId/link-budgets (owner, analyst) → 201 the saved budget, evaluated as it is saved. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LinkBudgetResponse, SaveLinkBudgetRequest } from '../../../../server/contracts/link-budgets';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { linkBudgetKeys } from './keys';

export function saveLinkBudget(benchId: string, body: SaveLinkBudgetRequest): Promise<LinkBudgetResponse> {
  return api.post<LinkBudgetResponse>(apiPaths.benches.linkBudgets(benchId), body);
}

export function useSaveLinkBudget(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveLinkBudgetRequest) => saveLinkBudget(benchId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: linkBudgetKeys.list(benchId) }),
  });
}

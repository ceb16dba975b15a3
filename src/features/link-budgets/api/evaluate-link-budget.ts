/** POST /api/link-budgets/evaluate → the budget at one symbol rate and its table across symbol rates (nothing stored). */
import { useMutation } from '@tanstack/react-query';
import type { EvaluateLinkBudgetRequest, LinkBudgetEvaluation } from '../../../../server/contracts/link-budgets';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export function evaluateLinkBudget(body: EvaluateLinkBudgetRequest): Promise<LinkBudgetEvaluation> {
  return api.post<LinkBudgetEvaluation>(apiPaths.linkBudgets.evaluate(), body);
}

export function useEvaluateLinkBudget() {
  return useMutation({ mutationFn: evaluateLinkBudget });
}

/** GET /api/benches/:benchId/link-budgets → the bench's saved budgets, newest first. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { LinkBudgetListResponse } from '../../../../server/contracts/link-budgets';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { linkBudgetKeys } from './keys';

export function getLinkBudgets(benchId: string, signal?: AbortSignal): Promise<LinkBudgetListResponse> {
  return api.get<LinkBudgetListResponse>(apiPaths.benches.linkBudgets(benchId), { signal });
}

export const linkBudgetsQueryOptions = (benchId: string) =>
  queryOptions({ queryKey: linkBudgetKeys.list(benchId), queryFn: ({ signal }) => getLinkBudgets(benchId, signal) });

export function useLinkBudgets(benchId: string) {
  return useSuspenseQuery(linkBudgetsQueryOptions(benchId)).data.linkBudgets;
}

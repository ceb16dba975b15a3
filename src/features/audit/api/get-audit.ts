/** GET /api/benches/:benchId/audit?action=&actorId=&from=&to=&before= (owner) → events, newest first. */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { AuditListQuery, AuditListResponse } from '../../../../server/contracts/audit';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { auditKeys } from './keys';

export function getAudit(benchId: string, query: AuditListQuery, signal?: AbortSignal): Promise<AuditListResponse> {
  return api.get<AuditListResponse>(apiPaths.audit(benchId, query), { signal });
}

export function useAudit(benchId: string, query: AuditListQuery) {
  return useQuery({
    queryKey: auditKeys.list(benchId, query),
    queryFn: ({ signal }) => getAudit(benchId, query, signal),
    placeholderData: keepPreviousData,
  });
}

/**
 * GET /api/benches/:benchId/captures?pageSize=100 → the bench's captures whose latest analysis is done,
 * offered as references for a subtraction (their latest analysis).
 */
import { useQuery } from '@tanstack/react-query';
import type { CaptureListResponse } from '../../../../server/contracts/captures';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { correctionKeys } from './keys';

export interface ReferenceChoice {
  analysisId: string;
  label: string;
}

export async function listReferenceAnalyses(benchId: string, signal?: AbortSignal): Promise<ReferenceChoice[]> {
  const reply = await api.get<CaptureListResponse>(apiPaths.benches.captures(benchId, { page: 1, pageSize: 100 }), { signal });
  return reply.captures.filter((c) => c.latestAnalysis?.status === 'done').map((c) => ({ analysisId: c.latestAnalysis!.id, label: c.fileName }));
}

export function useReferenceAnalyses(benchId: string, enabled: boolean) {
  return useQuery({ queryKey: correctionKeys.references(benchId), queryFn: ({ signal }) => listReferenceAnalyses(benchId, signal), enabled });
}

/** Analyses rows → contract shapes. */
import type { Analysis, AnalysisResult, AnalysisSettings, AnalysisSummary } from '../../contracts/analyses';
import type { AnalysisRow, AnalysisSummaryRow } from './analyses.repository';

export function parseJsonColumn<T>(value: string | object | null): T | null {
  if (value === null || value === undefined) return null;
  return (typeof value === 'string' ? JSON.parse(value) : value) as T;
}

const iso = (d: Date | string | null): string | null => (d === null ? null : new Date(d).toISOString());

export function toAnalysisSummary(row: AnalysisSummaryRow): AnalysisSummary {
  return {
    id: row.id,
    captureId: row.capture_id,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    settings: parseJsonColumn<AnalysisSettings>(row.settings) ?? {},
    intrinsicLinewidthHz: row.intrinsic_linewidth_hz,
    betaLinewidthHz: row.beta_linewidth_hz,
    lineshapeFwhmHz: row.lineshape_fwhm_hz,
    whiteFloorHz2PerHz: row.white_floor_hz2_per_hz,
    error: row.error,
    createdAt: iso(row.created_at) as string,
    startedAt: iso(row.started_at),
    finishedAt: iso(row.finished_at),
  };
}

export function toAnalysis(row: AnalysisSummaryRow & Pick<AnalysisRow, 'result'>, benchId: string): Analysis {
  return { ...toAnalysisSummary(row), benchId, result: parseJsonColumn<AnalysisResult>(row.result) };
}

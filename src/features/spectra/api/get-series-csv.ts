/** GET /api/analyses/:id/series.csv → the full S_ν series as CSV text (frequency_hz, s_nu_hz2_per_hz), for download. */
import { apiPaths } from '../../../config/paths';
import { ApiError, toApiError } from '../../../lib/api-client';

export async function getSeriesCsv(analysisId: string, signal?: AbortSignal): Promise<string> {
  let response: Response;
  try {
    response = await fetch(apiPaths.analyses.seriesCsv(analysisId), { credentials: 'same-origin', headers: { Accept: 'text/csv' }, signal });
  } catch (cause) {
    if ((cause as { name?: string } | null)?.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', 'Phaseloom could not reach its server. Check the connection and try again.');
  }
  const text = await response.text();
  if (!response.ok) {
    let body: unknown;
    try {
      body = JSON.parse(text);
    } catch {
      body = undefined;
    }
    throw toApiError(response.status, body);
  }
  return text;
}

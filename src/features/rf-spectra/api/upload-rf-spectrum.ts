/**
 * POST /api/benches/:benchId/rf-spectra (multipart: the text fields, then `file`) → 201 { rfSpectrum }.
 * A file the server cannot read or fit comes back as the usual ApiError (400 with its message).
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RfSpectrumResponse } from '../../../../server/contracts/rf-spectra';
import { apiPaths } from '../../../config/paths';
import { ApiError, toApiError } from '../../../lib/api-client';
import { rfSpectrumKeys } from './keys';

export interface UploadRfSpectrumInput {
  file: File;
  /** name, powerUnit, mode, delayS, fiberLengthM, laserId — as text; empty values are left out */
  fields: Record<string, string | undefined>;
}

export async function uploadRfSpectrum(benchId: string, { file, fields }: UploadRfSpectrumInput): Promise<RfSpectrumResponse> {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) if (value !== undefined && value !== '') form.append(name, value);
  form.append('file', file, file.name);
  let response: Response;
  try {
    response = await fetch(apiPaths.benches.rfSpectra(benchId), { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'network_error', 'Phaseloom could not reach its server. Check the connection and try again.');
  }
  let body: unknown;
  try {
    body = await response.json();
  } catch {
    body = undefined;
  }
  if (!response.ok) throw toApiError(response.status, body);
  if (body === undefined) throw new ApiError(response.status, 'bad_response', 'The server sent an answer the client could not read.');
  return body as RfSpectrumResponse;
}

export function useUploadRfSpectrum(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadRfSpectrumInput) => uploadRfSpectrum(benchId, input),
    onSuccess: ({ rfSpectrum }) => {
      queryClient.setQueryData(rfSpectrumKeys.detail(rfSpectrum.id), { rfSpectrum });
      return queryClient.invalidateQueries({ queryKey: rfSpectrumKeys.list(benchId) });
    },
  });
}

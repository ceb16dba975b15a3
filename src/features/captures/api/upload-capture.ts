/**
 * POST /api/benches/:benchId/captures (multipart: the text fields, then `file`) → 201 { capture, analysis, duplicateOf? }.
 * Sent with XMLHttpRequest, the one browser API that reports upload progress; fetch cannot.
 * Failures become the same `ApiError` as every other request: 400 with the engine's message for a
 * file it cannot read, 403 for viewers, 413 over the size cap.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useCallback, useRef, useState } from 'react';
import type { CaptureUploadFields, CreateCaptureResponse } from '../../../../server/contracts/captures';
import { apiPaths } from '../../../config/paths';
import { ApiError, toApiError } from '../../../lib/api-client';
import { captureKeys } from './keys';

export interface UploadProgress {
  loaded: number;
  total: number;
}

export interface UploadCaptureInput {
  file: File;
  fields: CaptureUploadFields;
}

export function uploadCapture(
  benchId: string,
  { file, fields }: UploadCaptureInput,
  options: { onProgress?: (p: UploadProgress) => void; signal?: AbortSignal } = {},
): Promise<CreateCaptureResponse> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    // text fields first: the server reads them before the file streams in
    for (const [name, value] of Object.entries(fields)) {
      if (value !== undefined && value !== '') form.append(name, value);
    }
    form.append('file', file, file.name);

    const xhr = new XMLHttpRequest();
    xhr.open('POST', apiPaths.benches.captures(benchId));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => {
      options.onProgress?.({ loaded: e.loaded, total: e.lengthComputable ? e.total : file.size });
    };
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300 && body !== undefined) resolve(body as CreateCaptureResponse);
      else if (xhr.status >= 200 && xhr.status < 300) reject(new ApiError(xhr.status, 'bad_response', 'The server sent an answer the client could not read.'));
      else reject(toApiError(xhr.status, body));
    };
    xhr.onerror = () =>
      reject(new ApiError(0, 'network_error', 'The upload stopped: Phaseloom could not reach its server. Check the connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    if (options.signal) {
      if (options.signal.aborted) {
        reject(new DOMException('The upload was cancelled.', 'AbortError'));
        return;
      }
      options.signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

/** The upload as a mutation, with the bytes sent so far and a way to cancel. */
export function useUploadCapture(benchId: string) {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const controller = useRef<AbortController | null>(null);
  const mutation = useMutation({
    mutationFn: (input: UploadCaptureInput) => {
      controller.current = new AbortController();
      setProgress({ loaded: 0, total: input.file.size });
      return uploadCapture(benchId, input, { onProgress: setProgress, signal: controller.current.signal });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: captureKeys.benchLists(benchId) }),
  });
  const cancel = useCallback(() => controller.current?.abort(), []);
  const reset = mutation.reset;
  const clear = useCallback(() => {
    setProgress(null);
    reset();
  }, [reset]);
  return { ...mutation, progress, cancel, clear };
}

/** Was the error a cancelled upload (not a failure to report)? */
export function isAbort(error: unknown): boolean {
  return (error as { name?: string } | null)?.name === 'AbortError';
}

/**
 * Reads the first 64 KiB of a chosen file (File.slice, nothing else is read) and runs the analysis
 * engine's own sniffer and preview on it — the same readers the server will use — so the form can
 * show what the file says and ask only for what it cannot tell. The engine's message is kept when
 * the bytes cannot be read.
 */
import { useEffect, useMemo, useState } from 'react';
import { isAnalysisInputError } from '../../../../analysis/errors';
import { preview, type CapturePreview } from '../../../../analysis/io/preview';
import type { ByteOrder, CaptureFormat, RawDtype } from '../../../../server/contracts/captures';

export const PREVIEW_BYTES = 64 * 1024;

export interface PreviewChoices {
  format?: CaptureFormat;
  dtype?: RawDtype;
  channels?: 1 | 2;
  byteOrder?: ByteOrder;
}

export type FilePreviewState =
  | { status: 'none' }
  | { status: 'reading' }
  | { status: 'ready'; preview: CapturePreview }
  | { status: 'unreadable'; message: string };

export function useFilePreview(file: File | null, choices: PreviewChoices): FilePreviewState {
  const [bytes, setBytes] = useState<{ file: File; head: Uint8Array } | null>(null);
  const [readError, setReadError] = useState<string | null>(null);

  useEffect(() => {
    if (!file) return;
    let cancelled = false;
    setBytes(null);
    setReadError(null);
    file
      .slice(0, PREVIEW_BYTES)
      .arrayBuffer()
      .then((buffer) => {
        if (!cancelled) setBytes({ file, head: new Uint8Array(buffer) });
      })
      .catch(() => {
        if (!cancelled) setReadError('The browser could not read this file. Check that it is still where it was, and choose it again.');
      });
    return () => {
      cancelled = true;
    };
  }, [file]);

  const { format, dtype, channels, byteOrder } = choices;
  const parsed = useMemo<FilePreviewState | null>(() => {
    if (!bytes) return null;
    try {
      const result = preview(bytes.head, {
        fileName: bytes.file.name,
        format,
        dtype,
        channels,
        byteOrder,
        totalBytes: bytes.file.size,
        complete: bytes.file.size <= PREVIEW_BYTES,
        maxRows: 8,
      });
      return { status: 'ready', preview: result };
    } catch (error) {
      if (isAnalysisInputError(error)) return { status: 'unreadable', message: error.message };
      return { status: 'unreadable', message: 'The first bytes of this file could not be read as a capture.' };
    }
  }, [bytes, format, dtype, channels, byteOrder]);

  if (!file) return { status: 'none' };
  if (readError) return { status: 'unreadable', message: readError };
  if (!bytes || bytes.file !== file || !parsed) return { status: 'reading' };
  return parsed;
}

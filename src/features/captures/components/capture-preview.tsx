/** What the first bytes of a file say: format, channels, sample rate, kind, header fields and the first rows. */
import type { ReactNode } from 'react';
import type { CapturePreview as Preview } from '../../../../analysis/io/preview';
import { LoadingNote } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { formatSI } from '../../../lib/units';
import { FORMAT_LABELS, KIND_LABELS } from './capture-labels';
import { PREVIEW_BYTES, type FilePreviewState } from './use-file-preview';

const FROM: Record<Preview['formatFrom'], string> = {
  magic: 'recognised from its first bytes',
  text: 'its first bytes are text',
  extension: 'from the file name',
  option: 'as you chose',
};

const NEED_LABELS: Record<Preview['needs'][number], string> = {
  sampleRateHz: 'the sample rate',
  kind: 'what the record holds (kind)',
  dtype: 'the sample type of the raw file',
};

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[7.5rem_minmax(0,1fr)] gap-3 border-b border-rule/70 py-1.5 last:border-b-0">
      <dt className="text-ink-faint">{term}</dt>
      <dd className="min-w-0 text-ink">{children}</dd>
    </div>
  );
}

function fmtSample(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  const s = a >= 1e-3 && a < 1e5 ? Number(v.toPrecision(6)).toString() : v.toExponential(4);
  return s.replace('-', '\u2212');
}

export interface CapturePreviewPanelProps {
  state: FilePreviewState;
  fileSize: number | null;
  /** the sample rate typed in the form, for the record length when the file states none */
  givenRateHz?: number | null;
}

export function CapturePreviewPanel({ state, fileSize, givenRateHz = null }: CapturePreviewPanelProps) {
  if (state.status === 'none') {
    return (
      <p className="text-sm leading-relaxed text-ink-faint">
        Choose a file and its first {PREVIEW_BYTES / 1024} KiB are read here, in your browser, to show its format, sample rate and first rows
        before anything is sent.
      </p>
    );
  }
  if (state.status === 'reading') return <LoadingNote>Reading the first bytes…</LoadingNote>;
  if (state.status === 'unreadable') {
    return (
      <div role="alert" className="border-l-2 border-danger bg-danger-soft/50 py-3 pr-3 pl-4 text-sm leading-relaxed" data-testid="preview-error">
        <p className="font-medium text-danger">The first bytes cannot be read as a capture</p>
        <p className="mt-1 text-ink-soft">{state.message}.</p>
        <p className="mt-1 text-ink-soft">Choose the format below if the file name misleads, or check the file.</p>
      </div>
    );
  }
  const p = state.preview;
  const rate = givenRateHz && givenRateHz > 0 ? givenRateHz : p.sampleRateHz;
  const duration = p.estimatedSamples !== undefined && rate ? formatSI(p.estimatedSamples / rate, 's', { significant: 3 }).text : null;
  const fields = Object.entries(p.fields).filter(([k]) => k !== 'kindHint');
  const columns = p.channelCount === 2 ? ['I', 'Q'] : ['value'];
  return (
    <div className="text-sm" data-testid="capture-preview">
      <dl>
        <Row term="format">
          {FORMAT_LABELS[p.format]} <span className="text-ink-faint">· {FROM[p.formatFrom]}</span>
        </Row>
        {p.channelCount !== undefined && <Row term="channels">{p.channelCount === 2 ? '2 (I, Q)' : '1'}</Row>}
        <Row term="sample rate">
          {p.sampleRateHz ? (
            <>
              <Mono>{formatSI(p.sampleRateHz, 'Hz', { significant: 4, trim: true }).text}</Mono>{' '}
              <span className="text-ink-faint">· stated in the file</span>
            </>
          ) : (
            <span className="text-caution">not stated in the file</span>
          )}
        </Row>
        <Row term="kind">
          {p.kindGuess ? (
            <>
              {KIND_LABELS[p.kindGuess]} <span className="text-ink-faint">· from the file</span>
            </>
          ) : (
            <span className="text-caution">not told by the file</span>
          )}
        </Row>
        {p.estimatedSamples !== undefined && (
          <Row term="samples">
            <Mono>{p.estimatedSamples.toLocaleString('en-GB')}</Mono>
            {duration && <span className="text-ink-faint"> · <Mono>{duration}</Mono></span>}
          </Row>
        )}
        {fileSize !== null && fileSize > PREVIEW_BYTES && (
          <Row term="read">
            first <Mono>{PREVIEW_BYTES / 1024} KiB</Mono> <span className="text-ink-faint">of the file</span>
          </Row>
        )}
      </dl>

      {fields.length > 0 && (
        <details className="mt-3">
          <summary className="cursor-pointer text-xs font-medium tracking-[0.06em] text-ink-faint uppercase">Header fields</summary>
          <dl className="mt-2 font-mono text-xs">
            {fields.map(([k, v]) => (
              <div key={k} className="flex justify-between gap-4 border-b border-rule/60 py-1">
                <dt className="text-ink-faint">{k}</dt>
                <dd className="truncate text-ink">{String(v)}</dd>
              </div>
            ))}
          </dl>
        </details>
      )}

      {p.textLines && p.textLines.length > 0 ? (
        <div className="mt-4">
          <p className="text-xs font-medium tracking-[0.06em] text-ink-faint uppercase">First lines</p>
          <pre className="mt-1.5 max-h-44 overflow-auto rounded-[3px] border border-rule bg-paper px-3 py-2 font-mono text-xs leading-5 text-ink-soft">
            {p.textLines.slice(0, 8).join('\n')}
          </pre>
        </div>
      ) : (
        p.rows.length > 0 && (
          <div className="mt-4">
            <p className="text-xs font-medium tracking-[0.06em] text-ink-faint uppercase">First samples</p>
            <table className="mt-1.5 w-full font-mono text-xs">
              <thead>
                <tr className="border-b border-rule text-ink-faint">
                  <th scope="col" className="py-1 text-left font-normal">#</th>
                  {columns.map((c) => (
                    <th key={c} scope="col" className="py-1 text-right font-normal">
                      {c}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {p.rows.map((row, i) => (
                  <tr key={i} className="border-b border-rule/50">
                    <td className="py-0.5 text-ink-faint">{i}</td>
                    {row.map((v, j) => (
                      <td key={j} className="py-0.5 text-right text-ink">
                        {fmtSample(v)}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )
      )}

      {p.needs.length > 0 && (
        <p className="mt-4 border-l-2 border-caution bg-caution-soft/60 py-2 pr-3 pl-3 text-xs leading-relaxed text-ink-soft" data-testid="preview-needs">
          The file cannot tell {p.needs.map((n) => NEED_LABELS[n]).join(', ')}: give {p.needs.length === 1 ? 'it' : 'them'} in the form.
        </p>
      )}
    </div>
  );
}

/** Where each shared spectrum came from (file, sha256, kind, rate, dates, laser) and its marks. */
import type { SharedTrace } from '../../../../server/contracts/share-links';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { formatIsoDateTime } from '../../../lib/dates';
import { formatSI } from '../../../lib/units';

export function SharedProvenance({ traces }: { traces: readonly SharedTrace[] }) {
  return (
    <div className="grid gap-6 md:grid-cols-2">
      {traces.map((t, i) => (
        <div key={`${t.provenance.sha256}-${i}`} className="rounded-[4px] border border-rule bg-paper-card px-4 py-3 text-sm">
          <p className="flex items-center gap-2 font-medium text-ink">
            <span aria-hidden="true" className="inline-block h-[3px] w-5" style={{ backgroundColor: t.color }} />
            <span className="break-all">{t.provenance.fileName}</span>
          </p>
          <dl className="mt-2 grid grid-cols-[9rem_1fr] gap-x-3 gap-y-1">
            <dt className="text-ink-faint">laser</dt>
            <dd>{t.provenance.laserName ?? '—'}</dd>
            <dt className="text-ink-faint">kind · format</dt>
            <dd>
              {t.provenance.kind} · {t.provenance.format}
            </dd>
            <dt className="text-ink-faint">sample rate</dt>
            <dd>{t.provenance.sampleRateHz === null ? '—' : <Quantity q={formatSI(t.provenance.sampleRateHz, 'Hz')} />}</dd>
            <dt className="text-ink-faint">sha256</dt>
            <dd>
              <Mono className="text-xs break-all">{t.provenance.sha256}</Mono>
            </dd>
            <dt className="text-ink-faint">uploaded</dt>
            <dd>
              <Mono>{formatIsoDateTime(new Date(t.provenance.capturedAt))}</Mono>
            </dd>
            <dt className="text-ink-faint">analysed</dt>
            <dd>{t.provenance.analysedAt ? <Mono>{formatIsoDateTime(new Date(t.provenance.analysedAt))}</Mono> : '—'}</dd>
          </dl>
          {t.marks.length > 0 && (
            <>
              <p className="mt-3 text-xs font-medium tracking-[0.06em] text-ink-faint uppercase">Marks</p>
              <ul className="mt-1 space-y-0.5" aria-label={`Marks on ${t.provenance.fileName}`}>
                {t.marks.map((m, j) => (
                  <li key={j}>
                    <Mono>{m.bandHz ? `${formatSI(m.bandHz[0], 'Hz').text} – ${formatSI(m.bandHz[1], 'Hz').text}` : formatSI(m.frequencyHz ?? 0, 'Hz').text}</Mono>{' '}
                    <span className="text-ink-faint">{m.kind}</span> — {m.text}
                  </li>
                ))}
              </ul>
            </>
          )}
        </div>
      ))}
    </div>
  );
}

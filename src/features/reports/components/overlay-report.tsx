/**
 * The printable report of an overlay: its spectra listed with their colours, the figures side by side
 * with units and the settings each came from, the plot (drawn by the overlays feature, passed in by
 * the route), every capture's marks, and provenance per spectrum (file, sha256, how it was taken,
 * the analysis) with the product version; the laser-safety caution at the foot.
 */
import type { ReactNode } from 'react';
import type { Capture } from '../../../../server/contracts/captures';
import { MARK_KIND_LABELS, type Mark } from '../../../../server/contracts/marks';
import type { Overlay } from '../../../../server/contracts/overlays';
import type { VersionResponse } from '../../../../server/contracts/reports';
import { formatIsoDateTime } from '../../../lib/dates';
import { formatFixed, formatSI } from '../../../lib/units';
import { Facts, hz, hzBand, KIND_NAMES, mono, operatingPointText, ReportSection, ReportSheet, sci, SETUP_NAMES, SNuWhite, WINDOW_NAMES } from './report-parts';

export interface OverlayReportProps {
  benchName: string;
  overlay: Overlay;
  /** the capture of each trace, by capture id */
  captures: Readonly<Record<string, Capture>>;
  /** each capture's marks, by capture id (lowest frequency first) */
  marksByCapture: Readonly<Record<string, readonly Mark[]>>;
  /** the overlay plot, drawn by the route with the overlays feature */
  plot: ReactNode;
  version: VersionResponse;
  printedAt: Date;
}

const fixed = (v: number | null, unit: string, d: number) => (v === null ? '—' : formatFixed(v, unit, d, true).text);

function Swatch({ color, n }: { color: string; n: number }) {
  return (
    <span className="inline-flex items-center gap-1.5 font-mono font-semibold">
      <span aria-hidden="true" className="inline-block h-[3px] w-4 rounded-full" style={{ backgroundColor: color }} />
      {n}
    </span>
  );
}

export function OverlayReport({ benchName, overlay, captures, marksByCapture, plot, version, printedAt }: OverlayReportProps) {
  const traces = overlay.traces;
  const rows: [ReactNode, (t: Overlay['traces'][number]) => string][] = [
    ['Intrinsic linewidth', (t) => hz(t.figures.intrinsicLinewidthHz)],
    ['Integrated linewidth (β-line)', (t) => hz(t.figures.betaLinewidthHz)],
    ['Lineshape FWHM', (t) => hz(t.figures.lineshapeFwhmHz)],
    [<>White floor <SNuWhite /></>, (t) => sci(t.figures.whiteFloorHz2PerHz, 'Hz²/Hz')],
    ['1/f corner', (t) => hz(t.figures.cornerHz)],
    ['window', (t) => (t.settings.window ? (WINDOW_NAMES[t.settings.window] ?? t.settings.window) : '—')],
    ['segment', (t) => (t.settings.segment === null ? '—' : `${t.settings.segment.toLocaleString('en-GB')} samples`)],
    ['overlap · averages', (t) => `${t.settings.overlap === null ? '—' : formatFixed(t.settings.overlap * 100, '%', 0).text} · ${t.settings.averages ?? '—'}`],
    ['T₀', (t) => (t.settings.observationTimeS === null ? '—' : formatSI(t.settings.observationTimeS, 's').text)],
    ['white-floor band', (t) => hzBand(t.settings.floorBandHz)],
    ['drive current', (t) => fixed(t.operatingPoint.driveCurrentMa, 'mA', 2)],
    ['temperature', (t) => fixed(t.operatingPoint.temperatureC, '°C', 2)],
    ['output power', (t) => fixed(t.operatingPoint.outputPowerMw, 'mW', 3)],
  ];
  const marks = traces.flatMap((t, i) => (marksByCapture[t.captureId] ?? []).map((m) => ({ trace: i, color: t.color, mark: m })));
  // a capture in the overlay twice (two analyses of it) lists its marks once
  const seen = new Set<string>();
  const uniqueMarks = marks.filter(({ mark }) => (seen.has(mark.id) ? false : (seen.add(mark.id), true)));

  return (
    <ReportSheet
      kind="overlay report"
      testId="overlay-report"
      title={overlay.name}
      subtitle={
        <>
          {traces.length} spectra · {benchName} · saved {mono(formatIsoDateTime(overlay.updatedAt))}
        </>
      }
    >
      <ReportSection title="Spectra" testId="report-traces">
        <ol className="flex flex-col gap-1 text-[0.8125rem]">
          {traces.map((t, i) => (
            <li key={t.analysisId} className="flex gap-3">
              <Swatch color={t.color} n={i + 1} />
              <span className="min-w-0 break-words">
                {t.fileName}
                {t.laserName && <span className="text-ink-soft"> · {t.laserName}</span>}
              </span>
            </li>
          ))}
        </ol>
      </ReportSection>

      <ReportSection title="Figures side by side" testId="report-figures">
        <table className="w-full border-collapse text-[0.75rem]">
          <thead>
            <tr className="border-b border-rule text-left text-ink-faint">
              <th className="py-1 pr-2 font-medium" />
              {traces.map((t, i) => (
                <th key={t.analysisId} className="py-1 pr-2 font-medium">
                  <Swatch color={t.color} n={i + 1} />
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map(([name, value], r) => (
              <tr key={r} className={`border-b border-rule/60 ${r === 5 || r === 10 ? 'border-t border-t-rule-strong' : ''}`}>
                <td className="py-1 pr-2 text-ink-soft">{name}</td>
                {traces.map((t) => (
                  <td key={t.analysisId} className="py-1 pr-2 font-mono whitespace-nowrap tabular-nums">
                    {value(t)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1.5 text-xs text-ink-faint">Linewidths are FWHM in Hz; the rows below the first rule are the settings each spectrum was computed with, then its operating point.</p>
      </ReportSection>

      <section className="report-keep mt-7" data-testid="report-plot">
        <h2 className="border-b border-rule pb-1.5 text-[0.8125rem] font-semibold tracking-wide text-ink uppercase">Frequency-noise PSD</h2>
        <figure className="pt-2.5">
          {plot}
          <figcaption className="mt-1 text-xs text-ink-faint">
            One-sided S<sub>ν</sub>(f) in Hz²/Hz against offset frequency, each spectrum in its colour; thin grey lines and bands: the marks listed below.
          </figcaption>
        </figure>
      </section>

      <ReportSection title={`Marks · ${uniqueMarks.length}`} testId="report-marks">
        {uniqueMarks.length === 0 ? (
          <p className="text-[0.8125rem] text-ink-faint">No marks on these captures.</p>
        ) : (
          <table className="w-full border-collapse text-[0.8125rem]">
            <thead>
              <tr className="border-b border-rule text-left text-xs text-ink-faint">
                <th className="w-12 py-1 pr-2 font-medium">spectrum</th>
                <th className="py-1 pr-3 font-medium">kind</th>
                <th className="py-1 pr-3 font-medium">where</th>
                <th className="py-1 pr-3 font-medium">note</th>
                <th className="py-1 font-medium">by</th>
              </tr>
            </thead>
            <tbody className="align-top">
              {uniqueMarks.map(({ trace, color, mark: m }) => (
                <tr key={m.id} className="border-b border-rule/60" data-testid="report-mark">
                  <td className="py-1 pr-2">
                    <Swatch color={color} n={trace + 1} />
                  </td>
                  <td className="py-1 pr-3 whitespace-nowrap">{MARK_KIND_LABELS[m.kind]}</td>
                  <td className="py-1 pr-3 font-mono whitespace-nowrap tabular-nums">{m.bandHz ? hzBand(m.bandHz) : hz(m.frequencyHz, 4)}</td>
                  <td className="py-1 pr-3 break-words">{m.text}</td>
                  <td className="py-1 text-ink-soft">{m.authorName ?? '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </ReportSection>

      <ReportSection title="Provenance" testId="report-provenance">
        <div className="flex flex-col gap-4">
          {traces.map((t, i) => {
            const c = captures[t.captureId];
            return (
              <div key={t.analysisId} className="report-keep">
                <p className="mb-1 flex items-center gap-2 text-[0.8125rem] font-medium">
                  <Swatch color={t.color} n={i + 1} /> {t.fileName}
                </p>
                {c ? (
                  <Facts
                    rows={[
                      ['sha256', <span key="sha" className="font-mono text-xs break-all">{c.sha256}</span>],
                      ['kind · sample rate', <span key="k">{KIND_NAMES[c.kind] ?? c.kind} · {mono(hz(c.sampleRateHz, 6))}</span>],
                      ['setup', c.setup ? SETUP_NAMES[c.setup] : 'not stated'],
                      ['operating point', mono(operatingPointText(c, (v, unit, d) => formatFixed(v, unit, d, true).text))],
                      ['uploaded', <span key="u">{c.uploadedByName ?? '—'} · {mono(formatIsoDateTime(c.createdAt))}</span>],
                      ['analysis', mono(`${t.analysisId}${t.analysedAt ? ` · ${formatIsoDateTime(t.analysedAt)}` : ''}`)],
                    ]}
                  />
                ) : (
                  <p className="text-xs text-ink-faint">The capture could not be read.</p>
                )}
              </div>
            );
          })}
          <Facts
            rows={[
              ['product', mono(`${version.name} ${version.version}`)],
              ['printed', mono(formatIsoDateTime(printedAt))],
            ]}
          />
        </div>
      </ReportSection>
    </ReportSheet>
  );
}

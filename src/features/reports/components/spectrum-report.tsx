/**
 * The printable report of one spectrum: what was measured and how (figures with units and the
 * settings they came from), the plot with its marks, the list of marks, and provenance (the file
 * and its sha256, how it was taken, the analysis settings, the product version), ending with the
 * laser-safety caution. Laid out on an A4 sheet: the browser's "Save as PDF" prints it as shown.
 */
import type { ReactNode } from 'react';
import type { Analysis, AnalysisResult } from '../../../../server/contracts/analyses';
import type { Capture } from '../../../../server/contracts/captures';
import type { Laser } from '../../../../server/contracts/lasers';
import { MARK_KIND_LABELS, type Mark } from '../../../../server/contracts/marks';
import type { VersionResponse } from '../../../../server/contracts/reports';
import { SpectrumPlot, type PlotMark } from '../../../components/plots/spectrum-plot';
import { formatIsoDateTime } from '../../../lib/dates';
import { formatFixed, formatSI, formatWavelengthNm } from '../../../lib/units';
import { Facts, hz, hzBand, KIND_NAMES, mono, operatingPointText, ReportSection as Section, ReportSheet, sci, SETUP_NAMES, SNu, SNuWhite, WINDOW_NAMES } from './report-parts';

export interface SpectrumReportProps {
  benchName: string;
  laser: Laser | null;
  capture: Capture;
  /** a done analysis (its result is there) */
  analysis: Analysis;
  /** the display series: frequencies (Hz) and S_ν (Hz²/Hz) */
  series: { frequencyHz: number[]; sNu: number[] };
  marks: readonly Mark[];
  /** the same marks as the plot draws them (number, colour) */
  plotMarks: readonly PlotMark[];
  version: VersionResponse;
  printedAt: Date;
}

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

function read(result: AnalysisResult) {
  const s = result.settings as Record<string, unknown>;
  const m = result.noiseModel;
  return {
    input: result.input,
    window: result.settings.window,
    segment: result.settings.segment,
    overlap: result.settings.overlap,
    averages: result.settings.averages,
    enbwHz: num(s.enbwHz),
    detrend: typeof s.detrend === 'string' ? s.detrend : null,
    floor: result.whiteFloor.valueHz2PerHz,
    floorBand: result.whiteFloor.bandHz,
    intrinsic: result.intrinsicLinewidthHz,
    beta: result.betaLine,
    fwhm: result.lineshape.fwhmHz,
    model: m,
    modelBand: (() => {
      const b = (m as Record<string, unknown> | null)?.bandHz;
      return Array.isArray(b) && b.length === 2 && num(b[0]) !== null && num(b[1]) !== null ? ([b[0], b[1]] as [number, number]) : null;
    })(),
    spurs: result.spurs,
  };
}

export function SpectrumReport({ benchName, laser, capture, analysis, series, marks, plotMarks, version, printedAt }: SpectrumReportProps) {
  const r = read(analysis.result!);
  const t0 = r.beta.observationTimeS;
  const settingsLine = `${WINDOW_NAMES[r.window] ?? r.window} window · ${r.segment.toLocaleString('en-GB')}-sample segments · ${formatFixed(r.overlap * 100, '%', 0).text} overlap · ${r.averages.toLocaleString('en-GB')} averages · T₀ ${formatSI(t0, 's').text}`;
  const requested = analysis.settings;
  const requestedText =
    Object.keys(requested).length === 0
      ? 'the engine’s defaults'
      : [
          requested.window && `window ${requested.window}`,
          requested.segment !== undefined && `segment ${requested.segment}`,
          requested.overlap !== undefined && `overlap ${requested.overlap}`,
          requested.observationTimeS !== undefined && `T₀ ${formatSI(requested.observationTimeS, 's').text}`,
          requested.floorBandHz && `white-floor band ${hzBand(requested.floorBandHz)}`,
        ]
          .filter(Boolean)
          .join(' · ');
  const operatingPoint = operatingPointText(capture, (v, unit, d) => formatFixed(v, unit, d, true).text);
  const p = capture.setupParams;

  return (
    <ReportSheet
      kind="spectrum report"
      testId="spectrum-report"
      title={capture.fileName}
      subtitle={
        <>
          {laser ? `${laser.name}${laser.wavelengthNm !== null ? ` (${formatWavelengthNm(laser.wavelengthNm).text})` : ''} · ` : ''}
          {benchName} · analysed {analysis.finishedAt ? mono(formatIsoDateTime(analysis.finishedAt)) : '—'}
        </>
      }
    >
      <Section title="Figures" testId="report-figures">
        <p className="mb-2 text-xs text-ink-faint">{settingsLine}</p>
        <table className="w-full border-collapse text-[0.8125rem]">
          <thead>
            <tr className="border-b border-rule text-left text-xs text-ink-faint">
              <th className="py-1 pr-3 font-medium">figure</th>
              <th className="py-1 pr-3 font-medium">value</th>
              <th className="py-1 font-medium">from</th>
            </tr>
          </thead>
          <tbody className="align-top">
            <Row name="Intrinsic linewidth" value={hz(r.intrinsic)} from={<>Δν = π·<SNuWhite /> (Lorentzian FWHM)</>} />
            <Row name={<>White floor <SNuWhite /></>} value={sci(r.floor, 'Hz²/Hz')} from={`mean over ${hzBand(r.floorBand)}${requested.floorBandHz ? ' (band given)' : ' (band found by the engine)'}`} />
            <Row name="Integrated linewidth (β-separation line)" value={hz(r.beta.linewidthHz)} from={`area above β(f) from 1/T₀, T₀ = ${formatSI(t0, 's').text}; crossing at ${hz(r.beta.crossingHz)}`} />
            <Row name="Lineshape FWHM" value={hz(r.fwhm)} from={<>lineshape computed from the whole measured <SNu /> over T₀ = {formatSI(t0, 's').text}</>} />
            {r.model && (
              <>
                <Row name="Noise model a₀" value={sci(r.model.whiteHz2PerHz, 'Hz²/Hz')} from={<><SNu /> = a₀ + a₋₁/f + a₋₂/f², white term</>} />
                <Row name="Noise model a₋₁" value={sci(r.model.flickerHz2, 'Hz²')} from="flicker (1/f) term" />
                <Row name="Noise model a₋₂" value={sci(r.model.randomWalkHz3, 'Hz³')} from="random-walk (1/f²) term" />
                <Row name="1/f corner" value={hz(r.model.cornerHz)} from="where a₋₁/f meets a₀" />
              </>
            )}
            <Row
              name="Spurs above the model"
              value={String(r.spurs.length)}
              from={r.spurs.length ? r.spurs.slice(0, 8).map((s) => `${hz(s.frequencyHz)} (${formatFixed(s.heightDb, 'dB', 1).text})`).join(', ') + (r.spurs.length > 8 ? ', …' : '') : 'none found'}
            />
          </tbody>
        </table>
      </Section>

      <section className="report-keep mt-7" data-testid="report-plot">
        <h2 className="border-b border-rule pb-1.5 text-[0.8125rem] font-semibold tracking-wide text-ink uppercase">Frequency-noise PSD</h2>
        <figure className="pt-2.5">
          <SpectrumPlot
            series={series}
            view="frequency"
            band={r.floorBand}
            floorHz2PerHz={r.floor}
            observationTimeS={t0}
            model={r.model && r.model.whiteHz2PerHz !== null && r.model.flickerHz2 !== null && r.model.randomWalkHz3 !== null ? { whiteHz2PerHz: r.model.whiteHz2PerHz, flickerHz2: r.model.flickerHz2, randomWalkHz3: r.model.randomWalkHz3, bandHz: r.modelBand ?? [series.frequencyHz[0] ?? 1, series.frequencyHz[series.frequencyHz.length - 1] ?? 10] } : null}
            spurs={r.spurs}
            marks={plotMarks}
            label={`${capture.fileName}: frequency-noise PSD Sν (Hz²/Hz)`}
            height={330}
          />
          <figcaption className="mt-1 text-xs text-ink-faint">
            One-sided <SNu />(f) in Hz²/Hz against offset frequency, Welch estimate ({settingsLine}). Shaded: the white-floor band; dashed: the
            β-separation line β(f) = 8 ln2 · f/π²; numbered lines and bands: the marks listed below.
          </figcaption>
        </figure>
      </section>

      <Section title={`Marks · ${marks.length}`} testId="report-marks">
        {marks.length === 0 ? (
          <p className="text-[0.8125rem] text-ink-faint">No marks on this capture.</p>
        ) : (
          <table className="w-full border-collapse text-[0.8125rem]">
            <thead>
              <tr className="border-b border-rule text-left text-xs text-ink-faint">
                <th className="w-8 py-1 pr-2 font-medium">#</th>
                <th className="py-1 pr-3 font-medium">kind</th>
                <th className="py-1 pr-3 font-medium">where</th>
                <th className="py-1 pr-3 font-medium">note</th>
                <th className="py-1 font-medium">by</th>
              </tr>
            </thead>
            <tbody className="align-top">
              {marks.map((m, i) => (
                <tr key={m.id} className="border-b border-rule/60" data-testid="report-mark">
                  <td className="py-1 pr-2 font-mono font-semibold" style={{ color: plotMarks[i]?.color }}>
                    {i + 1}
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
      </Section>

      <Section title="Provenance" testId="report-provenance">
        <Facts
          rows={[
            ['file', capture.fileName],
            ['sha256', <span key="sha" className="font-mono text-xs break-all">{capture.sha256}</span>],
            ['size · format', mono(`${formatSI(capture.sizeBytes, 'B').text} · ${capture.format}${capture.dtype ? ` ${capture.dtype}` : ''}${capture.channels ? ` · ${capture.channels} ch` : ''}`)],
            ['kind', KIND_NAMES[capture.kind] ?? capture.kind],
            ['sample rate', mono(hz(capture.sampleRateHz ?? r.input.sampleRateHz, 6))],
            ['record', mono(`${r.input.samples.toLocaleString('en-GB')} samples · ${formatSI(r.input.durationS, 's').text}`)],
            [
              'setup',
              capture.setup
                ? `${SETUP_NAMES[capture.setup]}${p?.referenceLinewidthHz !== undefined ? `, reference linewidth ${hz(p.referenceLinewidthHz)}` : ''}${p?.delayS !== undefined ? `, delay ${formatSI(p.delayS, 's').text}` : ''}`
                : 'not stated',
            ],
            ['operating point', mono(operatingPoint)],
            ['laser', laser ? `${laser.name}${laser.wavelengthNm !== null ? ` · ${formatWavelengthNm(laser.wavelengthNm).text}` : ''}` : 'none'],
            ['uploaded', <span key="up">{capture.uploadedByName ?? '—'} · {mono(formatIsoDateTime(capture.createdAt))}</span>],
            ['analysis settings', `${settingsLine}${r.enbwHz !== null ? ` · RBW (ENBW) ${hz(r.enbwHz)}` : ''}${r.detrend ? ` · detrend ${r.detrend}` : ''}`],
            ['settings asked for', requestedText],
            ['capture · analysis id', mono(`${capture.id} · ${analysis.id}`)],
            ['product', mono(`${version.name} ${version.version}`)],
            ['printed', mono(formatIsoDateTime(printedAt))],
          ]}
        />
      </Section>

    </ReportSheet>
  );
}

function Row({ name, value, from }: { name: ReactNode; value: string; from: ReactNode }) {
  return (
    <tr className="border-b border-rule/60">
      <td className="py-1 pr-3 text-ink-soft">{name}</td>
      <td className="py-1 pr-3 font-mono font-medium whitespace-nowrap tabular-nums">{value}</td>
      <td className="py-1 text-xs leading-snug text-ink-faint">{from}</td>
    </tr>
  );
}

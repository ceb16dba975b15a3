/**
 * The overlay plot: several frequency-noise spectra on one pair of log axes, each in its own colour
 * (Okabe–Ito, by position in the overlay), with a legend above the frame. Optional marks (a
 * frequency or a band with a label) are drawn as thin rules or shaded bands. Drawn with D3 scales and
 * shapes into React-owned SVG; colours are attributes so the SVG can be exported as it is. The table
 * beside it is the accessible reading of the figures.
 */
import { line as d3line, scaleLinear, scaleLog } from 'd3';
import { useMemo, useRef, useState } from 'react';
import { formatFrequencyTick, formatPowerOfTen, linearTicks, logTicks } from '../../../components/plots/log-axis';
import { plotTheme as T } from '../../../components/plots/plot-theme';
import { SvgSymbol } from '../../../components/plots/plot-text';
import { seriesInView, VIEW_INFO, type SpectrumView } from '../../../components/plots/spectrum-math';
import { useElementWidth } from '../../../components/plots/use-element-width';
import { formatScientific, formatSI } from '../../../lib/units';

export interface OverlayPlotTrace {
  key: string;
  label: string;
  color: string;
  frequencyHz: readonly number[];
  /** S_ν, Hz²/Hz */
  sNu: readonly number[];
}

export interface OverlayPlotMark {
  key: string;
  loHz: number;
  hiHz: number | null;
  label: string;
}

export interface OverlayPlotProps {
  traces: readonly OverlayPlotTrace[];
  view?: SpectrumView;
  marks?: readonly OverlayPlotMark[];
  label: string;
  height?: number;
}

const M = { top: 16, right: 20, bottom: 46, left: 76 };
const MARK_COLOR = '#7d776c';

export function OverlayPlot({ traces, view = 'frequency', marks = [], label, height = 380 }: OverlayPlotProps) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const [hover, setHover] = useState<string | null>(null);
  const legendRows = Math.max(1, Math.ceil(traces.length / Math.max(1, Math.floor(Math.max(width - M.left, 200) / 260))));
  const top = M.top + legendRows * 18 + 8;
  const iw = Math.max(10, width - M.left - M.right);
  const ih = Math.max(10, height - top - M.bottom);
  const info = VIEW_INFO[view];

  const drawn = useMemo(
    () => traces.map((t) => ({ trace: t, ...seriesInView({ frequencyHz: t.frequencyHz, sNu: t.sNu }, view) })),
    [traces, view],
  );
  const xDomain = useMemo<[number, number]>(() => {
    const fs = drawn.flatMap((d) => d.f);
    if (fs.length === 0) return [1, 1e6];
    return [Math.min(...fs), Math.max(...fs)];
  }, [drawn]);
  const yDomain = useMemo<[number, number]>(() => {
    const vs = drawn.flatMap((d) => d.v);
    if (vs.length === 0) return info.logY ? [1, 1e6] : [-160, -40];
    const lo = Math.min(...vs);
    const hi = Math.max(...vs);
    if (info.logY) return [lo / 10 ** 0.25, hi * 10 ** 0.25];
    const pad = Math.max(1, (hi - lo) * 0.05);
    return [lo - pad, hi + pad];
  }, [drawn, info.logY]);

  const x = scaleLog().domain(xDomain).range([0, iw]);
  const y = info.logY ? scaleLog().domain(yDomain).range([ih, 0]) : scaleLinear().domain(yDomain).range([ih, 0]);
  const xTicks = logTicks(xDomain, Math.max(3, Math.floor(iw / 90)), formatFrequencyTick);
  const yTicks = info.logY
    ? logTicks(yDomain, Math.max(3, Math.floor(ih / 34)), formatPowerOfTen)
    : linearTicks(yDomain, Math.max(3, Math.floor(ih / 40)), (v) => String(Math.round(v)));
  const perRow = Math.max(1, Math.ceil(traces.length / legendRows));
  const legendWidth = Math.max(120, Math.floor(iw / perRow));
  // about 6 px a character at 11 px, after the swatch
  const maxLegendChars = Math.max(12, Math.floor((legendWidth - 36) / 6));
  const valueText = (v: number) => (info.logY ? formatScientific(v, info.unit, 3).text : `${v.toFixed(1)} ${info.unit}`);

  return (
    <div ref={wrapRef} className="relative w-full" data-testid="overlay-plot">
      {width > 0 && (
        <svg width={width} height={height} role="img" aria-label={label} fontFamily={T.sans} className="block">
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},${M.top + 4})`} fontSize={11} fill={T.inkSoft} data-legend="">
            {traces.map((t, i) => (
              <g key={t.key} transform={`translate(${(i % perRow) * legendWidth},${Math.floor(i / perRow) * 18})`}>
                <line x1={0} x2={22} y1={0} y2={0} stroke={t.color} strokeWidth={2.2} />
                <text x={28} dy="0.35em">
                  {t.label.length > maxLegendChars ? `${t.label.slice(0, maxLegendChars - 1)}…` : t.label}
                </text>
              </g>
            ))}
          </g>
          <g transform={`translate(${M.left},${top})`}>
            <defs>
              <clipPath id="overlay-plot-clip">
                <rect width={iw} height={ih} />
              </clipPath>
            </defs>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.value}`} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            <g clipPath="url(#overlay-plot-clip)">
              {marks.map((m) =>
                m.hiHz !== null ? (
                  <rect key={m.key} x={x(m.loHz)} width={Math.max(1, x(m.hiHz) - x(m.loHz))} y={0} height={ih} fill={MARK_COLOR} fillOpacity={0.1}>
                    <title>{m.label}</title>
                  </rect>
                ) : (
                  <line key={m.key} x1={x(m.loHz)} x2={x(m.loHz)} y1={0} y2={ih} stroke={MARK_COLOR} strokeDasharray="3 3">
                    <title>{m.label}</title>
                  </line>
                ),
              )}
              {drawn.map(({ trace, f, v }) => {
                const pts = f.map((fi, i) => [fi, v[i]] as const);
                const d = d3line<readonly [number, number]>()
                  .x((p) => x(p[0]))
                  .y((p) => y(p[1]))(pts);
                const dim = hover !== null && hover !== trace.key;
                return (
                  <path
                    key={trace.key}
                    d={d ?? ''}
                    fill="none"
                    stroke={trace.color}
                    strokeWidth={hover === trace.key ? 2.4 : 1.6}
                    strokeOpacity={dim ? 0.3 : 1}
                    onPointerEnter={() => setHover(trace.key)}
                    onPointerLeave={() => setHover(null)}
                  >
                    <title>{trace.label}</title>
                  </path>
                );
              })}
            </g>
            {marks.map((m, i) => (
              <text key={`ml${m.key}`} x={x(m.hiHz === null ? m.loHz : Math.sqrt(m.loHz * m.hiHz))} y={10 + (i % 3) * 12} fontSize={10} textAnchor="middle" fill={T.inkSoft}>
                {m.label.length > 24 ? `${m.label.slice(0, 23)}…` : m.label}
              </text>
            ))}
            <rect width={iw} height={ih} fill="none" stroke={T.frame} />
            <g fontFamily={T.mono} fontSize={10.5} fill={T.inkSoft}>
              {yTicks
                .filter((t) => t.label)
                .map((t) => (
                  <text key={`ty${t.value}`} x={-7} y={y(t.value)} dy="0.34em" textAnchor="end">
                    {t.label}
                  </text>
                ))}
              {xTicks
                .filter((t) => t.label)
                .map((t) => (
                  <text key={`tx${t.value}`} x={x(t.value)} y={ih + 16} textAnchor="middle">
                    {t.label}
                  </text>
                ))}
            </g>
            <text x={iw / 2} y={ih + 38} textAnchor="middle" fontSize={12} fill={T.ink}>
              Fourier frequency f (Hz)
            </text>
            <text transform={`translate(${-M.left + 16},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill={T.ink}>
              <SvgSymbol text={`${info.symbol} (${info.unit})`} fontSize={12} />
            </text>
            {traces.length === 0 && (
              <text x={iw / 2} y={ih / 2} textAnchor="middle" fontSize={13} fill={T.inkFaint}>
                No spectra in this overlay.
              </text>
            )}
          </g>
        </svg>
      )}
      {hover && (
        <div className="pointer-events-none absolute top-1 right-4 rounded-[3px] border border-rule bg-paper-card px-2 py-1 font-mono text-xs text-ink">
          {traces.find((t) => t.key === hover)?.label}
        </div>
      )}
      <p className="sr-only">
        {traces.map((t) => {
          const d = drawn.find((e) => e.trace.key === t.key);
          const last = d && d.v.length ? valueText(d.v[d.v.length - 1]) : 'no points';
          return `${t.label}: ${d?.f.length ?? 0} points up to ${d && d.f.length ? formatSI(d.f[d.f.length - 1], 'Hz').text : '—'}, ending at ${last}. `;
        })}
      </p>
    </div>
  );
}

/**
 * The sweep plot: a laser's intrinsic and β-line linewidths (log y, Hz) against an operating
 * parameter (linear x, with its unit), points only; for output power the fitted Δν = a/P + Δν₀ is
 * drawn through them as a curve (a straight line in 1/P). Drawn with D3 scales and shapes into
 * React-owned SVG; the table beside it is the accessible reading.
 */
import { line as d3line, scaleLinear, scaleLog } from 'd3';
import { useMemo, useRef } from 'react';
import type { SweepFit, SweepPoint } from '../../../../server/contracts/sweeps';
import { formatFrequencyTick, linearTicks, logTicks } from '../../../components/plots/log-axis';
import { plotTheme as T } from '../../../components/plots/plot-theme';
import { useElementWidth } from '../../../components/plots/use-element-width';
import { formatSI } from '../../../lib/units';

export interface SweepPlotProps {
  points: readonly SweepPoint[];
  /** axis title with unit, e.g. "Output power P (mW)" */
  xTitle: string;
  unit: string;
  fits?: { intrinsic: SweepFit | null; beta: SweepFit | null };
  label: string;
  height?: number;
}

const M = { top: 30, right: 20, bottom: 46, left: 76 };
const SERIES = [
  { key: 'intrinsicLinewidthHz', fit: 'intrinsic', label: 'Intrinsic linewidth', color: T.trace },
  { key: 'betaLinewidthHz', fit: 'beta', label: 'β-line linewidth', color: T.beta },
] as const;

export function SweepPlot({ points, xTitle, unit, fits, label, height = 320 }: SweepPlotProps) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const iw = Math.max(10, width - M.left - M.right);
  const ih = height - M.top - M.bottom;

  const xDomain = useMemo<[number, number]>(() => {
    if (points.length === 0) return [0, 1];
    const xs = points.map((p) => p.x);
    const lo = Math.min(...xs);
    const hi = Math.max(...xs);
    const pad = hi > lo ? (hi - lo) * 0.08 : Math.max(1, Math.abs(lo) * 0.1);
    return [unit === 'mW' || unit === 'mA' ? Math.max(0, lo - pad) : lo - pad, hi + pad];
  }, [points, unit]);
  const yDomain = useMemo<[number, number]>(() => {
    const vs = points.flatMap((p) => [p.intrinsicLinewidthHz, p.betaLinewidthHz]).filter((v): v is number => v !== null && v > 0);
    if (vs.length === 0) return [1, 1e6];
    return [Math.min(...vs) / 10 ** 0.3, Math.max(...vs) * 10 ** 0.3];
  }, [points]);

  const x = scaleLinear().domain(xDomain).range([0, iw]);
  const y = scaleLog().domain(yDomain).range([ih, 0]);
  const xTicks = linearTicks(xDomain, Math.max(3, Math.floor(iw / 80)), (v) => String(Number(v.toPrecision(4))));
  const yTicks = logTicks(yDomain, Math.max(2, Math.floor(ih / 36)), formatFrequencyTick);

  const curve = (fit: SweepFit) => {
    const lo = Math.max(xDomain[0], 1e-6);
    const n = 80;
    const pts: [number, number][] = [];
    for (let i = 0; i <= n; i++) {
      const p = lo + ((xDomain[1] - lo) * i) / n;
      const v = fit.slopeHzW / (p * 1e-3) + fit.floorHz;
      if (v > yDomain[0] && v < yDomain[1] * 10) pts.push([p, v]);
    }
    return (
      d3line<[number, number]>()
        .x((d) => x(d[0]))
        .y((d) => y(Math.min(d[1], yDomain[1])))(pts) ?? ''
    );
  };

  return (
    <div ref={wrapRef} className="relative w-full" data-testid="sweep-plot">
      {width > 0 && (
        <svg width={width} height={height} role="img" aria-label={label} fontFamily={T.sans} className="block">
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},12)`} fontSize={11} fill={T.inkSoft}>
            {SERIES.map((s, i) => (
              <g key={s.key} transform={`translate(${i * 200},0)`}>
                <circle cx={10} cy={0} r={3.5} fill={T.paper} stroke={s.color} strokeWidth={1.6} />
                <text x={20} dy="0.35em">
                  {s.label}
                  {fits?.[s.fit] ? ' · fit a/P + Δν₀' : ''}
                </text>
              </g>
            ))}
          </g>
          <g transform={`translate(${M.left},${M.top})`}>
            <defs>
              <clipPath id="sweep-plot-clip">
                <rect width={iw} height={ih} />
              </clipPath>
            </defs>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.value}`} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={T.gridMinor} strokeWidth={0.6} />
            ))}
            <rect width={iw} height={ih} fill="none" stroke={T.frame} />
            <g clipPath="url(#sweep-plot-clip)">
              {SERIES.map((s) => {
                const fit = fits?.[s.fit];
                return fit ? <path key={`fit-${s.key}`} d={curve(fit)} fill="none" stroke={s.color} strokeWidth={1.4} strokeDasharray="6 3" data-fit={s.fit} /> : null;
              })}
              {SERIES.map((s) =>
                points
                  .filter((p) => (p[s.key] ?? 0) > 0)
                  .map((p) => (
                    <circle key={`${s.key}-${p.captureId}`} cx={x(p.x)} cy={y(p[s.key] as number)} r={4} fill={T.paper} stroke={s.color} strokeWidth={1.6}>
                      <title>{`${s.label}: ${formatSI(p[s.key] as number, 'Hz').text} at ${p.x} ${unit} · ${p.fileName}`}</title>
                    </circle>
                  )),
              )}
            </g>
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
              {xTitle}
            </text>
            <text transform={`translate(${-M.left + 16},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill={T.ink}>
              Linewidth Δν (Hz)
            </text>
            {points.length === 0 && (
              <text x={iw / 2} y={ih / 2} textAnchor="middle" fontSize={12} fill={T.inkFaint}>
                No analysed captures state this parameter.
              </text>
            )}
          </g>
        </svg>
      )}
    </div>
  );
}

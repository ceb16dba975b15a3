/**
 * The Allan deviation on log-log axes (D3 scales, React-drawn SVG): each τ with its confidence interval
 * as an error bar, and for each run of τ read as one noise type a dashed guide of that power law's slope
 * (τ^−1 PM, τ^−1/2 white FM, τ^0 flicker FM, τ^+1/2 random-walk FM — IEEE Std 1139-2008) drawn through the
 * run's geometric middle and labelled. The table below it is the accessible reading.
 */
import { line as d3line, scaleLog } from 'd3';
import { useRef } from 'react';
import type { AllanResponse, AllanSlopeClass } from '../../../../server/contracts/stability';
import { formatPowerOfTen, logTicks } from '../../../components/plots/log-axis';
import { plotTheme as T } from '../../../components/plots/plot-theme';
import { useElementWidth } from '../../../components/plots/use-element-width';

export const SLOPE_LABEL: Record<AllanSlopeClass, string> = {
  pm: 'τ⁻¹ white/flicker PM',
  'white-fm': 'τ⁻¹ᐟ² white FM',
  'flicker-fm': 'τ⁰ flicker FM',
  'random-walk-fm': 'τ⁺¹ᐟ² random-walk FM',
};

const SLOPE_COLOR: Record<AllanSlopeClass, string> = { pm: T.spur, 'white-fm': T.beta, 'flicker-fm': T.model, 'random-walk-fm': T.second };
const M = { top: 16, right: 20, bottom: 44, left: 76 };

export function AllanPlot({ allan, height = 340 }: { allan: AllanResponse; height?: number }) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const iw = Math.max(10, width - M.left - M.right);
  const ih = height - M.top - M.bottom;
  const pts = allan.points.filter((p) => p.deviation > 0);
  const taus = pts.map((p) => p.tauS);
  const lo = Math.min(...pts.map((p) => (p.lower > 0 ? p.lower : p.deviation)));
  const hi = Math.max(...pts.map((p) => p.upper));
  const xDomain: [number, number] = [Math.min(...taus) / 1.5, Math.max(...taus) * 1.5];
  const yDomain: [number, number] = [lo / 1.6, hi * 1.6];
  const x = scaleLog().domain(xDomain).range([0, iw]);
  const y = scaleLog().domain(yDomain).range([ih, 0]).clamp(true);
  const xTicks = logTicks(xDomain, Math.max(2, Math.floor(iw / 60)), formatPowerOfTen);
  const yTicks = logTicks(yDomain, Math.max(2, Math.floor(ih / 36)), formatPowerOfTen);
  const path = d3line<{ tauS: number; deviation: number }>()
    .x((p) => x(p.tauS))
    .y((p) => y(p.deviation));

  return (
    <div ref={wrapRef} className="relative w-full" data-testid="allan-plot">
      {width > 0 && pts.length > 0 && (
        <svg width={width} height={height} aria-hidden="true" fontFamily={T.sans} className="block">
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},${M.top})`}>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.value}`} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
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
            <text x={iw / 2} y={ih + 36} textAnchor="middle" fontSize={11.5} fill={T.inkSoft}>
              averaging time τ (s)
            </text>
            <text transform={`translate(${-60},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={11.5} fill={T.inkSoft}>
              {allan.basis === 'fractional' ? 'σ_y(τ)' : 'σ_ν(τ) (Hz)'}
            </text>
            {/* the power-law guides of the slope regions, offset above the points so they do not hide them */}
            {allan.regions.map((r) => {
              const [a, b] = r.tauRangeS;
              const inRun = pts.filter((p) => p.tauS >= a && p.tauS <= b);
              if (inRun.length === 0) return null;
              const midTau = Math.sqrt(a * b);
              const midDev = Math.exp(inRun.reduce((s, p) => s + Math.log(p.deviation), 0) / inRun.length) * 1.35;
              const t0 = a === b ? a / 1.6 : a;
              const t1 = a === b ? b * 1.6 : b;
              const at = (t: number) => midDev * (t / midTau) ** r.referenceSlope;
              const color = SLOPE_COLOR[r.slopeClass];
              return (
                <g key={`${r.slopeClass}${a}`} data-testid={`slope-${r.slopeClass}`}>
                  <line x1={x(t0)} x2={x(t1)} y1={y(at(t0))} y2={y(at(t1))} stroke={color} strokeWidth={1.6} strokeDasharray="6 4" />
                  <text x={x(midTau)} y={y(at(midTau)) - 8} textAnchor="middle" fontSize={11} fill={color}>
                    {SLOPE_LABEL[r.slopeClass]}
                  </text>
                </g>
              );
            })}
            <path d={path(pts) ?? ''} fill="none" stroke={T.trace} strokeWidth={1} strokeOpacity={0.5} />
            <g stroke={T.trace} strokeWidth={1.2} data-testid="allan-points">
              {pts.map((p) => (
                <g key={p.tauS}>
                  <line x1={x(p.tauS)} x2={x(p.tauS)} y1={y(Math.max(p.lower, yDomain[0]))} y2={y(p.upper)} />
                  <line x1={x(p.tauS) - 4} x2={x(p.tauS) + 4} y1={y(Math.max(p.lower, yDomain[0]))} y2={y(Math.max(p.lower, yDomain[0]))} />
                  <line x1={x(p.tauS) - 4} x2={x(p.tauS) + 4} y1={y(p.upper)} y2={y(p.upper)} />
                  <circle cx={x(p.tauS)} cy={y(p.deviation)} r={3.2} fill={T.paper} />
                </g>
              ))}
            </g>
          </g>
        </svg>
      )}
    </div>
  );
}

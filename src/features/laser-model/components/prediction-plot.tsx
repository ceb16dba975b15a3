/**
 * The predicted linewidth beside the measured one: intrinsic linewidths of the laser's analysed captures
 * against their stated output power (log–log), and the estimator's 1/P law through its one point,
 * Δν(P) = (Δν·P)/P (METHODS 6.3: above threshold the intrinsic linewidth scales as 1/P). Drawn with D3
 * scales into React-owned SVG; the table beside it is the accessible reading.
 */
import { line as d3line, scaleLog } from 'd3';
import { useMemo, useRef } from 'react';
import { formatFrequencyTick, formatPowerOfTen, logTicks } from '../../../components/plots/log-axis';
import { plotTheme as T } from '../../../components/plots/plot-theme';
import { useElementWidth } from '../../../components/plots/use-element-width';
import { formatSI } from '../../../lib/units';

export interface MeasuredPoint {
  id: string;
  outputPowerMw: number;
  intrinsicLinewidthHz: number;
  label: string;
}

export interface PredictionPlotProps {
  measured: readonly MeasuredPoint[];
  /** Δν·P of the estimate, Hz·W (P the facet-1 power), or null before an estimate */
  predictedHzW: number | null;
  /** the estimate's own operating point */
  predictedAt: { outputPowerMw: number; linewidthHz: number } | null;
  height?: number;
}

const M = { top: 30, right: 20, bottom: 46, left: 76 };

export function PredictionPlot({ measured, predictedHzW, predictedAt, height = 320 }: PredictionPlotProps) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const iw = Math.max(10, width - M.left - M.right);
  const ih = height - M.top - M.bottom;

  const xDomain = useMemo<[number, number]>(() => {
    const xs = [...measured.map((p) => p.outputPowerMw), ...(predictedAt ? [predictedAt.outputPowerMw] : [])].filter((v) => v > 0);
    if (xs.length === 0) return [0.1, 100];
    return [Math.min(...xs) / 3, Math.max(...xs) * 3];
  }, [measured, predictedAt]);
  const yDomain = useMemo<[number, number]>(() => {
    const ys = [...measured.map((p) => p.intrinsicLinewidthHz), ...(predictedHzW ? [predictedHzW / (xDomain[0] * 1e-3), predictedHzW / (xDomain[1] * 1e-3)] : [])].filter((v) => v > 0);
    if (ys.length === 0) return [1e3, 1e8];
    return [Math.min(...ys) / 2, Math.max(...ys) * 2];
  }, [measured, predictedHzW, xDomain]);

  const x = scaleLog().domain(xDomain).range([0, iw]);
  const y = scaleLog().domain(yDomain).range([ih, 0]);
  const xTicks = logTicks(xDomain, Math.max(2, Math.floor(iw / 70)), formatPowerOfTen);
  const yTicks = logTicks(yDomain, Math.max(2, Math.floor(ih / 36)), formatFrequencyTick);
  const predicted =
    predictedHzW === null
      ? ''
      : (d3line<number>()
          .x((p) => x(p))
          .y((p) => y(predictedHzW / (p * 1e-3)))([xDomain[0], xDomain[1]]) ?? '');

  return (
    <div ref={wrapRef} className="relative w-full" data-testid="prediction-plot">
      {width > 0 && (
        <svg width={width} height={height} role="img" aria-label="Intrinsic linewidth against output power: measured captures and the estimator's 1/P line" fontFamily={T.sans} className="block">
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},12)`} fontSize={11} fill={T.inkSoft}>
            <circle cx={10} cy={0} r={3.5} fill={T.paper} stroke={T.trace} strokeWidth={1.6} />
            <text x={20} dy="0.35em">
              Measured intrinsic linewidth
            </text>
            <line x1={200} x2={222} y1={0} y2={0} stroke={T.beta} strokeWidth={1.6} strokeDasharray="6 3" />
            <text x={230} dy="0.35em">
              Estimator (Henry), ∝ 1/P
            </text>
          </g>
          <g transform={`translate(${M.left},${M.top})`}>
            <defs>
              <clipPath id="prediction-plot-clip">
                <rect width={iw} height={ih} />
              </clipPath>
            </defs>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.value}`} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            <rect width={iw} height={ih} fill="none" stroke={T.frame} />
            <g clipPath="url(#prediction-plot-clip)">
              {predicted && <path d={predicted} fill="none" stroke={T.beta} strokeWidth={1.5} strokeDasharray="6 3" />}
              {predictedAt && <circle cx={x(predictedAt.outputPowerMw)} cy={y(predictedAt.linewidthHz)} r={4.5} fill={T.beta} />}
              {measured.map((p) => (
                <circle key={p.id} cx={x(p.outputPowerMw)} cy={y(p.intrinsicLinewidthHz)} r={4} fill={T.paper} stroke={T.trace} strokeWidth={1.6}>
                  <title>{`${formatSI(p.intrinsicLinewidthHz, 'Hz').text} at ${p.outputPowerMw} mW · ${p.label}`}</title>
                </circle>
              ))}
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
              Output power P (mW)
            </text>
            <text transform={`translate(${-M.left + 16},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill={T.ink}>
              Intrinsic linewidth Δν (Hz)
            </text>
            {measured.length === 0 && (
              <text x={iw / 2} y={ih / 2} textAnchor="middle" fontSize={12} fill={T.inkFaint}>
                No analysed captures of this laser state their output power.
              </text>
            )}
          </g>
        </svg>
      )}
    </div>
  );
}

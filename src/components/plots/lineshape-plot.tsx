/**
 * A small plot of the optical lineshape computed from the whole S_ν: power (normalised to 1 at the
 * centre) against the offset from the line centre, drawn mirrored about 0, with its FWHM marked
 * at half maximum. Linear axes: the FWHM reads directly.
 */
import { line as d3line, scaleLinear } from 'd3';
import { useMemo } from 'react';
import { formatSI } from '../../lib/units';
import { linearTicks } from './log-axis';
import { plotTheme as T } from './plot-theme';

export interface LineshapePlotProps {
  /** offsets from the centre, Hz, ascending from 0 */
  offsetHz: readonly number[];
  /** power normalised to 1 at offset 0 */
  power: readonly number[];
  fwhmHz: number | null;
  width?: number;
  height?: number;
  label?: string;
}

const M = { top: 10, right: 10, bottom: 30, left: 34 };

export function LineshapePlot({ offsetHz, power, fwhmHz, width = 300, height = 150, label = 'Lineshape' }: LineshapePlotProps) {
  const iw = width - M.left - M.right;
  const ih = height - M.top - M.bottom;
  const n = Math.min(offsetHz.length, power.length);
  const span = n > 0 ? offsetHz[n - 1] : 1;
  const x = useMemo(() => scaleLinear().domain([-span, span]).range([0, iw]), [span, iw]);
  const y = useMemo(() => scaleLinear().domain([0, 1.05]).range([ih, 0]), [ih]);

  const path = useMemo(() => {
    const pts: [number, number][] = [];
    for (let i = n - 1; i > 0; i--) pts.push([-offsetHz[i], power[i]]);
    for (let i = 0; i < n; i++) pts.push([offsetHz[i], power[i]]);
    return (
      d3line<[number, number]>()
        .x((p) => x(p[0]))
        .y((p) => y(Math.max(0, p[1])))(pts) ?? ''
    );
  }, [offsetHz, power, n, x, y]);

  // one SI prefix for the whole axis (that of the span), named in the axis title
  const exp3 = span > 0 ? Math.floor(Math.log10(span) / 3) * 3 : 0;
  const tickUnit = formatSI(10 ** exp3, 'Hz').unit;
  const ticks = linearTicks([-span, span], 4, (v) => String(Number((v / 10 ** exp3).toPrecision(3))).replace('-', '\u2212'));

  return (
    <svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} role="img" aria-label={label} fontFamily={T.sans} className="block">
      <rect width={width} height={height} fill={T.paper} />
      <g transform={`translate(${M.left},${M.top})`}>
        {ticks.map((t) => (
          <line key={t.value} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={T.grid} strokeWidth={0.7} />
        ))}
        {[0, 0.5, 1].map((v) => (
          <line key={v} x1={0} x2={iw} y1={y(v)} y2={y(v)} stroke={T.grid} strokeWidth={0.7} />
        ))}
        <path d={path} fill={T.trace} fillOpacity={0.1} stroke={T.trace} strokeWidth={1.5} />
        {fwhmHz !== null && fwhmHz / 2 <= span && (
          <g>
            <line x1={x(-fwhmHz / 2)} x2={x(fwhmHz / 2)} y1={y(0.5)} y2={y(0.5)} stroke={T.beta} strokeWidth={1.4} />
            <line x1={x(-fwhmHz / 2)} x2={x(-fwhmHz / 2)} y1={y(0.5) - 4} y2={y(0.5) + 4} stroke={T.beta} strokeWidth={1.4} />
            <line x1={x(fwhmHz / 2)} x2={x(fwhmHz / 2)} y1={y(0.5) - 4} y2={y(0.5) + 4} stroke={T.beta} strokeWidth={1.4} />
          </g>
        )}
        <rect width={iw} height={ih} fill="none" stroke={T.frame} />
        <g fontFamily={T.mono} fontSize={10} fill={T.inkSoft}>
          {ticks.map((t) => (
            <text key={t.value} x={x(t.value)} y={ih + 13} textAnchor="middle">
              {t.label}
            </text>
          ))}
          {[0, 0.5, 1].map((v) => (
            <text key={v} x={-5} y={y(v)} dy="0.34em" textAnchor="end">
              {v}
            </text>
          ))}
        </g>
        <text x={iw / 2} y={ih + 27} textAnchor="middle" fontSize={10.5} fill={T.ink}>
          offset from the line centre ({tickUnit})
        </text>
      </g>
    </svg>
  );
}

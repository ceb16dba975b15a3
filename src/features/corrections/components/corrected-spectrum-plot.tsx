/**
 * The corrected S_ν on log-log axes (D3 scales, React-drawn SVG): the kept bins as a line broken at every
 * masked notch, the masked ranges as hatched grey bands (the interferometer's zeros n/τ, where the division
 * is not trusted), and the corrected white floor as a dashed level. The figures table beside it is the
 * accessible reading.
 */
import { line as d3line, scaleLog } from 'd3';
import { useId, useRef } from 'react';
import type { Correction } from '../../../../server/contracts/corrections';
import { formatFrequencyTick, formatPowerOfTen, logTicks } from '../../../components/plots/log-axis';
import { plotTheme as T } from '../../../components/plots/plot-theme';
import { useElementWidth } from '../../../components/plots/use-element-width';

const M = { top: 14, right: 18, bottom: 44, left: 70 };

export function CorrectedSpectrumPlot({ correction, height = 300 }: { correction: Correction; height?: number }) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const hatchId = `hatch-${useId().replace(/:/g, '')}`;
  const width = useElementWidth(wrapRef);
  const iw = Math.max(10, width - M.left - M.right);
  const ih = height - M.top - M.bottom;
  const f = correction.display.frequencyHz;
  const s = correction.display.frequencyNoiseHz2PerHz;
  const pts = f.map((v, i) => ({ f: v, s: s[i] })).filter((p) => p.f > 0 && p.s > 0);
  if (pts.length === 0) return null;
  const xDomain: [number, number] = [pts[0].f, pts[pts.length - 1].f];
  const ys = pts.map((p) => p.s);
  const yDomain: [number, number] = [Math.min(...ys) / 2, Math.max(...ys) * 2];
  const x = scaleLog().domain(xDomain).range([0, iw]).clamp(true);
  const y = scaleLog().domain(yDomain).range([ih, 0]).clamp(true);
  const xTicks = logTicks(xDomain, Math.max(2, Math.floor(iw / 70)), formatFrequencyTick);
  const yTicks = logTicks(yDomain, Math.max(2, Math.floor(ih / 36)), formatPowerOfTen);
  // the line is broken wherever a masked range lies between two points
  const gaps = correction.maskedRangesHz;
  const path = d3line<{ f: number; s: number }>()
    .defined((p) => p.s > 0)
    .x((p) => x(p.f))
    .y((p) => y(p.s));
  const runs: { f: number; s: number }[][] = [[]];
  for (const p of pts) {
    const last = runs[runs.length - 1];
    if (last.length > 0 && gaps.some(([a, b]) => last[last.length - 1].f < a && b < p.f)) runs.push([]);
    runs[runs.length - 1].push(p);
  }
  const floor = correction.figures.whiteFloorHz2PerHz;

  return (
    <div ref={wrapRef} className="relative w-full" data-testid="corrected-spectrum-plot">
      {width > 0 && (
        <svg width={width} height={height} aria-hidden="true" fontFamily={T.sans} className="block">
          <defs>
            <pattern id={hatchId} width={6} height={6} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
              <rect width={6} height={6} fill={T.gridMinor} />
              <line x1={0} y1={0} x2={0} y2={6} stroke={T.inkFaint} strokeWidth={1.2} />
            </pattern>
          </defs>
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},${M.top})`}>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.value}`} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {gaps
              .filter(([a, b]) => b >= xDomain[0] && a <= xDomain[1])
              .map(([a, b]) => (
                <rect
                  key={a}
                  data-testid="masked-band"
                  x={x(a)}
                  y={0}
                  width={Math.max(2, x(b) - x(a))}
                  height={ih}
                  fill={`url(#${hatchId})`}
                  fillOpacity={0.8}
                >
                  <title>{`masked ${formatFrequencyTick(a)} – ${formatFrequencyTick(b)}`}</title>
                </rect>
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
              Fourier frequency
            </text>
            <text transform={`translate(${-54},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={11.5} fill={T.inkSoft}>
              corrected S_ν (Hz²/Hz)
            </text>
            {floor !== null && floor > 0 && (
              <line x1={0} x2={iw} y1={y(floor)} y2={y(floor)} stroke={T.floorLine} strokeWidth={1.2} strokeDasharray="6 4" data-testid="corrected-floor" />
            )}
            {runs.map((r, i) => (
              <path key={i} d={path(r) ?? ''} fill="none" stroke={T.trace} strokeWidth={1.4} data-testid="corrected-trace" />
            ))}
          </g>
        </svg>
      )}
    </div>
  );
}

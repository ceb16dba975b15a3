/**
 * The measured RF beat spectrum with the fitted Lorentzian, Gaussian and Voigt lines (D3 scales,
 * React-drawn SVG): the measured points under the fitted lines. The y-axis reads in dB (10·log₁₀ of the power in mW, i.e. dBm) or in linear mW; the
 * −20 dB crossings, when found, are marked. The table beside it is the accessible reading of the figures.
 */
import { line as d3line, scaleLinear } from 'd3';
import { useMemo, useRef } from 'react';
import type { RfLineShape, RfSpectrum } from '../../../../server/contracts/rf-spectra';
import { linearTicks } from '../../../components/plots/log-axis';
import { plotTheme as T } from '../../../components/plots/plot-theme';
import { useElementWidth } from '../../../components/plots/use-element-width';

export type RfScale = 'db' | 'linear';

export const SHAPE_STYLE: Record<RfLineShape, { label: string; color: string; dash?: string }> = {
  lorentzian: { label: 'Lorentzian fit', color: T.beta },
  gaussian: { label: 'Gaussian fit', color: T.model },
  voigt: { label: 'Voigt fit', color: T.second, dash: '6 3' },
};

const M = { top: 30, right: 20, bottom: 44, left: 70 };
const SHAPES: RfLineShape[] = ['lorentzian', 'gaussian', 'voigt'];

/** the frequency unit that keeps the axis numbers short */
function frequencyUnit(spanHz: number, topHz: number): { scale: number; unit: string } {
  const ref = Math.max(spanHz, topHz / 1e3);
  if (ref >= 1e9) return { scale: 1e9, unit: 'GHz' };
  if (ref >= 1e6) return { scale: 1e6, unit: 'MHz' };
  if (ref >= 1e3) return { scale: 1e3, unit: 'kHz' };
  return { scale: 1, unit: 'Hz' };
}

export function RfFitPlot({ spectrum, scale, height = 380 }: { spectrum: RfSpectrum; scale: RfScale; height?: number }) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const iw = Math.max(10, width - M.left - M.right);
  const ih = height - M.top - M.bottom;
  const { trace, result } = spectrum;
  const f = trace.frequencyHz;

  const toY = useMemo(() => (scale === 'db' ? (p: number) => 10 * Math.log10(Math.max(p, 1e-300)) : (p: number) => p), [scale]);
  const yDomain = useMemo<[number, number]>(() => {
    const ys = trace.powerMw.map(toY).filter(Number.isFinite);
    let lo = Math.min(...ys);
    let hi = Math.max(...ys);
    if (scale === 'linear') lo = Math.min(0, lo);
    const pad = (hi - lo || 1) * 0.06;
    hi += pad;
    if (scale === 'db') lo -= pad;
    return [lo, hi];
  }, [trace.powerMw, toY, scale]);

  const fLo = f[0];
  const fHi = f[f.length - 1];
  const unit = frequencyUnit(fHi - fLo, fHi);
  const x = scaleLinear().domain([fLo, fHi]).range([0, iw]);
  const y = scaleLinear().domain(yDomain).range([ih, 0]).clamp(true);
  const xTicks = linearTicks([fLo / unit.scale, fHi / unit.scale], Math.max(2, Math.floor(iw / 90)), (v) => String(Number(v.toPrecision(8))));
  const yTicks = linearTicks(yDomain, Math.max(2, Math.floor(ih / 40)), (v) => (scale === 'db' ? String(v).replace('-', '−') : v.toExponential(1).replace('-', '−')));

  const path = (values: readonly number[]) =>
    d3line<number>()
      .x((_v, i) => x(f[i]))
      .y((v) => y(toY(v)))(values as number[]) ?? '';

  const twenty = result.twentyDb;
  const stride = Math.max(1, Math.ceil(f.length / 2000));
  const peak = Math.max(...trace.powerMw);

  return (
    <div ref={wrapRef} className="relative w-full" data-testid="rf-fit-plot">
      {width > 0 && (
        <svg width={width} height={height} aria-hidden="true" fontFamily={T.sans} className="block">
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},14)`} fontSize={11} fill={T.inkSoft}>
            <g>
              <circle cx={9} cy={0} r={2.2} fill={T.trace} />
              <text x={24} dy="0.35em">
                measured
              </text>
            </g>
            {SHAPES.filter((s) => trace.models[s]).map((s, i) => (
              <g key={s} transform={`translate(${100 + i * 130},0)`} data-testid={`legend-${s}`}>
                <line x1={0} x2={18} y1={0} y2={0} stroke={SHAPE_STYLE[s].color} strokeWidth={1.8} strokeDasharray={SHAPE_STYLE[s].dash} />
                <text x={24} dy="0.35em">
                  {SHAPE_STYLE[s].label}
                </text>
              </g>
            ))}
          </g>
          <g transform={`translate(${M.left},${M.top})`}>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={T.grid} strokeWidth={0.7} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.value}`} x1={x(t.value * unit.scale)} x2={x(t.value * unit.scale)} y1={0} y2={ih} stroke={T.gridMinor} strokeWidth={0.6} />
            ))}
            <rect width={iw} height={ih} fill="none" stroke={T.frame} />
            <g fontFamily={T.mono} fontSize={10.5} fill={T.inkSoft}>
              {yTicks.map((t) => (
                <text key={`ty${t.value}`} x={-7} y={y(t.value)} dy="0.34em" textAnchor="end">
                  {t.label}
                </text>
              ))}
              {xTicks.map((t) => (
                <text key={`tx${t.value}`} x={x(t.value * unit.scale)} y={ih + 16} textAnchor="middle">
                  {t.label}
                </text>
              ))}
            </g>
            <text x={iw / 2} y={ih + 36} textAnchor="middle" fontSize={11.5} fill={T.inkSoft}>
              frequency ({unit.unit})
            </text>
            <text transform={`translate(${-54},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={11.5} fill={T.inkSoft}>
              {scale === 'db' ? 'power (dBm)' : 'power (mW)'}
            </text>
            {twenty && (
              <g data-testid="twenty-db-marker">
                <line
                  x1={x(twenty.crossingsHz[0])}
                  x2={x(twenty.crossingsHz[1])}
                  y1={y(toY(peak / 100))}
                  y2={y(toY(peak / 100))}
                  stroke={T.spur}
                  strokeWidth={1.4}
                />
                {twenty.crossingsHz.map((c) => (
                  <line key={c} x1={x(c)} x2={x(c)} y1={y(toY(peak / 100)) - 5} y2={y(toY(peak / 100)) + 5} stroke={T.spur} strokeWidth={1.4} />
                ))}
                <text x={x(twenty.crossingsHz[1]) + 6} y={y(toY(peak / 100))} dy="0.34em" fontSize={10.5} fill={T.inkSoft}>
                  −20 dB
                </text>
              </g>
            )}
            {/* the measured points under the fitted lines (at most about 2000 drawn) */}
            <g fill={T.trace} data-testid="trace-measured" data-points={trace.powerMw.length}>
              {trace.powerMw.map((p, i) =>
                i % stride === 0 ? <circle key={i} cx={x(f[i])} cy={y(toY(p))} r={1.5} fillOpacity={0.55} /> : null,
              )}
            </g>
            {SHAPES.map((s) => {
              const m = trace.models[s];
              return m ? (
                <path
                  key={s}
                  d={path(m)}
                  fill="none"
                  stroke={SHAPE_STYLE[s].color}
                  strokeWidth={1.8}
                  strokeDasharray={SHAPE_STYLE[s].dash}
                  data-testid={`trace-${s}`}
                />
              ) : null;
            })}
          </g>
        </svg>
      )}
    </div>
  );
}

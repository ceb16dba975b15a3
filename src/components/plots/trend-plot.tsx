/**
 * A small trend plot: linewidths (log y, Hz) against the date of the capture, one or two series
 * (intrinsic and β-line integrated). Points can be chosen with a click or, focused, with Enter;
 * the page beside it lists the same points as a table, which is the accessible reading of it.
 */
import { line as d3line, scaleLog, scaleTime } from 'd3';
import { useMemo, useRef, useState } from 'react';
import { formatIsoDate, formatIsoDateTime } from '../../lib/dates';
import { formatSI } from '../../lib/units';
import { formatFrequencyTick, logTicks } from './log-axis';
import { plotTheme as T } from './plot-theme';
import { useElementWidth } from './use-element-width';

export interface TrendPoint {
  id: string;
  date: Date;
  /** values per series key; null where a series has no value for this point */
  values: Record<string, number | null>;
}

export interface TrendSeries {
  key: string;
  label: string;
  color: string;
  dashed?: boolean;
}

export interface TrendPlotProps {
  points: readonly TrendPoint[];
  series: readonly TrendSeries[];
  label: string;
  height?: number;
  onSelect?: (id: string) => void;
  selectedId?: string | null;
}

const M = { top: 28, right: 18, bottom: 34, left: 74 };

export function TrendPlot({ points, series, label, height = 240, onSelect, selectedId = null }: TrendPlotProps) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const iw = Math.max(10, width - M.left - M.right);
  const ih = height - M.top - M.bottom;
  const [hover, setHover] = useState<{ id: string; key: string } | null>(null);

  const sorted = useMemo(() => [...points].sort((a, b) => a.date.getTime() - b.date.getTime()), [points]);
  const values = sorted.flatMap((p) => series.map((s) => p.values[s.key]).filter((v): v is number => v !== null && v > 0));

  const xDomain = useMemo<[Date, Date]>(() => {
    if (sorted.length === 0) return [new Date(Date.now() - 864e5), new Date()];
    const a = sorted[0].date.getTime();
    const b = sorted[sorted.length - 1].date.getTime();
    const pad = Math.max((b - a) * 0.05, 12 * 3600e3);
    return [new Date(a - pad), new Date(b + pad)];
  }, [sorted]);
  const yDomain = useMemo<[number, number]>(() => {
    if (values.length === 0) return [1, 1e6];
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    return [lo / 10 ** 0.3, hi * 10 ** 0.3];
  }, [values]);

  const x = scaleTime().domain(xDomain).range([0, iw]);
  const y = scaleLog().domain(yDomain).range([ih, 0]);
  // dates on the axis; within a few days the hour matters too; a label repeated by the next tick is dropped
  const spanMs = xDomain[1].getTime() - xDomain[0].getTime();
  const short = spanMs < 4 * 864e5;
  const tickLabel = (t: Date) => (short ? formatIsoDateTime(t).slice(5) : formatIsoDate(t));
  const xTicks = x
    .ticks(Math.max(2, Math.floor(iw / (short ? 120 : 110))))
    .filter((t, i, all) => i === 0 || tickLabel(t) !== tickLabel(all[i - 1]));
  const yTicks = logTicks(yDomain, Math.max(2, Math.floor(ih / 36)), formatFrequencyTick);

  const hovered = hover ? sorted.find((p) => p.id === hover.id) : undefined;
  const hoveredSeries = hover ? series.find((s) => s.key === hover.key) : undefined;

  return (
    <div ref={wrapRef} className="relative w-full">
      {width > 0 && (
        <svg width={width} height={height} role="img" aria-label={label} fontFamily={T.sans} className="block">
          <rect width={width} height={height} fill={T.paper} />
          <g transform={`translate(${M.left},12)`} fontSize={11} fill={T.inkSoft}>
            {series.map((s, i) => (
              <g key={s.key} transform={`translate(${i * 190},0)`}>
                <line x1={0} x2={20} y1={0} y2={0} stroke={s.color} strokeWidth={1.5} strokeDasharray={s.dashed ? '5 3' : undefined} />
                <circle cx={10} cy={0} r={3} fill={s.color} />
                <text x={28} dy="0.35em">
                  {s.label}
                </text>
              </g>
            ))}
          </g>
          <g transform={`translate(${M.left},${M.top})`}>
            {yTicks.map((t) => (
              <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
            ))}
            {xTicks.map((t) => (
              <line key={`gx${t.getTime()}`} x1={x(t)} x2={x(t)} y1={0} y2={ih} stroke={T.gridMinor} strokeWidth={0.6} />
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
              {xTicks.map((t) => (
                <text key={`tx${t.getTime()}`} x={x(t)} y={ih + 16} textAnchor="middle">
                  {tickLabel(t)}
                </text>
              ))}
            </g>
            {series.map((s) => {
              const pts = sorted.filter((p) => (p.values[s.key] ?? 0) > 0);
              const d =
                d3line<TrendPoint>()
                  .x((p) => x(p.date))
                  .y((p) => y(p.values[s.key] as number))(pts) ?? '';
              return (
                <g key={s.key}>
                  <path d={d} fill="none" stroke={s.color} strokeWidth={1.3} strokeOpacity={0.7} strokeDasharray={s.dashed ? '5 3' : undefined} />
                  {pts.map((p) => {
                    const v = p.values[s.key] as number;
                    const selected = p.id === selectedId;
                    return (
                      <circle
                        key={p.id}
                        cx={x(p.date)}
                        cy={y(v)}
                        r={selected ? 5.5 : 4}
                        fill={selected ? s.color : T.paper}
                        stroke={s.color}
                        strokeWidth={1.6}
                        style={{ cursor: onSelect ? 'pointer' : undefined }}
                        onPointerEnter={() => setHover({ id: p.id, key: s.key })}
                        onPointerLeave={() => setHover(null)}
                        onClick={() => onSelect?.(p.id)}
                      >
                        <title>{`${s.label}: ${formatSI(v, 'Hz').text} · ${formatIsoDate(p.date)}`}</title>
                      </circle>
                    );
                  })}
                </g>
              );
            })}
            {sorted.length === 0 && (
              <text x={iw / 2} y={ih / 2} textAnchor="middle" fontSize={12} fill={T.inkFaint}>
                No analysed spectra yet.
              </text>
            )}
          </g>
        </svg>
      )}
      {hovered && hoveredSeries && (
        <div className="pointer-events-none absolute top-1 right-4 rounded-[3px] border border-rule bg-paper-card px-2 py-1 font-mono text-xs text-ink">
          {formatIsoDate(hovered.date)} · {hoveredSeries.label} {formatSI(hovered.values[hoveredSeries.key] ?? Number.NaN, 'Hz').text}
        </div>
      )}
    </div>
  );
}

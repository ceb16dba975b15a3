/**
 * The spectrum plot: one frequency-noise PSD on log-log axes (log-x, linear dB for L(f)), drawn with
 * D3 scales and shapes into React-owned SVG.
 *
 * What it shows: the measured trace; the white-floor band shaded with the floor level across it
 * (its edges can be dragged, or moved from the keyboard as sliders); the β-separation line
 * β(f) = 8 ln2 · f/π² dashed, and the area where S_ν stands above it (from 1/T₀) lightly filled; the
 * noise model a₀ + a₋₁/f + a₋₂/f²; spurs as small marks above the trace.
 * How to use it: hover (or the arrow keys) for a read-out; drag a rectangle to zoom (a flat drag zooms
 * the frequency axis only); double-click, or 0, to go back to the whole spectrum; + and − zoom about
 * the read-out.
 * Everything drawn carries its colours as attributes so `serializePlotSvg` can export it as is;
 * interactive layers are marked `data-export="omit"`.
 */
import { line as d3line, scaleLinear, scaleLog } from 'd3';
import {
  useCallback,
  useId,
  useMemo,
  useRef,
  useState,
  type KeyboardEvent,
  type MouseEvent as ReactMouseEvent,
  type PointerEvent as ReactPointerEvent,
  type Ref,
} from 'react';
import { formatFixed, formatScientific, formatSI } from '../../lib/units';
import { cn } from '../ui/cn';
import { formatFrequencyTick, formatPowerOfTen, linearTicks, logTicks, type Tick } from './log-axis';
import { plotTheme as T } from './plot-theme';
import { HtmlSymbol, SvgSymbol } from './plot-text';
import {
  betaSeparation,
  groupSpurs,
  nearestIndexLog,
  noiseModelCurve,
  regionsAboveBeta,
  seriesInView,
  toView,
  VIEW_INFO,
  type Series,
  type SpectrumView,
  type SpurGroup,
} from './spectrum-math';
import { useElementWidth } from './use-element-width';

export interface PlotSpur {
  frequencyHz: number;
  heightDb: number;
}

export interface PlotNoiseModel {
  whiteHz2PerHz: number;
  flickerHz2: number;
  randomWalkHz3: number;
  bandHz: readonly [number, number];
}

/** A note pinned by a person to a frequency (hiHz null) or a band [loHz, hiHz] of the spectrum. */
export interface PlotMark {
  id: string;
  loHz: number;
  hiHz: number | null;
  /** a short label drawn beside it (its number and text) */
  label: string;
  /** its colour (Okabe–Ito, by kind) */
  color: string;
}

export interface SpectrumPlotProps {
  /** the display series: frequencies (Hz, ascending) and S_ν (Hz²/Hz) */
  series: Series;
  view: SpectrumView;
  /** the white-floor band [lo, hi] Hz */
  band?: readonly [number, number] | null;
  /** makes the band movable; called while its edges are dragged */
  onBandChange?: (band: [number, number]) => void;
  /** the white-floor level drawn across the band, Hz²/Hz */
  floorHz2PerHz?: number | null;
  /** the observation time T₀: the area above β is filled from 1/T₀ */
  observationTimeS?: number | null;
  showBeta?: boolean;
  model?: PlotNoiseModel | null;
  spurs?: readonly PlotSpur[];
  /** people's marks: a thin vertical line or a shaded band, with a small label */
  marks?: readonly PlotMark[];
  /** accessible name of the figure */
  label: string;
  height?: number;
  svgRef?: Ref<SVGSVGElement>;
  className?: string;
}

const MARGIN = { top: 34, right: 20, bottom: 46, left: 76 };
const TICK_FONT = 11;
const TITLE_FONT = 12;

type Domain = readonly [number, number];
interface Zoom {
  x: Domain | null;
  y: Domain | null;
  /** the view the y domain belongs to (its units) */
  view: SpectrumView;
}

type Drag =
  | { kind: 'zoom'; x0: number; y0: number; x1: number; y1: number }
  | { kind: 'band-lo' | 'band-hi' | 'band-move'; f0: number; band0: readonly [number, number] };

function clamp(v: number, lo: number, hi: number) {
  return Math.min(hi, Math.max(lo, v));
}

function formatValue(view: SpectrumView, v: number): string {
  const unit = VIEW_INFO[view].unit;
  if (view === 'dbc') return formatFixed(v, unit, 1).text;
  return formatScientific(v, unit, 3).text;
}

export function SpectrumPlot({
  series,
  view,
  band = null,
  onBandChange,
  floorHz2PerHz = null,
  observationTimeS = null,
  showBeta = true,
  model = null,
  spurs = [],
  marks = [],
  label,
  height: heightProp,
  svgRef,
  className,
}: SpectrumPlotProps) {
  const wrapRef = useRef<HTMLDivElement>(null);
  const width = useElementWidth(wrapRef);
  const height = heightProp ?? Math.round(clamp(width * 0.52, 340, 520));
  const iw = Math.max(10, width - MARGIN.left - MARGIN.right);
  const info = VIEW_INFO[view];

  // the legend, wrapped onto as many rows as the width needs; the plot starts below it
  const tInvLegend = observationTimeS && observationTimeS > 0;
  const legend: { key: string; label: string; swatch: 'line' | 'dash' | 'fill' | 'band' | 'model' | 'spur' | 'mark' }[] = [
    { key: 'trace', label: `${info.symbol} measured`, swatch: 'line' },
  ];
  if (showBeta) {
    legend.push({ key: 'beta', label: 'β-separation line', swatch: 'dash' });
    legend.push({ key: 'above', label: tInvLegend ? 'above β, from 1/T₀' : 'above β', swatch: 'fill' });
  }
  if (band) legend.push({ key: 'band', label: 'white-floor band', swatch: 'band' });
  if (model) legend.push({ key: 'model', label: 'noise model', swatch: 'model' });
  if (spurs.length) legend.push({ key: 'spur', label: 'spur', swatch: 'spur' });
  if (marks.length) legend.push({ key: 'mark', label: 'mark', swatch: 'mark' });
  const legendItems = (() => {
    const room = Math.max(120, width - MARGIN.left - MARGIN.right);
    let cx = 0;
    let row = 0;
    return legend.map((item) => {
      const w = 30 + item.label.length * 6.3;
      if (cx > 0 && cx + w > room) {
        row += 1;
        cx = 0;
      }
      const at = cx;
      cx += w + 18;
      return { ...item, at, row };
    });
  })();
  const top = MARGIN.top + (legendItems.length ? legendItems[legendItems.length - 1].row : 0) * 16;
  const ih = Math.max(10, height - top - MARGIN.bottom);
  const uid = useId().replace(/[^a-zA-Z0-9]/g, '');
  const clipId = `plot-clip-${uid}`;
  const helpId = `plot-help-${uid}`;
  const summaryId = `plot-summary-${uid}`;

  const [zoom, setZoom] = useState<Zoom>({ x: null, y: null, view });
  const [hover, setHover] = useState<number | null>(null);
  const [drag, setDrag] = useState<Drag | null>(null);

  const pts = useMemo(() => seriesInView(series, view), [series, view]);
  const n = pts.f.length;

  const fullX = useMemo<Domain>(() => (n >= 2 ? [pts.f[0], pts.f[n - 1]] : [1, 10]), [pts, n]);
  const fullY = useMemo<Domain>(() => {
    if (n < 1) return info.logY ? [1, 10] : [-100, 0];
    let lo = Infinity;
    let hi = -Infinity;
    for (const v of pts.v) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    if (info.logY) {
      // a quarter decade of air above and below the trace
      const pad = 10 ** 0.25;
      return lo === hi ? [lo / 10, hi * 10] : [lo / pad, hi * pad];
    }
    const pad = Math.max(3, (hi - lo) * 0.06);
    return [lo - pad, hi + pad];
  }, [pts, n, info.logY]);

  const xDomain = zoom.x ?? fullX;
  const yDomain = zoom.view === view && zoom.y ? zoom.y : fullY;
  const zoomed = zoom.x !== null || (zoom.view === view && zoom.y !== null);

  const x = useMemo(() => scaleLog().domain(xDomain).range([0, iw]), [xDomain, iw]);
  const y = useMemo(
    () => (info.logY ? scaleLog().domain(yDomain).range([ih, 0]) : scaleLinear().domain(yDomain).range([ih, 0])),
    [yDomain, ih, info.logY],
  );

  const path = useMemo(() => {
    const gen = d3line<number>()
      .x((i) => x(pts.f[i]))
      .y((i) => y(pts.v[i]));
    return gen(Array.from({ length: n }, (_, i) => i)) ?? '';
  }, [pts, n, x, y]);

  const xTicks = useMemo(() => logTicks(xDomain, Math.max(3, Math.floor(iw / 90)), formatFrequencyTick), [xDomain, iw]);
  const yTicks = useMemo<Tick[]>(
    () =>
      info.logY
        ? logTicks(yDomain, Math.max(3, Math.floor(ih / 34)), formatPowerOfTen)
        : linearTicks(yDomain, Math.max(3, Math.floor(ih / 48)), (v) => formatFixed(v, '', 0).number),
    [yDomain, ih, info.logY],
  );

  // β-separation line over the whole frequency range (clipped to the plot)
  const betaPath = useMemo(() => {
    if (!showBeta || n < 2) return '';
    const [lo, hi] = fullX;
    const grid = Array.from({ length: 64 }, (_, i) => lo * (hi / lo) ** (i / 63));
    return (
      d3line<number>()
        .x((f) => x(f))
        .y((f) => y(toView(view, f, betaSeparation(f))))(grid) ?? ''
    );
  }, [showBeta, n, fullX, x, y, view]);

  const abovePaths = useMemo(() => {
    if (!showBeta || n < 2) return [];
    const from = observationTimeS && observationTimeS > 0 ? 1 / observationTimeS : 0;
    return regionsAboveBeta(series, from).map((r) => {
      const top = r.frequencyHz.map((f, i) => [x(f), y(toView(view, f, r.sNu[i]))] as const);
      const bottom = r.frequencyHz.map((f, i) => [x(f), y(toView(view, f, r.beta[i]))] as const).reverse();
      return `M${[...top, ...bottom].map(([a, b]) => `${a.toFixed(1)},${b.toFixed(1)}`).join('L')}Z`;
    });
  }, [showBeta, n, observationTimeS, series, x, y, view]);

  const modelPath = useMemo(() => {
    if (!model) return '';
    const lo = Math.max(model.bandHz[0], fullX[0]);
    const hi = Math.min(model.bandHz[1], fullX[1]);
    const c = noiseModelCurve(model, [lo, hi], 160);
    return (
      d3line<number>()
        .defined((i) => Number.isFinite(toView(view, c.frequencyHz[i], c.sNu[i])) && c.sNu[i] > 0)
        .x((i) => x(c.frequencyHz[i]))
        .y((i) => y(toView(view, c.frequencyHz[i], c.sNu[i])))(c.frequencyHz.map((_, i) => i)) ?? ''
    );
  }, [model, fullX, x, y, view]);

  const floorPath = useMemo(() => {
    if (!band || !(floorHz2PerHz && floorHz2PerHz > 0)) return '';
    const [lo, hi] = band;
    const grid = Array.from({ length: 24 }, (_, i) => lo * (hi / lo) ** (i / 23));
    return (
      d3line<number>()
        .x((f) => x(f))
        .y((f) => y(toView(view, f, floorHz2PerHz)))(grid) ?? ''
    );
  }, [band, floorHz2PerHz, x, y, view]);

  // one mark per group of neighbouring lines (a bump reported as many spurs), at the highest one
  const spurMarks = useMemo(
    () =>
      groupSpurs(spurs)
        .map((s) => {
          const i = nearestIndexLog(pts.f, s.frequencyHz);
          if (i < 0) return null;
          return { ...s, px: x(s.frequencyHz), py: y(pts.v[i]) };
        })
        .filter((s): s is SpurGroup & { px: number; py: number } => s !== null && s.px >= 0 && s.px <= iw),
    [spurs, pts, x, y, iw],
  );

  // marks in view, with labels on three staggered rows so neighbours do not overprint
  const markShapes = useMemo(
    () =>
      marks
        .map((m, i) => {
          const lo = x(m.loHz);
          const hi = m.hiHz === null ? lo : x(m.hiHz);
          return { ...m, lo, hi, row: i % 3 };
        })
        .filter((m) => m.hi >= 0 && m.lo <= iw),
    [marks, x, iw],
  );

  const tInv = observationTimeS && observationTimeS > 0 ? 1 / observationTimeS : null;

  // ---- pointer and keyboard ------------------------------------------------------------------
  const plotPoint = useCallback((e: ReactPointerEvent | ReactMouseEvent) => {
    const svg = wrapRef.current?.querySelector('svg');
    const rect = svg?.getBoundingClientRect();
    if (!rect) return { px: 0, py: 0 };
    return { px: clamp(e.clientX - rect.left - MARGIN.left, 0, iw), py: clamp(e.clientY - rect.top - top, 0, ih) };
  }, [iw, ih, top]);

  const setBand = useCallback(
    (lo: number, hi: number) => {
      if (!onBandChange) return;
      const [minF, maxF] = fullX;
      const a = clamp(Math.min(lo, hi), minF, maxF);
      const b = clamp(Math.max(lo, hi), minF, maxF);
      // keep at least a twentieth of a decade between the edges
      if (b / a < 10 ** 0.05) return;
      onBandChange([a, b]);
    },
    [onBandChange, fullX],
  );

  const onOverlayDown = (e: ReactPointerEvent<SVGRectElement>) => {
    if (e.button !== 0) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    const { px, py } = plotPoint(e);
    setDrag({ kind: 'zoom', x0: px, y0: py, x1: px, y1: py });
  };

  const onMove = (e: ReactPointerEvent) => {
    const { px, py } = plotPoint(e);
    if (!drag || drag.kind === 'zoom') setHover(n ? nearestIndexLog(pts.f, x.invert(px)) : null);
    if (!drag) return;
    if (drag.kind === 'zoom') {
      setDrag({ ...drag, x1: px, y1: py });
      return;
    }
    const f = x.invert(px);
    const [lo, hi] = drag.band0;
    if (drag.kind === 'band-lo') setBand(Math.min(f, hi / 10 ** 0.05), hi);
    else if (drag.kind === 'band-hi') setBand(lo, Math.max(f, lo * 10 ** 0.05));
    else {
      let k = f / drag.f0;
      // moving the whole band keeps its width in decades and stops at the ends of the spectrum
      k = clamp(k, fullX[0] / lo, fullX[1] / hi);
      setBand(lo * k, hi * k);
    }
  };

  const onUp = () => {
    if (drag?.kind === 'zoom') {
      const dx = Math.abs(drag.x1 - drag.x0);
      const dy = Math.abs(drag.y1 - drag.y0);
      if (dx > 6 || dy > 6) {
        const nx: Domain | null = dx > 6 ? [x.invert(Math.min(drag.x0, drag.x1)), x.invert(Math.max(drag.x0, drag.x1))] : null;
        const ny: Domain | null = dy > 6 && dx > 6 && dy > 12 ? [y.invert(Math.max(drag.y0, drag.y1)), y.invert(Math.min(drag.y0, drag.y1))] : null;
        setZoom({ x: nx ?? xDomain, y: ny ?? (zoom.view === view ? zoom.y : null), view });
      }
    }
    setDrag(null);
  };

  const startBandDrag = (kind: 'band-lo' | 'band-hi' | 'band-move') => (e: ReactPointerEvent<SVGElement>) => {
    if (!band || e.button !== 0) return;
    e.stopPropagation();
    e.currentTarget.setPointerCapture(e.pointerId);
    const { px } = plotPoint(e);
    setDrag({ kind, f0: x.invert(px), band0: band });
  };

  const resetZoom = () => setZoom({ x: null, y: null, view });

  const zoomAbout = (factor: number) => {
    const [lo, hi] = xDomain;
    const centre = hover !== null && pts.f[hover] ? pts.f[hover] : Math.sqrt(lo * hi);
    const nlo = clamp(centre * (lo / centre) ** factor, fullX[0], fullX[1]);
    const nhi = clamp(centre * (hi / centre) ** factor, fullX[0], fullX[1]);
    if (nhi / nlo < 1.5) return;
    setZoom({ x: [nlo, nhi], y: zoom.view === view ? zoom.y : null, view });
  };

  const onPlotKey = (e: KeyboardEvent<HTMLDivElement>) => {
    if (e.target !== e.currentTarget) return;
    if (!n) return;
    const step = e.shiftKey ? 10 : 1;
    if (e.key === 'ArrowRight' || e.key === 'ArrowLeft') {
      const dir = e.key === 'ArrowRight' ? step : -step;
      const start = hover ?? nearestIndexLog(pts.f, Math.sqrt(xDomain[0] * xDomain[1]));
      setHover(clamp(start + dir, 0, n - 1));
    } else if (e.key === 'Home') setHover(0);
    else if (e.key === 'End') setHover(n - 1);
    else if (e.key === '+' || e.key === '=') zoomAbout(0.5);
    else if (e.key === '-' || e.key === '_') zoomAbout(2);
    else if (e.key === '0' || e.key === 'Escape') {
      resetZoom();
      if (e.key === 'Escape') setHover(null);
    } else return;
    e.preventDefault();
  };

  const onHandleKey = (edge: 'lo' | 'hi') => (e: KeyboardEvent<SVGGElement>) => {
    if (!band) return;
    const k = 10 ** (e.shiftKey ? 0.1 : 0.02);
    const [lo, hi] = band;
    let handled = true;
    if (e.key === 'ArrowRight' || e.key === 'ArrowUp') {
      if (edge === 'lo') setBand(Math.min(lo * k, hi / 10 ** 0.05), hi);
      else setBand(lo, hi * k);
    } else if (e.key === 'ArrowLeft' || e.key === 'ArrowDown') {
      if (edge === 'lo') setBand(lo / k, hi);
      else setBand(lo, Math.max(hi / k, lo * 10 ** 0.05));
    } else handled = false;
    if (handled) {
      e.preventDefault();
      e.stopPropagation();
    }
  };

  // ---- drawing -------------------------------------------------------------------------------
  const hoverPoint = hover !== null && hover < n ? { f: pts.f[hover], v: pts.v[hover] } : null;
  const hoverPx = hoverPoint ? { x: x(hoverPoint.f), y: y(hoverPoint.v) } : null;
  const bandPx = band ? { lo: x(band[0]), hi: x(band[1]) } : null;
  const movable = Boolean(onBandChange && band);

  const zoomRect =
    drag?.kind === 'zoom' && (Math.abs(drag.x1 - drag.x0) > 6 || Math.abs(drag.y1 - drag.y0) > 6)
      ? Math.abs(drag.y1 - drag.y0) > 12 && Math.abs(drag.x1 - drag.x0) > 6
        ? { x: Math.min(drag.x0, drag.x1), y: Math.min(drag.y0, drag.y1), w: Math.abs(drag.x1 - drag.x0), h: Math.abs(drag.y1 - drag.y0) }
        : { x: Math.min(drag.x0, drag.x1), y: 0, w: Math.abs(drag.x1 - drag.x0), h: ih }
      : null;

  return (
    <div className={cn('relative', className)}>
      <div
        ref={wrapRef}
        role="group"
        aria-label={label}
        aria-describedby={`${summaryId} ${helpId}`}
        tabIndex={0}
        onKeyDown={onPlotKey}
        className="relative w-full rounded-[3px] focus-visible:outline-offset-4"
        data-testid="spectrum-plot"
      >
        {width > 0 && (
          <svg
            ref={svgRef}
            width={width}
            height={height}
            viewBox={`0 0 ${width} ${height}`}
            xmlns="http://www.w3.org/2000/svg"
            fontFamily={T.sans}
            className="block touch-none select-none"
            onPointerMove={onMove}
            onPointerUp={onUp}
            onPointerCancel={() => setDrag(null)}
            onPointerLeave={() => {
              if (!drag) setHover(null);
            }}
          >
            <defs>
              <clipPath id={clipId}>
                <rect x={0} y={0} width={iw} height={ih} />
              </clipPath>
            </defs>
            <rect x={0} y={0} width={width} height={height} fill={T.paper} />

            {/* legend */}
            <g transform={`translate(${MARGIN.left},${14})`} fontSize={TICK_FONT} fill={T.inkSoft} aria-hidden="true">
              {legendItems.map((item) => (
                <g key={item.key} transform={`translate(${item.at},${item.row * 16})`}>
                  {item.swatch === 'line' && <line x1={0} x2={22} y1={0} y2={0} stroke={T.trace} strokeWidth={1.8} />}
                  {item.swatch === 'dash' && <line x1={0} x2={22} y1={0} y2={0} stroke={T.beta} strokeWidth={1.4} strokeDasharray="5 3" />}
                  {item.swatch === 'fill' && <rect x={0} y={-5} width={22} height={10} fill={T.beta} fillOpacity={0.14} stroke={T.beta} strokeOpacity={0.35} strokeWidth={0.6} />}
                  {item.swatch === 'band' && <rect x={0} y={-5} width={22} height={10} fill={T.floor} fillOpacity={0.22} stroke={T.floor} strokeWidth={0.8} />}
                  {item.swatch === 'model' && <line x1={0} x2={22} y1={0} y2={0} stroke={T.model} strokeWidth={1.5} strokeDasharray="1 0" />}
                  {item.swatch === 'spur' && <path d="M6,-4 L16,-4 L11,4 Z" fill={T.spur} />}
                  {item.swatch === 'mark' && <line x1={11} x2={11} y1={-6} y2={6} stroke={T.ink} strokeWidth={1} />}
                  <text x={30} y={0} dy="0.35em">
                    <SvgSymbol text={item.label} fontSize={TICK_FONT} />
                  </text>
                </g>
              ))}
            </g>

            <g transform={`translate(${MARGIN.left},${top})`}>
              {/* the drawing is described in words beside it (summaryId); only the band's sliders are for assistive technology */}
              <g aria-hidden="true">
                {/* grid */}
                <g data-layer="grid">
                  {xTicks.map((t) => (
                    <line key={`gx${t.value}`} x1={x(t.value)} x2={x(t.value)} y1={0} y2={ih} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
                  ))}
                  {yTicks.map((t) => (
                    <line key={`gy${t.value}`} x1={0} x2={iw} y1={y(t.value)} y2={y(t.value)} stroke={t.major ? T.grid : T.gridMinor} strokeWidth={t.major ? 0.9 : 0.6} />
                  ))}
                </g>

                <g clipPath={`url(#${clipId})`}>
                  {/* white-floor band */}
                  {bandPx && (
                    <rect x={bandPx.lo} y={0} width={Math.max(0, bandPx.hi - bandPx.lo)} height={ih} fill={T.floor} fillOpacity={0.17} data-layer="band" />
                  )}
                  {/* area above β */}
                  {abovePaths.map((d, i) => (
                    <path key={`a${i}`} d={d} fill={T.beta} fillOpacity={0.13} stroke="none" data-layer="above-beta" />
                  ))}
                  {/* 1/T₀ */}
                  {tInv && tInv >= xDomain[0] && tInv <= xDomain[1] && (
                    <line x1={x(tInv)} x2={x(tInv)} y1={0} y2={ih} stroke={T.inkFaint} strokeWidth={0.8} strokeDasharray="2 3" />
                  )}
                  {betaPath && <path d={betaPath} fill="none" stroke={T.beta} strokeWidth={1.4} strokeDasharray="6 4" data-layer="beta" />}
                  {modelPath && <path d={modelPath} fill="none" stroke={T.model} strokeWidth={1.5} strokeOpacity={0.95} data-layer="model" />}
                  <path d={path} fill="none" stroke={T.trace} strokeWidth={1.6} strokeLinejoin="round" data-layer="trace" />
                  {floorPath && <path d={floorPath} fill="none" stroke={T.floorLine} strokeWidth={2} strokeDasharray="1 0" strokeOpacity={0.9} data-layer="floor" />}
                  {spurMarks.map((s) => (
                    <path
                      key={`s${s.frequencyHz}`}
                      d={`M${s.px - 4.5},${s.py - 13} L${s.px + 4.5},${s.py - 13} L${s.px},${s.py - 5} Z`}
                      fill={T.spur}
                      stroke={T.paper}
                      strokeWidth={0.6}
                      data-layer="spur"
                    >
                      <title>
                        {s.count > 1
                          ? `${s.count} spurs from ${formatSI(s.loHz, 'Hz').text} to ${formatSI(s.hiHz, 'Hz').text}, up to ${formatFixed(s.heightDb, 'dB', 1).text} above the noise model`
                          : `spur at ${formatSI(s.frequencyHz, 'Hz').text}, ${formatFixed(s.heightDb, 'dB', 1).text} above the noise model`}
                      </title>
                    </path>
                  ))}
                  {markShapes.map((m) => (
                    <g key={`m${m.id}`} data-layer="mark" data-mark-id={m.id}>
                      {m.hiHz !== null && <rect x={m.lo} y={0} width={Math.max(1, m.hi - m.lo)} height={ih} fill={m.color} fillOpacity={0.12} />}
                      <line x1={m.lo} x2={m.lo} y1={0} y2={ih} stroke={m.color} strokeWidth={1} />
                      {m.hiHz !== null && <line x1={m.hi} x2={m.hi} y1={0} y2={ih} stroke={m.color} strokeWidth={1} />}
                      <text
                        x={m.lo > iw - 120 ? m.lo - 3 : m.lo + 3}
                        y={12 + m.row * 13}
                        textAnchor={m.lo > iw - 120 ? 'end' : 'start'}
                        fontSize={10}
                        fill={m.color}
                        stroke={T.paper}
                        strokeWidth={3}
                        paintOrder="stroke"
                      >
                        {m.label}
                      </text>
                    </g>
                  ))}
                </g>

                {tInv && tInv >= xDomain[0] && tInv <= xDomain[1] && (
                  <text x={x(tInv) + 4} y={11} fontSize={TICK_FONT} fill={T.inkFaint} fontFamily={T.mono}>
                    1/T₀
                  </text>
                )}

                {/* frame and axes */}
                <rect x={0} y={0} width={iw} height={ih} fill="none" stroke={T.frame} strokeWidth={1} />
                <g fontFamily={T.mono} fontSize={TICK_FONT} fill={T.inkSoft}>
                  {xTicks.map((t) => (
                    <g key={`tx${t.value}`} transform={`translate(${x(t.value)},${ih})`}>
                      <line y1={0} y2={t.major ? 5 : 3} stroke={T.frame} />
                      {t.label && (
                        <text y={17} textAnchor="middle">
                          {t.label}
                        </text>
                      )}
                    </g>
                  ))}
                  {yTicks.map((t) => (
                    <g key={`ty${t.value}`} transform={`translate(0,${y(t.value)})`}>
                      <line x1={0} x2={t.major ? -5 : -3} stroke={T.frame} />
                      {t.label && (
                        <text x={-8} dy="0.34em" textAnchor="end">
                          {t.label}
                        </text>
                      )}
                    </g>
                  ))}
                </g>
                <text x={iw / 2} y={ih + 38} textAnchor="middle" fontSize={TITLE_FONT} fill={T.ink}>
                  offset frequency f (Hz)
                </text>
                <text transform={`translate(${-MARGIN.left + 16},${ih / 2}) rotate(-90)`} textAnchor="middle" fontSize={TITLE_FONT} fill={T.ink}>
                  <SvgSymbol text={`${info.symbol} (${info.unit})`} fontSize={TITLE_FONT} />
                </text>

                {n < 2 && (
                  <text x={iw / 2} y={ih / 2} textAnchor="middle" fontSize={13} fill={T.inkFaint}>
                    No points to draw in this view.
                  </text>
                )}

              </g>

              {/* interaction layers: left out of exports */}
              <g data-export="omit">
                <rect
                  x={0}
                  y={0}
                  width={iw}
                  height={ih}
                  fill="transparent"
                  style={{ cursor: 'crosshair' }}
                  onPointerDown={onOverlayDown}
                  onDoubleClick={resetZoom}
                  data-testid="plot-overlay"
                />
                {zoomRect && (
                  <rect x={zoomRect.x} y={zoomRect.y} width={zoomRect.w} height={zoomRect.h} fill={T.ink} fillOpacity={0.06} stroke={T.ink} strokeOpacity={0.5} strokeDasharray="3 3" pointerEvents="none" />
                )}
                {hoverPx && hoverPx.x >= 0 && hoverPx.x <= iw && (
                  <g pointerEvents="none">
                    <line x1={hoverPx.x} x2={hoverPx.x} y1={0} y2={ih} stroke={T.ink} strokeOpacity={0.35} strokeWidth={0.8} />
                    {hoverPx.y >= 0 && hoverPx.y <= ih && <circle cx={hoverPx.x} cy={hoverPx.y} r={3.5} fill={T.paper} stroke={T.trace} strokeWidth={1.6} />}
                  </g>
                )}
                {movable && bandPx && (
                  <>
                    {/* the grip to move the whole band, on its visible part only (zoomed, it may run off the plot) */}
                    <rect
                      x={clamp(bandPx.lo, 0, iw) + 6}
                      y={0}
                      width={Math.max(0, clamp(bandPx.hi, 0, iw) - clamp(bandPx.lo, 0, iw) - 12)}
                      height={14}
                      fill={T.floor}
                      fillOpacity={0.35}
                      style={{ cursor: drag?.kind === 'band-move' ? 'grabbing' : 'grab' }}
                      onPointerDown={startBandDrag('band-move')}
                    >
                      <title>Drag to move the white-floor band</title>
                    </rect>
                    {band && (['lo', 'hi'] as const).map((edge) => {
                      const px = edge === 'lo' ? bandPx.lo : bandPx.hi;
                      const f = edge === 'lo' ? band[0] : band[1];
                      // an edge zoomed out of sight stays reachable from the keyboard, drawn nowhere
                      const shown = px >= -0.5 && px <= iw + 0.5;
                      return (
                        <g
                          key={edge}
                          role="slider"
                          tabIndex={0}
                          aria-label={edge === 'lo' ? 'White-floor band, lower edge' : 'White-floor band, upper edge'}
                          aria-valuenow={Math.round(f)}
                          aria-valuemin={Math.round(fullX[0])}
                          aria-valuemax={Math.round(fullX[1])}
                          aria-valuetext={formatSI(f, 'Hz').text}
                          aria-orientation="horizontal"
                          onKeyDown={onHandleKey(edge)}
                          onPointerDown={startBandDrag(edge === 'lo' ? 'band-lo' : 'band-hi')}
                          style={{ cursor: 'ew-resize', outline: 'none' }}
                          className="band-handle"
                          data-testid={`band-${edge}`}
                        >
                          {shown && (
                            <>
                              <rect x={px - 6} y={0} width={12} height={ih} fill="transparent" />
                              <line x1={px} x2={px} y1={0} y2={ih} stroke={T.floorLine} strokeWidth={1.2} />
                              <rect x={px - 3.5} y={ih / 2 - 14} width={7} height={28} rx={2} fill={T.paper} stroke={T.floorLine} strokeWidth={1.2} />
                              <line x1={px} x2={px} y1={ih / 2 - 8} y2={ih / 2 + 8} stroke={T.floorLine} strokeWidth={1} />
                            </>
                          )}
                        </g>
                      );
                    })}
                  </>
                )}
              </g>
            </g>
          </svg>
        )}
        {/* read-out */}
        <div
          aria-live="polite"
          className="pointer-events-none absolute font-mono text-xs leading-5 text-ink"
          style={{ right: MARGIN.right + 8, top: top + 8 }}
          data-testid="plot-readout"
        >
          {hoverPoint && (
            <div className="rounded-[3px] border border-rule bg-paper-card/95 px-2.5 py-1.5 shadow-[0_1px_0_rgba(0,0,0,0.04)]">
              <div>
                <span className="text-ink-faint">f </span>
                {formatSI(hoverPoint.f, 'Hz').text}
              </div>
              <div>
                <span className="text-ink-faint">
                  <HtmlSymbol text={info.symbol} />{' '}
                </span>
                {formatValue(view, hoverPoint.v)}
              </div>
            </div>
          )}
        </div>
      </div>
      <p id={summaryId} className="sr-only">
        {n >= 2
          ? `${info.name}, ${info.symbol.replace('_', '')} in ${info.unit}, from ${formatSI(pts.f[0], 'Hz').text} to ${formatSI(pts.f[n - 1], 'Hz').text}` +
            (band ? `; white-floor band ${formatSI(band[0], 'Hz').text} to ${formatSI(band[1], 'Hz').text}` : '') +
            (spurMarks.length ? `; ${spurMarks.length} spur ${spurMarks.length === 1 ? 'mark' : 'marks'}` : '') +
            (markShapes.length ? `; ${markShapes.length} ${markShapes.length === 1 ? 'mark' : 'marks'} listed beside the plot` : '') +
            '. The figures below give the numbers.'
          : 'No points to draw in this view.'}
      </p>
      <p id={helpId} className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-faint">
        <span>Drag across the plot to zoom; double-click or press 0 to see it all{zoomed ? ' (zoomed now)' : ''}.</span>
        <span>With the plot focused, ← → step the read-out, + − zoom.</span>
        {movable && <span>Drag the band's edges, or focus one and use ← →, to move the white-floor band.</span>}
      </p>
    </div>
  );
}

/**
 * The figures of an overlay's spectra side by side: one column per spectrum (its colour swatch, file
 * and laser), one row per figure with its unit — intrinsic linewidth, β-line linewidth, lineshape
 * FWHM, white floor, corner — then the operating point and the settings they came from. A column can
 * be removed when `onRemove` is given.
 */
import type { OperatingPoint, TraceFigures, TraceSettings } from '../../../../server/contracts/overlays';
import { Quantity } from '../../../components/ui/quantity';
import { formatFixed, formatScientific, formatSI, type FormattedQuantity } from '../../../lib/units';

export interface FiguresColumn {
  key: string;
  color: string;
  title: string;
  subtitle?: string | null;
  figures: TraceFigures;
  settings: TraceSettings;
  operatingPoint: OperatingPoint;
}

const dash = (unit: string): FormattedQuantity => ({ number: '—', unit, text: `— ${unit}` });
const hz = (v: number | null) => (v === null ? dash('Hz') : formatSI(v, 'Hz'));
const fixed = (v: number | null, unit: string, d: number) => (v === null ? dash(unit) : formatFixed(v, unit, d, true));

const ROWS: { label: string; value: (c: FiguresColumn) => FormattedQuantity | string }[] = [
  { label: 'Intrinsic linewidth', value: (c) => hz(c.figures.intrinsicLinewidthHz) },
  { label: 'β-line linewidth', value: (c) => hz(c.figures.betaLinewidthHz) },
  { label: 'Lineshape FWHM', value: (c) => hz(c.figures.lineshapeFwhmHz) },
  { label: 'White floor h₀', value: (c) => (c.figures.whiteFloorHz2PerHz === null ? dash('Hz²/Hz') : formatScientific(c.figures.whiteFloorHz2PerHz, 'Hz²/Hz', 3)) },
  { label: 'Corner', value: (c) => hz(c.figures.cornerHz) },
  { label: 'Drive current', value: (c) => fixed(c.operatingPoint.driveCurrentMa, 'mA', 2) },
  { label: 'Output power', value: (c) => fixed(c.operatingPoint.outputPowerMw, 'mW', 3) },
  { label: 'Temperature', value: (c) => fixed(c.operatingPoint.temperatureC, '°C', 2) },
  { label: 'Window', value: (c) => c.settings.window ?? '—' },
  { label: 'Segment', value: (c) => (c.settings.segment === null ? '—' : `${c.settings.segment} samples`) },
  { label: 'Overlap', value: (c) => (c.settings.overlap === null ? '—' : `${Math.round(c.settings.overlap * 100)} %`) },
  { label: 'Averages', value: (c) => (c.settings.averages === null ? '—' : String(c.settings.averages)) },
  { label: 'Observation time T₀', value: (c) => (c.settings.observationTimeS === null ? dash('s') : formatSI(c.settings.observationTimeS, 's')) },
  {
    label: 'Floor band',
    value: (c) => (c.settings.floorBandHz ? `${formatSI(c.settings.floorBandHz[0], 'Hz').text} – ${formatSI(c.settings.floorBandHz[1], 'Hz').text}` : '—'),
  },
];

export function OverlayFiguresTable({ columns, onRemove, removing }: { columns: readonly FiguresColumn[]; onRemove?: (key: string) => void; removing?: boolean }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm" data-testid="overlay-figures">
        <caption className="sr-only">Figures of each spectrum, side by side</caption>
        <thead>
          <tr className="border-b border-rule align-bottom">
            <th scope="col" className="py-2 pr-4 text-left text-xs font-medium tracking-[0.06em] text-ink-faint uppercase">
              Figure
            </th>
            {columns.map((c) => (
              <th key={c.key} scope="col" className="min-w-[11rem] px-3 py-2 text-left font-medium text-ink">
                <span className="flex items-start gap-2">
                  <span aria-hidden="true" className="mt-1.5 inline-block h-[3px] w-5 shrink-0" style={{ backgroundColor: c.color }} />
                  <span className="min-w-0">
                    <span className="block break-all">{c.title}</span>
                    {c.subtitle && <span className="block text-xs font-normal text-ink-faint">{c.subtitle}</span>}
                  </span>
                </span>
                {onRemove && (
                  <button
                    type="button"
                    className="mt-1 text-xs text-accent underline-offset-4 hover:underline disabled:opacity-50"
                    disabled={removing || columns.length <= 1}
                    title={columns.length <= 1 ? 'an overlay keeps at least one spectrum' : undefined}
                    onClick={() => onRemove(c.key)}
                  >
                    Remove from overlay
                  </button>
                )}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {ROWS.map((row) => (
            <tr key={row.label} className="border-b border-rule/60">
              <th scope="row" className="py-1.5 pr-4 text-left font-normal whitespace-nowrap text-ink-soft">
                {row.label}
              </th>
              {columns.map((c) => {
                const v = row.value(c);
                return (
                  <td key={c.key} className="px-3 py-1.5">
                    {typeof v === 'string' ? <span className="font-mono text-ink">{v}</span> : <Quantity q={v} />}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

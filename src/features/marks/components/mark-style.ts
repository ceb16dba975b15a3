/**
 * How marks look: one Okabe–Ito colour per kind (Okabe & Ito, "Color Universal Design", 2002), the
 * kind's words, the place as text, and the shape the spectrum plot draws.
 */
import type { Mark, MarkKind } from '../../../../server/contracts/marks';
import { MARK_KIND_LABELS } from '../../../../server/contracts/marks';
import type { PlotMark } from '../../../components/plots/spectrum-plot';
import { formatSI } from '../../../lib/units';
import theme from '../../../../tailwind.config';

const okabeIto = theme.theme.extend.colors.trace;

export const MARK_COLORS: Record<MarkKind, string> = {
  spur: okabeIto.orange,
  mains: okabeIto.vermillion,
  'servo-bump': okabeIto.purple,
  'relaxation-oscillation': okabeIto.green,
  other: okabeIto.black,
};

export const MARK_KINDS = Object.keys(MARK_KIND_LABELS) as MarkKind[];

export function markKindLabel(kind: MarkKind): string {
  return MARK_KIND_LABELS[kind];
}

/** "50.0 Hz" or "20.0 kHz – 30.0 kHz" */
export function markPlaceText(mark: Pick<Mark, 'frequencyHz' | 'bandHz'>): string {
  if (mark.bandHz) return `${formatSI(mark.bandHz[0], 'Hz').text} – ${formatSI(mark.bandHz[1], 'Hz').text}`;
  return mark.frequencyHz !== null ? formatSI(mark.frequencyHz, 'Hz').text : '—';
}

const shorten = (text: string, max: number) => (text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text);

/** The marks as the spectrum plot draws them, numbered as the list beside it numbers them. */
export function toPlotMarks(marks: readonly Mark[]): PlotMark[] {
  return marks.map((m, i) => ({
    id: m.id,
    loHz: m.bandHz ? m.bandHz[0] : (m.frequencyHz ?? 0),
    hiHz: m.bandHz ? m.bandHz[1] : null,
    label: `${i + 1} ${shorten(m.text, 26)}`,
    color: MARK_COLORS[m.kind],
  }));
}

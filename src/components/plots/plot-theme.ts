/**
 * Colours and type of every plot, taken from the one theme (tailwind.config.ts) so plots, exports
 * and pages agree. Traces use the Okabe–Ito colour-blind-safe palette (Okabe & Ito, "Color
 * Universal Design", 2002). Plots set colours as SVG attributes, not classes, so an exported SVG
 * carries them with it.
 */
import theme from '../../../tailwind.config';

const colors = theme.theme.extend.colors;

export const plotTheme = {
  paper: colors.paper.card,
  ink: colors.ink.DEFAULT,
  inkSoft: colors.ink.soft,
  inkFaint: colors.ink.faint,
  grid: colors.rule.DEFAULT,
  gridMinor: '#e8e1d1',
  frame: colors.rule.strong,
  /** the measured spectrum */
  trace: colors.trace.blue,
  /** the β-separation line and the area above it */
  beta: colors.trace.vermillion,
  /** the white-floor band and its level */
  floor: colors.trace.sky,
  floorLine: colors.trace.blue,
  /** the fitted noise model a₀ + a₋₁/f + a₋₂/f² */
  model: colors.trace.green,
  /** spur markers */
  spur: colors.trace.orange,
  /** a second series, e.g. the trend of β-line linewidths */
  second: colors.trace.purple,
  mono: '"JetBrains Mono", ui-monospace, monospace',
  sans: 'Inter, system-ui, sans-serif',
} as const;

/**
 * Overlay contracts. An overlay is a saved comparison of several spectra (done analyses of one
 * bench, of one laser or several) on one plot, with a legend and a table of their figures.
 *   GET    /api/benches/:benchId/overlays           -> OverlayListResponse (any member)
 *   POST   /api/benches/:benchId/overlays  CreateOverlayRequest -> 201 OverlayResponse (owner, analyst)
 *   GET    /api/overlays/:id                        -> OverlayResponse (any member)
 *   PATCH  /api/overlays/:id  UpdateOverlayRequest  -> OverlayResponse (owner, analyst)
 *   DELETE /api/overlays/:id                        -> 204 (owner, analyst)
 * An analysis id that is not a done analysis of this bench is refused with 400 `validation_failed`
 * (one message whether it does not exist, is elsewhere or is unfinished). Members of other benches get
 * 404 for every overlay id.
 * Trace colours come from the Okabe–Ito colour-blind-safe palette (Okabe & Ito, "Color Universal
 * Design", 2002) in the fixed order OVERLAY_PALETTE, by the trace's position in the overlay.
 */
import { z } from 'zod';
import { DisplayName, Id, Timestamp } from './common';

/** Okabe–Ito colours in the order traces take them (blue, vermillion, bluish green, orange, reddish purple, sky blue, black, yellow). */
export const OVERLAY_PALETTE = ['#0072B2', '#D55E00', '#009E73', '#E69F00', '#CC79A7', '#56B4E9', '#000000', '#F0E442'] as const;
export const MAX_OVERLAY_TRACES = OVERLAY_PALETTE.length;

/** The colour of the trace at `position` (0-based). */
export function overlayColor(position: number): string {
  return OVERLAY_PALETTE[position % OVERLAY_PALETTE.length];
}

const AnalysisIds = z
  .array(Id)
  .min(1, 'choose at least one spectrum')
  .max(MAX_OVERLAY_TRACES, `an overlay holds at most ${MAX_OVERLAY_TRACES} spectra`)
  .refine((ids) => new Set(ids).size === ids.length, 'a spectrum appears only once in an overlay');

export const CreateOverlayRequest = z.strictObject({ name: DisplayName, analysisIds: AnalysisIds });
export type CreateOverlayRequest = z.input<typeof CreateOverlayRequest>;

export const UpdateOverlayRequest = z
  .strictObject({ name: DisplayName.optional(), analysisIds: AnalysisIds.optional() })
  .refine((v) => v.name !== undefined || v.analysisIds !== undefined, 'give a name or analysisIds');
export type UpdateOverlayRequest = z.input<typeof UpdateOverlayRequest>;

/** The headline figures of one spectrum (null where the engine found none). */
export const TraceFigures = z.object({
  /** π·h₀ from the white floor, Hz */
  intrinsicLinewidthHz: z.number().nullable(),
  /** integrated linewidth from the β-separation line, Hz */
  betaLinewidthHz: z.number().nullable(),
  /** FWHM of the computed lineshape, Hz */
  lineshapeFwhmHz: z.number().nullable(),
  /** white-floor level h₀, Hz²/Hz */
  whiteFloorHz2PerHz: z.number().nullable(),
  /** flicker/white corner of the noise model, Hz */
  cornerHz: z.number().nullable(),
});
export type TraceFigures = z.infer<typeof TraceFigures>;

/** The settings the spectrum was computed with, as the engine resolved them. */
export const TraceSettings = z.object({
  window: z.string().nullable(),
  segment: z.number().nullable(),
  overlap: z.number().nullable(),
  averages: z.number().nullable(),
  observationTimeS: z.number().nullable(),
  floorBandHz: z.tuple([z.number(), z.number()]).nullable(),
});
export type TraceSettings = z.infer<typeof TraceSettings>;

export const OperatingPoint = z.object({
  driveCurrentMa: z.number().nullable(),
  temperatureC: z.number().nullable(),
  outputPowerMw: z.number().nullable(),
});
export type OperatingPoint = z.infer<typeof OperatingPoint>;

/** The log-binned display series of a spectrum: frequencies (Hz) and S_ν (Hz²/Hz). */
export const DisplaySeries = z.object({
  frequencyHz: z.array(z.number()),
  frequencyNoiseHz2PerHz: z.array(z.number()),
});
export type DisplaySeries = z.infer<typeof DisplaySeries>;

export const OverlayTrace = z.object({
  position: z.number().int(),
  /** from OVERLAY_PALETTE by position */
  color: z.string(),
  analysisId: Id,
  captureId: Id,
  fileName: z.string(),
  laserId: Id.nullable(),
  laserName: z.string().nullable(),
  analysedAt: Timestamp.nullable(),
  figures: TraceFigures,
  settings: TraceSettings,
  operatingPoint: OperatingPoint,
  series: DisplaySeries.nullable(),
});
export type OverlayTrace = z.infer<typeof OverlayTrace>;

export const OverlaySummary = z.object({
  id: Id,
  benchId: Id,
  name: z.string(),
  traceCount: z.number().int(),
  createdAt: Timestamp,
  updatedAt: Timestamp,
});
export type OverlaySummary = z.infer<typeof OverlaySummary>;

export const Overlay = OverlaySummary.extend({ traces: z.array(OverlayTrace) });
export type Overlay = z.infer<typeof Overlay>;

export const OverlayResponse = z.object({ overlay: Overlay });
export type OverlayResponse = z.infer<typeof OverlayResponse>;

export const OverlayListResponse = z.object({ overlays: z.array(OverlaySummary) });
export type OverlayListResponse = z.infer<typeof OverlayListResponse>;

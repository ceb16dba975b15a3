/**
 * Analysis contracts. An analysis is one run of the engine over a capture with stated settings; the
 * analyses table is also the job queue, so an analysis has a status and a progress.
 *   GET  /api/analyses/:id                         -> Analysis (any member of the capture's bench)
 *   GET  /api/analyses/:id/spectrum?view=&points=  -> SpectrumResponse (any member)
 *   GET  /api/analyses/:id/series.csv              -> text/csv: frequency_hz,s_nu_hz2_per_hz (any member)
 *   POST /api/captures/:id/analyses  CreateAnalysisRequest -> 201 AnalysisResponse (owner, analyst)
 *   POST /api/analyses/:id/retry                   -> AnalysisResponse (owner, analyst; failed analyses only, else 409)
 *   GET  /api/benches/:benchId/lasers/:laserId/spectra -> LaserSpectraResponse (any member)
 * Members of other benches get 404 not_found for every analysis id.
 * `result` is the CLI's JSON object (`npm run analyze`) with the same field names, without `spectrum`.
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';
import { Laser } from './lasers';

export const WindowName = z.enum(['hann', 'blackman-harris', 'flat-top']);
export type WindowName = z.infer<typeof WindowName>;

export const AnalysisStatus = z.enum(['queued', 'running', 'done', 'failed']);
export type AnalysisStatus = z.infer<typeof AnalysisStatus>;

const positive = z.number().positive('must be positive').finite('must be finite');

/** A band [lo, hi] in Hz, 0 < lo < hi; also accepted as the CLI writes it, "lo:hi". */
export const FloorBandHz = z
  .preprocess(
    (v) => {
      if (typeof v !== 'string') return v;
      const parts = v.split(':');
      return parts.length === 2 ? parts.map((p) => (p.trim() === '' ? NaN : Number(p))) : v;
    },
    z.tuple([positive, positive], { error: 'must be "lo:hi" in Hz, or [lo, hi]' }),
  )
  .refine(([lo, hi]) => lo < hi, 'the low edge must be below the high edge');
export type FloorBandHz = z.infer<typeof FloorBandHz>;

/** The CLI's analysis options in camelCase; one left out takes the engine's default. */
export const AnalysisSettings = z.strictObject({
  window: WindowName.optional(),
  /** Welch segment length, samples (the engine's range: 64 … 2^24) */
  segment: z.number().int('must be a whole number').min(64, 'must be at least 64').max(1 << 24, 'must be at most 16777216').optional(),
  /** Welch segment overlap, 0 ≤ overlap < 1 (engine default 0.5) */
  overlap: z.number().min(0, 'must be at least 0').lt(1, 'must be below 1').optional(),
  /** T0 of the β-line and lineshape, s (engine default: the record length) */
  observationTimeS: positive.optional(),
  /** band the white floor is averaged over; without it the engine finds the flattest band */
  floorBandHz: FloorBandHz.optional(),
});
export type AnalysisSettings = z.infer<typeof AnalysisSettings>;

/** The CLI's JSON, field for field (further fields may appear; `spectrum` is served by /spectrum). */
export const AnalysisResult = z.looseObject({
  input: z.looseObject({
    kind: z.string(),
    format: z.string(),
    samples: z.number(),
    sampleRateHz: z.number(),
    durationS: z.number(),
  }),
  settings: z.looseObject({
    window: z.string(),
    segment: z.number(),
    overlap: z.number(),
    averages: z.number(),
  }),
  whiteFloor: z.looseObject({
    valueHz2PerHz: z.number().nullable(),
    bandHz: z.tuple([z.number(), z.number()]).nullable(),
  }),
  intrinsicLinewidthHz: z.number().nullable(),
  betaLine: z.looseObject({
    observationTimeS: z.number(),
    crossingHz: z.number().nullable(),
    areaHz2: z.number().nullable(),
    linewidthHz: z.number().nullable(),
  }),
  lineshape: z.looseObject({ fwhmHz: z.number().nullable() }),
  noiseModel: z
    .looseObject({
      whiteHz2PerHz: z.number().nullable(),
      flickerHz2: z.number().nullable(),
      randomWalkHz3: z.number().nullable(),
      cornerHz: z.number().nullable(),
    })
    .nullable(),
  spurs: z.array(z.looseObject({ frequencyHz: z.number(), heightDb: z.number() })),
});
export type AnalysisResult = z.infer<typeof AnalysisResult>;

/** An analysis as lists show it (no result object). */
export const AnalysisSummary = z.object({
  id: Id,
  captureId: Id,
  status: AnalysisStatus,
  /** 0..1 */
  progress: z.number(),
  /** the engine stage running now ('queued', 'reading', …, 'done', 'failed') */
  stage: z.string(),
  settings: AnalysisSettings,
  intrinsicLinewidthHz: z.number().nullable(),
  betaLinewidthHz: z.number().nullable(),
  lineshapeFwhmHz: z.number().nullable(),
  whiteFloorHz2PerHz: z.number().nullable(),
  /** why it failed (the engine's message for a bad input) */
  error: z.string().nullable(),
  createdAt: Timestamp,
  startedAt: Timestamp.nullable(),
  finishedAt: Timestamp.nullable(),
});
export type AnalysisSummary = z.infer<typeof AnalysisSummary>;

/** GET /api/analyses/:id */
export const Analysis = AnalysisSummary.extend({
  benchId: Id,
  result: AnalysisResult.nullable(),
});
export type Analysis = z.infer<typeof Analysis>;

export const AnalysisResponse = z.object({ analysis: Analysis });
export type AnalysisResponse = z.infer<typeof AnalysisResponse>;

export const CreateAnalysisRequest = z.object({ settings: AnalysisSettings.default({}) });
export type CreateAnalysisRequest = z.input<typeof CreateAnalysisRequest>;

/** frequency: S_ν Hz²/Hz · phase: S_φ = S_ν/f² rad²/Hz · dbc: L(f) = 10·log10(S_φ/2) dBc/Hz · asd: √S_ν Hz/√Hz */
export const SpectrumView = z.enum(['frequency', 'phase', 'dbc', 'asd']);
export type SpectrumView = z.infer<typeof SpectrumView>;

export const SPECTRUM_UNITS: Record<SpectrumView, string> = {
  frequency: 'Hz²/Hz',
  phase: 'rad²/Hz',
  dbc: 'dBc/Hz',
  asd: 'Hz/√Hz',
};

export const SPECTRUM_MAX_POINTS = 5000;

export const SpectrumQuery = z.object({
  view: SpectrumView.default('frequency'),
  points: z.coerce
    .number()
    .int('must be a whole number')
    .min(2, 'must be at least 2')
    .max(SPECTRUM_MAX_POINTS, `must be at most ${SPECTRUM_MAX_POINTS}`)
    .default(400),
});
export type SpectrumQuery = z.input<typeof SpectrumQuery>;

/** Frequencies and values with 7 significant digits (the full-precision series is series.csv); a −∞ dB value is null. */
export const SpectrumResponse = z.object({
  view: SpectrumView,
  unit: z.string(),
  frequencyHz: z.array(z.number()),
  values: z.array(z.number()),
  /** points returned (at most the points asked for; fewer when the series is shorter) */
  points: z.number().int(),
});
export type SpectrumResponse = z.infer<typeof SpectrumResponse>;

/** One analysed capture of a laser: its headline figures and operating point (latest done analysis). */
export const LaserSpectrumPoint = z.object({
  captureId: Id,
  analysisId: Id,
  fileName: z.string(),
  createdAt: Timestamp,
  intrinsicLinewidthHz: z.number().nullable(),
  betaLinewidthHz: z.number().nullable(),
  lineshapeFwhmHz: z.number().nullable(),
  driveCurrentMa: z.number().nullable(),
  temperatureC: z.number().nullable(),
  outputPowerMw: z.number().nullable(),
});
export type LaserSpectrumPoint = z.infer<typeof LaserSpectrumPoint>;

export const LaserSpectraResponse = z.object({ laser: Laser, points: z.array(LaserSpectrumPoint) });
export type LaserSpectraResponse = z.infer<typeof LaserSpectraResponse>;

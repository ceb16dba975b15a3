/**
 * Capture contracts. A capture is one uploaded time-series file with how it was taken.
 *   POST   /api/benches/:benchId/captures  multipart: `file` + CaptureUploadFields -> 201 CreateCaptureResponse (owner, analyst)
 *          413 payload_too_large over PHASELOOM_MAX_UPLOAD_BYTES; 400 bad_input with the engine's message when
 *          the file cannot be read (nothing is stored)
 *   GET    /api/benches/:benchId/captures?laserId=&kind=&tag=&page=&pageSize= -> CaptureListResponse (any member)
 *   GET    /api/captures/:id                 -> CaptureDetailResponse (any member of its bench)
 *   DELETE /api/captures/:id                 -> 204 (the analyst who uploaded it, or an owner; file and rows go together)
 * Members of other benches get 404 not_found for every capture id.
 * Form fields are named like the CLI's options in camelCase; multipart sends every value as text.
 */
import { z } from 'zod';
import { AnalysisSettings, AnalysisStatus, AnalysisSummary, FloorBandHz, WindowName } from './analyses';
import { Id, Timestamp } from './common';

export const CaptureKind = z.enum(['phase', 'iq', 'beat', 'frequency']);
export type CaptureKind = z.infer<typeof CaptureKind>;
export const CaptureFormat = z.enum(['csv', 'npy', 'wav', 'raw']);
export type CaptureFormat = z.infer<typeof CaptureFormat>;
export const RawDtype = z.enum(['int16', 'int32', 'float32', 'float64']);
export type RawDtype = z.infer<typeof RawDtype>;
export const ByteOrder = z.enum(['little', 'big']);
export type ByteOrder = z.infer<typeof ByteOrder>;
export const CaptureSetup = z.enum(['heterodyne', 'self-heterodyne', 'coherent-receiver', 'other']);
export type CaptureSetup = z.infer<typeof CaptureSetup>;

/** heterodyne: the reference laser's linewidth; self-heterodyne: the delay of the fibre arm. */
export const SetupParams = z.strictObject(
  {
    referenceLinewidthHz: z.number().positive('must be positive').finite().optional(),
    delayS: z.number().positive('must be positive').finite().optional(),
  },
  { error: 'must be a JSON object such as {"referenceLinewidthHz": 100} or {"delayS": 5e-6}' },
);
export type SetupParams = z.infer<typeof SetupParams>;

export const MAX_TAGS = 32;
export const Tag = z.string().trim().min(1, 'must not be empty').max(64, 'must be at most 64 characters');

export const Capture = z.object({
  id: Id,
  benchId: Id,
  laserId: Id.nullable(),
  uploadedBy: Id.nullable(),
  uploadedByName: z.string().nullable(),
  fileName: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string(),
  format: CaptureFormat,
  kind: CaptureKind,
  sampleRateHz: z.number().nullable(),
  dtype: RawDtype.nullable(),
  channels: z.number().int().nullable(),
  byteOrder: ByteOrder.nullable(),
  setup: CaptureSetup.nullable(),
  setupParams: SetupParams.nullable(),
  driveCurrentMa: z.number().nullable(),
  temperatureC: z.number().nullable(),
  outputPowerMw: z.number().nullable(),
  notes: z.string().nullable(),
  tags: z.array(z.string()),
  /** an earlier capture on this bench with the same bytes (sha256), if any */
  duplicateOf: Id.nullable(),
  createdAt: Timestamp,
});
export type Capture = z.infer<typeof Capture>;

export const LatestAnalysis = z.object({
  id: Id,
  status: AnalysisStatus,
  progress: z.number(),
  stage: z.string(),
  intrinsicLinewidthHz: z.number().nullable(),
  betaLinewidthHz: z.number().nullable(),
  lineshapeFwhmHz: z.number().nullable(),
});
export type LatestAnalysis = z.infer<typeof LatestAnalysis>;

export const CaptureSummary = Capture.extend({ latestAnalysis: LatestAnalysis.nullable() });
export type CaptureSummary = z.infer<typeof CaptureSummary>;

export const CaptureListQuery = z.object({
  laserId: Id.optional(),
  kind: CaptureKind.optional(),
  tag: Tag.optional(),
  page: z.coerce.number().int('must be a whole number').min(1, 'must be at least 1').default(1),
  pageSize: z.coerce.number().int('must be a whole number').min(1, 'must be at least 1').max(100, 'must be at most 100').default(20),
});
export type CaptureListQuery = z.input<typeof CaptureListQuery>;

export const CaptureListResponse = z.object({
  captures: z.array(CaptureSummary),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
});
export type CaptureListResponse = z.infer<typeof CaptureListResponse>;

export const CaptureDetailResponse = z.object({ capture: Capture, analyses: z.array(AnalysisSummary) });
export type CaptureDetailResponse = z.infer<typeof CaptureDetailResponse>;

export const CreateCaptureResponse = z.object({
  capture: Capture,
  analysis: AnalysisSummary,
  /** present when the same file is already on this bench (it is stored again all the same) */
  duplicateOf: Id.optional(),
});
export type CreateCaptureResponse = z.infer<typeof CreateCaptureResponse>;

// ---- the multipart form ---------------------------------------------------------------------------

const blank = (v: unknown) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? undefined : v);

/** A number sent as form text ("" = not given). */
function formNumber<T extends z.ZodType<number>>(schema: T) {
  return z.preprocess((v) => {
    const b = blank(v);
    return typeof b === 'string' ? Number(b.trim()) : b;
  }, schema.optional());
}

/** An enum sent as form text ("" = not given). */
function formEnum<T extends z.ZodType>(schema: T) {
  return z.preprocess((v) => {
    const b = blank(v);
    return typeof b === 'string' ? b.trim() : b;
  }, schema.optional());
}

const jsonText = (v: unknown) => {
  const b = blank(v);
  if (typeof b !== 'string') return b;
  try {
    return JSON.parse(b) as unknown;
  } catch {
    return b; // fails the schema below with "expected object"
  }
};

const tagsText = (v: unknown) => {
  const b = blank(v);
  if (typeof b !== 'string') return b;
  const t = b.trim();
  if (t.startsWith('[')) return jsonText(t);
  return t.split(',');
};

const positiveNumber = z.number('must be a number').positive('must be positive').finite('must be finite');
const anyNumber = z.number('must be a number').finite('must be finite');

/**
 * The text fields of the upload form. What the file tells (format, sample rate of a WAV or a timed
 * CSV, channel count) may be left out; the server sniffs it and answers 400 with the engine's message
 * when something the file cannot tell is missing. The analysis fields set up the first analysis.
 */
export const CaptureUploadFields = z.object({
  kind: formEnum(CaptureKind),
  sampleRateHz: formNumber(positiveNumber),
  format: formEnum(CaptureFormat),
  dtype: formEnum(RawDtype),
  channels: formNumber(z.union([z.literal(1), z.literal(2)], { error: 'must be 1 or 2' })),
  byteOrder: formEnum(ByteOrder),
  laserId: formEnum(Id),
  setup: formEnum(CaptureSetup),
  setupParams: z.preprocess(jsonText, SetupParams.optional()),
  driveCurrentMa: formNumber(anyNumber),
  temperatureC: formNumber(anyNumber),
  outputPowerMw: formNumber(positiveNumber),
  notes: z.preprocess(blank, z.string().trim().max(4000, 'must be at most 4000 characters').optional()),
  tags: z.preprocess(
    tagsText,
    z
      .array(z.preprocess((t) => (typeof t === 'string' ? t.trim() : t), z.string()))
      .transform((ts) => [...new Set(ts.filter((t) => t !== ''))])
      .pipe(z.array(Tag).max(MAX_TAGS, `at most ${MAX_TAGS} tags`))
      .optional(),
  ),
  window: formEnum(WindowName),
  segment: formNumber(z.number('must be a number').int('must be a whole number')),
  overlap: formNumber(anyNumber),
  observationTimeS: formNumber(positiveNumber),
  floorBandHz: z.preprocess(blank, FloorBandHz.optional()),
});
/** What the client sends: every field as text. */
export type CaptureUploadFields = Partial<Record<keyof z.input<typeof CaptureUploadFields>, string>>;
export type ParsedCaptureUploadFields = z.infer<typeof CaptureUploadFields>;

/** The analysis settings carried by an upload form, checked by the same rules as POST /analyses. */
export function settingsFromUpload(fields: ParsedCaptureUploadFields): AnalysisSettings {
  const settings: Record<string, unknown> = {};
  for (const key of ['window', 'segment', 'overlap', 'observationTimeS', 'floorBandHz'] as const) {
    if (fields[key] !== undefined) settings[key] = fields[key];
  }
  return AnalysisSettings.parse(settings);
}

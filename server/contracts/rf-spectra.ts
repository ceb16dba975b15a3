/**
 * RF beat-spectrum contracts. A spectrum-analyser trace (frequency, power in dBm or linear) uploaded as
 * CSV to a bench; the server fits a Lorentzian, a Gaussian and a Voigt line on a constant baseline
 * (linear power, Levenberg–Marquardt), reads the −20 dB width and, in self-heterodyne mode, the laser
 * linewidth with its stated assumption (Phaseloom METHODS 4.2, 4.4).
 *   POST   /api/benches/:benchId/rf-spectra  multipart: file + RfSpectrumUploadFields -> 201 RfSpectrumResponse (owner, analyst)
 *   GET    /api/benches/:benchId/rf-spectra  -> RfSpectrumListResponse (any member; no traces)
 *   GET    /api/rf-spectra/:id               -> RfSpectrumResponse with the trace and fitted curves (any member)
 *   DELETE /api/rf-spectra/:id               -> 204 (owner, or the analyst who uploaded it)
 * A spectrum that cannot be read or fitted (an empty file, a non-numeric cell — its line named —, no
 * shape converging) is answered 400 and nothing is stored.
 */
import { z } from 'zod';
import { DisplayName, Id, Timestamp } from './common';

export const RfPowerUnit = z.enum(['dBm', 'mW', 'W']);
export type RfPowerUnit = z.infer<typeof RfPowerUnit>;
export const RfFrequencyUnit = z.enum(['Hz', 'kHz', 'MHz', 'GHz']);
export const RfMode = z.enum(['beat', 'self-heterodyne']);
export type RfMode = z.infer<typeof RfMode>;
export const RfLineShape = z.enum(['lorentzian', 'gaussian', 'voigt']);
export type RfLineShape = z.infer<typeof RfLineShape>;

/** A multipart text field holding a positive number ("" = not given). */
const PositiveField = (what: string) =>
  z.preprocess(
    (v) => (v === '' || v === undefined || v === null ? undefined : typeof v === 'string' ? Number(v.trim()) : v),
    z.number({ error: `${what} must be a number` }).positive(`${what} must be positive`).optional(),
  );

const EmptyAsUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

/**
 * Form fields beside the file. powerUnit and frequencyUnit: given, else read from the column header
 * (else dBm when a power is negative); mode 'beat' (default) or 'self-heterodyne' with delayS or
 * fiberLengthM (group index default 1.468).
 */
export const RfSpectrumUploadFields = z
  .object({
    name: DisplayName,
    powerUnit: z.preprocess(EmptyAsUndefined, RfPowerUnit.optional()),
    frequencyUnit: z.preprocess(EmptyAsUndefined, RfFrequencyUnit.optional()),
    mode: z.preprocess(EmptyAsUndefined, RfMode.default('beat')),
    delayS: PositiveField('delayS'),
    fiberLengthM: PositiveField('fiberLengthM'),
    groupIndex: PositiveField('groupIndex'),
    laserId: z.preprocess(EmptyAsUndefined, Id.optional()),
  })
  .superRefine((v, ctx) => {
    if (v.mode === 'self-heterodyne') {
      if (v.delayS === undefined && v.fiberLengthM === undefined) {
        ctx.addIssue({ code: 'custom', path: ['delayS'], message: 'self-heterodyne mode needs the delay (delayS) or the fibre length (fiberLengthM)' });
      }
      if (v.delayS !== undefined && v.fiberLengthM !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['fiberLengthM'], message: 'give delayS or fiberLengthM, not both' });
      }
      if (v.groupIndex !== undefined && v.fiberLengthM === undefined) {
        ctx.addIssue({ code: 'custom', path: ['groupIndex'], message: 'groupIndex goes with fiberLengthM' });
      }
    } else {
      for (const key of ['delayS', 'fiberLengthM', 'groupIndex'] as const) {
        if (v[key] !== undefined) ctx.addIssue({ code: 'custom', path: [key], message: `${key} applies to mode 'self-heterodyne' only` });
      }
    }
  });
export type RfSpectrumUploadFields = z.input<typeof RfSpectrumUploadFields>;

export const RfLineFitResult = z.object({
  shape: RfLineShape,
  /** null when this shape converged; else why it did not (the other shapes still count) */
  error: z.string().nullable(),
  centerHz: z.number().nullable(),
  centerUncertaintyHz: z.number().nullable(),
  /** FWHM (Voigt: Olivero & Longbothum) and its standard uncertainty, Hz */
  fwhmHz: z.number().nullable(),
  fwhmUncertaintyHz: z.number().nullable(),
  /** Voigt: the exact FWHM of the fitted profile */
  exactFwhmHz: z.number().nullable(),
  lorentzianFwhmHz: z.number().nullable(),
  lorentzianFwhmUncertaintyHz: z.number().nullable(),
  gaussianFwhmHz: z.number().nullable(),
  gaussianFwhmUncertaintyHz: z.number().nullable(),
  peakMw: z.number().nullable(),
  baselineMw: z.number().nullable(),
  /** √(Σr²/n), mW, and relative to the peak */
  residualRmsMw: z.number().nullable(),
  residualRelative: z.number().nullable(),
  iterations: z.number().nullable(),
});
export type RfLineFitResult = z.infer<typeof RfLineFitResult>;

export const RfTwentyDbWidth = z.object({
  widthHz: z.number(),
  crossingsHz: z.tuple([z.number(), z.number()]),
  /** W₋₂₀/√99 and W₋₂₀/√(ln100/ln2) */
  lorentzianFwhmHz: z.number(),
  gaussianFwhmHz: z.number(),
  floorDepthDb: z.number(),
});

export const RfSelfHeterodyneReading = z.object({
  shape: RfLineShape,
  laserLinewidthHz: z.number(),
  laserLorentzianFwhmHz: z.number().nullable(),
  laserGaussianFwhmHz: z.number().nullable(),
  assumption: z.string(),
  delayS: z.number().nullable(),
  delayLinewidthProduct: z.number().nullable(),
  shortDelayLinewidthHz: z.number().nullable(),
  warnings: z.array(z.string()),
});
export type RfSelfHeterodyneReading = z.infer<typeof RfSelfHeterodyneReading>;

export const RfSpectrumResult = z.object({
  fits: z.array(RfLineFitResult),
  bestShape: RfLineShape,
  twentyDb: RfTwentyDbWidth.nullable(),
  selfHeterodyne: z
    .object({
      fromFit: z.partialRecord(RfLineShape, RfSelfHeterodyneReading),
      fromTwentyDb: RfSelfHeterodyneReading.nullable(),
    })
    .nullable(),
  warnings: z.array(z.string()),
});
export type RfSpectrumResult = z.infer<typeof RfSpectrumResult>;

export const RfSpectrumSummary = z.object({
  id: Id,
  benchId: Id,
  laserId: Id.nullable(),
  name: z.string(),
  fileName: z.string(),
  powerUnit: RfPowerUnit,
  mode: RfMode,
  delayS: z.number().nullable(),
  fiberLengthM: z.number().nullable(),
  groupIndex: z.number().nullable(),
  points: z.number().int(),
  resolutionBandwidthHz: z.number().nullable(),
  bestShape: RfLineShape,
  bestFwhmHz: z.number(),
  createdBy: Id.nullable(),
  createdAt: Timestamp,
});
export type RfSpectrumSummary = z.infer<typeof RfSpectrumSummary>;

/** The measured trace (linear power, mW) and each converged shape's fitted curve on the same grid. */
export const RfTrace = z.object({
  frequencyHz: z.array(z.number()),
  powerMw: z.array(z.number()),
  models: z.partialRecord(RfLineShape, z.array(z.number())),
});
export type RfTrace = z.infer<typeof RfTrace>;

export const RfSpectrum = RfSpectrumSummary.extend({ result: RfSpectrumResult, trace: RfTrace });
export type RfSpectrum = z.infer<typeof RfSpectrum>;

export const RfSpectrumResponse = z.object({ rfSpectrum: RfSpectrum });
export type RfSpectrumResponse = z.infer<typeof RfSpectrumResponse>;

export const RfSpectrumListResponse = z.object({ rfSpectra: z.array(RfSpectrumSummary) });
export type RfSpectrumListResponse = z.infer<typeof RfSpectrumListResponse>;

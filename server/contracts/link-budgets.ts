/**
 * Link-budget contracts: a coherent link's phase-noise check of a modulation format at a symbol rate.
 *   POST   /api/link-budgets/evaluate              EvaluateLinkBudgetRequest -> LinkBudgetEvaluation (any signed-in user;
 *          an analysisId is read only through the caller's membership of its bench, else 404 naming the field)
 *   GET    /api/benches/:benchId/link-budgets      -> LinkBudgetListResponse (any member)
 *   POST   /api/benches/:benchId/link-budgets      SaveLinkBudgetRequest -> 201 LinkBudgetResponse (owner, analyst;
 *          every analysisId must be on this bench, else 400 naming the field; nothing is stored on any error)
 *   GET    /api/link-budgets/:id                   -> LinkBudgetResponse (any member of its bench)
 *   DELETE /api/link-budgets/:id                   -> 204 (an owner, or the analyst who saved it)
 * Members of other benches get 404 not_found for every budget id.
 * Method and tolerances: analysis/budget/ (Phaseloom METHODS 7.1-7.3). Formats without a verified published
 * tolerance (8PSK, 32QAM) come back with toleranceProduct, marginFactor, marginDb and pass null.
 */
import { z } from 'zod';
import { DisplayName, Id, Timestamp } from './common';

export const MODULATION_FORMATS = ['QPSK', '8PSK', '16QAM', '32QAM', '64QAM'] as const;
export const ModulationFormat = z.enum(MODULATION_FORMATS, { error: `must be one of ${MODULATION_FORMATS.join(', ')}` });
export type ModulationFormat = z.infer<typeof ModulationFormat>;

const linewidth = z.number('must be a number of Hz').finite('must be finite').min(0, 'must be 0 Hz or more');
const positive = (unit: string) => z.number(`must be a number of ${unit}`).finite('must be finite').positive('must be positive');

/** One laser: a spectrum on the bench (an analysis id) or a Lorentzian linewidth. */
export const LaserNoiseSource = z
  .strictObject({ analysisId: Id.optional(), linewidthHz: linewidth.optional() }, { error: 'must be { "analysisId": … } or { "linewidthHz": … }' })
  .superRefine((v, ctx) => {
    const given = Number(v.analysisId !== undefined) + Number(v.linewidthHz !== undefined);
    if (given !== 1) ctx.addIssue({ code: 'custom', path: [], message: 'give exactly one of analysisId or linewidthHz' });
  });
export type LaserNoiseSource = z.infer<typeof LaserNoiseSource>;

export const MAX_BLOCK_LENGTH = 100_001;

/** The phase estimator: a feed-forward block average over M symbols, or a first-order tracking loop. */
export const CarrierRecovery = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('block-average'),
      blockLength: z
        .number('must be a whole number of symbols')
        .int('must be a whole number of symbols')
        .min(1, 'must be at least 1')
        .max(MAX_BLOCK_LENGTH, `must be at most ${MAX_BLOCK_LENGTH}`)
        .refine((m) => m % 2 === 1, 'must be odd (a centred average over 2L+1 symbols)'),
    }),
    z.strictObject({ kind: z.literal('first-order-loop'), bandwidthHz: positive('Hz') }),
  ],
  { error: "kind must be 'block-average' or 'first-order-loop'" },
);
export type CarrierRecovery = z.infer<typeof CarrierRecovery>;

export const MAX_TABLE_RATES = 16;

export const EvaluateLinkBudgetRequest = z
  .strictObject({
    format: ModulationFormat,
    symbolRateBaud: positive('baud'),
    /** the combined (transmitter + local oscillator) Lorentzian linewidth; or give both lasers */
    linewidthHz: linewidth.optional(),
    transmitter: LaserNoiseSource.optional(),
    localOscillator: LaserNoiseSource.optional(),
    carrierRecovery: CarrierRecovery.optional(),
    /** symbol rates of the table (default 8, 16, 32, 64, 96, 128 GBd) */
    tableSymbolRatesBaud: z.array(positive('baud')).min(1, 'list at least one symbol rate').max(MAX_TABLE_RATES, `at most ${MAX_TABLE_RATES} symbol rates`).optional(),
  })
  .superRefine((v, ctx) => {
    const pair = v.transmitter !== undefined || v.localOscillator !== undefined;
    if (v.linewidthHz !== undefined && pair) {
      ctx.addIssue({ code: 'custom', path: ['linewidthHz'], message: 'give linewidthHz (combined) or transmitter and localOscillator, not both' });
    } else if (v.linewidthHz === undefined && !pair) {
      ctx.addIssue({ code: 'custom', path: ['linewidthHz'], message: 'give linewidthHz (combined) or transmitter and localOscillator' });
    } else if (pair && v.transmitter === undefined) {
      ctx.addIssue({ code: 'custom', path: ['transmitter'], message: 'give the transmitter too ({ analysisId } or { linewidthHz })' });
    } else if (pair && v.localOscillator === undefined) {
      ctx.addIssue({ code: 'custom', path: ['localOscillator'], message: 'give the local oscillator too ({ analysisId } or { linewidthHz })' });
    }
    const spectrum = v.transmitter?.analysisId !== undefined || v.localOscillator?.analysisId !== undefined;
    if (spectrum && v.carrierRecovery === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['carrierRecovery'],
        message: 'a laser given as a spectrum needs a carrier-recovery model (block-average or first-order-loop)',
      });
    }
  });
export type EvaluateLinkBudgetRequest = z.infer<typeof EvaluateLinkBudgetRequest>;

/** One row of the table across symbol rates. */
export const LinkBudgetTableRow = z.object({
  symbolRateBaud: z.number(),
  combinedLinewidthHz: z.number(),
  linewidthSymbolProduct: z.number(),
  marginFactor: z.number().nullable(),
  marginDb: z.number().nullable(),
  pass: z.boolean().nullable(),
  residualPhaseErrorRad2: z.number().optional(),
});
export type LinkBudgetTableRow = z.infer<typeof LinkBudgetTableRow>;

export const LinkBudgetEvaluation = z.object({
  format: ModulationFormat,
  symbolRateBaud: z.number(),
  /** Δν of the budget, Hz: the Lorentzian sum, or the equivalent Wiener linewidth when a spectrum is given */
  combinedLinewidthHz: z.number(),
  linewidthBasis: z.enum(['lorentzian-sum', 'equivalent-wiener']),
  /** Δν·T_s */
  linewidthSymbolProduct: z.number(),
  /** Δν·T_s for about 1 dB penalty, or null when no published value was verified for the format */
  toleranceProduct: z.number().nullable(),
  toleranceSource: z.string(),
  toleranceCriterion: z.string().nullable(),
  /** tolerance/(Δν·T_s); null without a tolerance (or without phase noise) */
  marginFactor: z.number().nullable(),
  marginDb: z.number().nullable(),
  pass: z.boolean().nullable(),
  verdict: z.string(),
  caution: z.string(),
  /** σ_p² = 2πΔνT_s, rad² */
  phaseIncrementVarianceRad2: z.number(),
  /** σ_e² after carrier recovery (with a carrier-recovery model), rad² */
  residualPhaseErrorRad2: z.number().optional(),
  equivalentWienerLinewidthHz: z.number().optional(),
  carrierRecovery: CarrierRecovery.optional(),
  warnings: z.array(z.string()),
  table: z.array(LinkBudgetTableRow),
});
export type LinkBudgetEvaluation = z.infer<typeof LinkBudgetEvaluation>;

export const SaveLinkBudgetRequest = z.strictObject({
  name: DisplayName,
  input: EvaluateLinkBudgetRequest,
});
export type SaveLinkBudgetRequest = z.input<typeof SaveLinkBudgetRequest>;

export const SavedLinkBudget = z.object({
  id: Id,
  benchId: Id,
  name: z.string(),
  createdBy: Id.nullable(),
  createdByName: z.string().nullable(),
  input: EvaluateLinkBudgetRequest,
  result: LinkBudgetEvaluation,
  createdAt: Timestamp,
});
export type SavedLinkBudget = z.infer<typeof SavedLinkBudget>;

export const LinkBudgetResponse = z.object({ linkBudget: SavedLinkBudget });
export type LinkBudgetResponse = z.infer<typeof LinkBudgetResponse>;

export const LinkBudgetListResponse = z.object({ linkBudgets: z.array(SavedLinkBudget) });
export type LinkBudgetListResponse = z.infer<typeof LinkBudgetListResponse>;

/**
 * The link-budget form's values as typed (text, in the units the form shows: GBd, kHz, MHz) and the
 * request they make; and back, so a saved budget opens in the form as it was entered.
 */
import type { EvaluateLinkBudgetRequest, LaserNoiseSource, ModulationFormat } from '../../../../server/contracts/link-budgets';

export type LaserMode = 'combined' | 'pair';
export type RecoveryKind = 'none' | 'block-average' | 'first-order-loop';

export interface LaserFields {
  /** '' = a linewidth; otherwise the analysis id of a spectrum on the bench */
  analysisId: string;
  linewidthKhz: string;
}

export interface BudgetFormValues {
  format: ModulationFormat;
  symbolRateGbd: string;
  mode: LaserMode;
  combinedKhz: string;
  transmitter: LaserFields;
  localOscillator: LaserFields;
  recovery: RecoveryKind;
  blockLength: string;
  loopBandwidthMhz: string;
}

export const INITIAL_BUDGET_VALUES: BudgetFormValues = {
  format: 'QPSK',
  symbolRateGbd: '32',
  mode: 'pair',
  combinedKhz: '',
  transmitter: { analysisId: '', linewidthKhz: '' },
  localOscillator: { analysisId: '', linewidthKhz: '' },
  recovery: 'none',
  blockLength: '21',
  loopBandwidthMhz: '100',
};

/** '' → undefined; a decimal comma is accepted; text that is not a number → NaN (the schema says so). */
function num(text: string, scale = 1): number | undefined {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isNaN(n) ? Number.NaN : n * scale;
}

function laser(fields: LaserFields): LaserNoiseSource {
  return fields.analysisId ? { analysisId: fields.analysisId } : { linewidthHz: num(fields.linewidthKhz, 1e3) as number };
}

export function requestFromValues(v: BudgetFormValues): EvaluateLinkBudgetRequest {
  const body: EvaluateLinkBudgetRequest = { format: v.format, symbolRateBaud: num(v.symbolRateGbd, 1e9) as number };
  if (v.mode === 'combined') body.linewidthHz = num(v.combinedKhz, 1e3);
  else {
    body.transmitter = laser(v.transmitter);
    body.localOscillator = laser(v.localOscillator);
  }
  if (v.recovery === 'block-average') body.carrierRecovery = { kind: 'block-average', blockLength: num(v.blockLength) as number };
  if (v.recovery === 'first-order-loop') body.carrierRecovery = { kind: 'first-order-loop', bandwidthHz: num(v.loopBandwidthMhz, 1e6) as number };
  return body;
}

const text = (v: number | undefined, scale = 1) => (v === undefined ? '' : String(Number((v / scale).toPrecision(12))));

function laserFields(source: LaserNoiseSource | undefined): LaserFields {
  if (!source) return { analysisId: '', linewidthKhz: '' };
  return source.analysisId ? { analysisId: source.analysisId, linewidthKhz: '' } : { analysisId: '', linewidthKhz: text(source.linewidthHz, 1e3) };
}

export function valuesFromRequest(r: EvaluateLinkBudgetRequest): BudgetFormValues {
  const cr = r.carrierRecovery;
  return {
    format: r.format,
    symbolRateGbd: text(r.symbolRateBaud, 1e9),
    mode: r.linewidthHz !== undefined ? 'combined' : 'pair',
    combinedKhz: text(r.linewidthHz, 1e3),
    transmitter: laserFields(r.transmitter),
    localOscillator: laserFields(r.localOscillator),
    recovery: cr ? cr.kind : 'none',
    blockLength: cr?.kind === 'block-average' ? String(cr.blockLength) : INITIAL_BUDGET_VALUES.blockLength,
    loopBandwidthMhz: cr?.kind === 'first-order-loop' ? text(cr.bandwidthHz, 1e6) : INITIAL_BUDGET_VALUES.loopBandwidthMhz,
  };
}

/**
 * Reading the engine's result (the CLI's JSON, kept loose by the contract) for the page: the named
 * figures with their types, and the extra fields the engine adds (warnings, ENBW, the noise-model
 * band) when they are there.
 */
import type { Analysis, AnalysisResult } from '../../../../server/contracts/analyses';

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const band = (v: unknown): [number, number] | null =>
  Array.isArray(v) && v.length === 2 && num(v[0]) !== null && num(v[1]) !== null ? [v[0] as number, v[1] as number] : null;

export interface ReadResult {
  input: { kind: string; format: string; samples: number; sampleRateHz: number; durationS: number };
  settings: { window: string; segment: number; overlap: number; averages: number; equivalentAverages: number | null; enbwHz: number | null };
  floorHz2PerHz: number | null;
  floorBandHz: [number, number] | null;
  intrinsicLinewidthHz: number | null;
  beta: { observationTimeS: number; crossingHz: number | null; areaHz2: number | null; linewidthHz: number | null };
  fwhmHz: number | null;
  model: { whiteHz2PerHz: number; flickerHz2: number; randomWalkHz3: number; cornerHz: number | null; bandHz: [number, number] | null } | null;
  spurs: { frequencyHz: number; heightDb: number }[];
  warnings: string[];
}

export function readResult(result: AnalysisResult): ReadResult {
  const s = result.settings as Record<string, unknown>;
  const m = result.noiseModel as (Record<string, unknown> & AnalysisResult['noiseModel']) | null;
  const warnings = (result as Record<string, unknown>).warnings;
  return {
    input: result.input,
    settings: {
      window: result.settings.window,
      segment: result.settings.segment,
      overlap: result.settings.overlap,
      averages: result.settings.averages,
      equivalentAverages: num(s.equivalentAverages),
      enbwHz: num(s.enbwHz),
    },
    floorHz2PerHz: result.whiteFloor.valueHz2PerHz,
    floorBandHz: result.whiteFloor.bandHz,
    intrinsicLinewidthHz: result.intrinsicLinewidthHz,
    beta: {
      observationTimeS: result.betaLine.observationTimeS,
      crossingHz: result.betaLine.crossingHz,
      areaHz2: result.betaLine.areaHz2,
      linewidthHz: result.betaLine.linewidthHz,
    },
    fwhmHz: result.lineshape.fwhmHz,
    model:
      m && m.whiteHz2PerHz !== null && m.flickerHz2 !== null && m.randomWalkHz3 !== null
        ? { whiteHz2PerHz: m.whiteHz2PerHz, flickerHz2: m.flickerHz2, randomWalkHz3: m.randomWalkHz3, cornerHz: m.cornerHz, bandHz: band(m.bandHz) }
        : null,
    spurs: result.spurs.map((x) => ({ frequencyHz: x.frequencyHz, heightDb: x.heightDb })),
    warnings: Array.isArray(warnings) ? warnings.filter((w): w is string => typeof w === 'string') : [],
  };
}

/** The figures and settings of an analysis as one JSON document (the "figures" export). */
export function figuresDocument(analysis: Analysis, context: { fileName?: string; laserName?: string | null }) {
  const r = analysis.result ? readResult(analysis.result) : null;
  return {
    exportedBy: 'Phaseloom',
    analysisId: analysis.id,
    captureId: analysis.captureId,
    fileName: context.fileName ?? null,
    laser: context.laserName ?? null,
    status: analysis.status,
    createdAt: analysis.createdAt,
    finishedAt: analysis.finishedAt,
    requestedSettings: analysis.settings,
    settings: r ? r.settings : null,
    input: r ? r.input : null,
    figures: r
      ? {
          intrinsicLinewidthHz: r.intrinsicLinewidthHz,
          whiteFloor: { valueHz2PerHz: r.floorHz2PerHz, bandHz: r.floorBandHz },
          betaLine: r.beta,
          lineshapeFwhmHz: r.fwhmHz,
          noiseModel: r.model,
          spurs: r.spurs,
        }
      : null,
    warnings: r ? r.warnings : [],
    units: {
      frequencies: 'Hz',
      linewidths: 'Hz (FWHM)',
      whiteFloor: 'Hz²/Hz (one-sided S_ν)',
      'noiseModel.flickerHz2': 'Hz²',
      'noiseModel.randomWalkHz3': 'Hz³',
      'betaLine.areaHz2': 'Hz²',
      observationTimeS: 's',
    },
  };
}

/** How capture kinds, setups and analysis windows are named on screen. */
import type { WindowName } from '../../../../server/contracts/analyses';
import type { CaptureFormat, CaptureKind, CaptureSetup } from '../../../../server/contracts/captures';

export const KIND_LABELS: Record<CaptureKind, string> = {
  phase: 'Phase (rad)',
  iq: 'IQ (I and Q)',
  beat: 'Beat note (real voltage)',
  frequency: 'Instantaneous frequency (Hz)',
};

/** short forms for tables */
export const KIND_SHORT: Record<CaptureKind, string> = {
  phase: 'phase',
  iq: 'IQ',
  beat: 'beat note',
  frequency: 'frequency',
};

export const SETUP_LABELS: Record<CaptureSetup, string> = {
  heterodyne: 'Heterodyne against a reference laser',
  'self-heterodyne': 'Delayed self-heterodyne',
  'coherent-receiver': 'Coherent (IQ) receiver',
  other: 'Other',
};

export const FORMAT_LABELS: Record<CaptureFormat, string> = {
  csv: 'CSV / TSV text',
  npy: 'NumPy .npy',
  wav: 'WAV',
  raw: 'raw binary',
};

export const WINDOW_LABELS: Record<WindowName, string> = {
  hann: 'Hann',
  'blackman-harris': 'Blackman–Harris, 4 terms',
  'flat-top': 'Flat-top',
};

/** "welch" → "Welch"; engine stage names are shown as they come, first letter up. */
export function stageLabel(stage: string): string {
  const s = stage.replace(/[-_]+/g, ' ').trim();
  return s ? s.charAt(0).toUpperCase() + s.slice(1) : '';
}

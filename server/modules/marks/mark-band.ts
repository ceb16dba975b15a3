/**
 * Where a mark may sit: inside the spectrum's band, from the lowest frequency of the capture's latest
 * done analysis up to the Nyquist frequency fs/2 (a one-sided spectrum ends there; common practice,
 * no source). A frequency or band edge outside it is refused with a message that names the field and
 * the band.
 */
import { AppError } from '../../errors';

export interface SpectrumBand {
  loHz: number;
  hiHz: number;
  /** true when hiHz is the Nyquist frequency of a known sample rate */
  nyquist: boolean;
}

/** 1530 → "1.53 kHz", 0.5 → "500 mHz", 50 → "50 Hz" (four significant digits at most). */
export function formatHz(v: number): string {
  const scales: [number, string][] = [
    [1e9, 'GHz'],
    [1e6, 'MHz'],
    [1e3, 'kHz'],
    [1, 'Hz'],
    [1e-3, 'mHz'],
  ];
  const [scale, unit] = scales.find(([s]) => Math.abs(v) >= s) ?? [1e-6, 'µHz'];
  return `${Number((v / scale).toPrecision(4))} ${unit}`;
}

export function spectrumBand(range: { lowestHz: number | null; highestHz: number | null; sampleRateHz: number | null }): SpectrumBand | null {
  const nyquistHz = range.sampleRateHz !== null && range.sampleRateHz > 0 ? range.sampleRateHz / 2 : null;
  const hiHz = nyquistHz ?? range.highestHz;
  if (range.lowestHz === null || hiHz === null || !(hiHz > range.lowestHz)) return null;
  return { loHz: range.lowestHz, hiHz, nyquist: nyquistHz !== null };
}

// display values carry 7 significant digits: an edge typed from the page must still count as inside
const inside = (v: number, band: SpectrumBand) => v >= band.loHz * (1 - 1e-6) && v <= band.hiHz * (1 + 1e-6);

/** 400 validation_failed when a frequency or band edge lies outside the spectrum's band. */
export function assertInsideBand(place: { frequencyHz?: number; bandHz?: readonly [number, number] }, band: SpectrumBand): void {
  const checks: [string, number][] =
    place.bandHz !== undefined
      ? [
          ['bandHz.0', place.bandHz[0]],
          ['bandHz.1', place.bandHz[1]],
        ]
      : place.frequencyHz !== undefined
        ? [['frequencyHz', place.frequencyHz]]
        : [];
  const bandText = `${formatHz(band.loHz)} to ${formatHz(band.hiHz)}${band.nyquist ? ' (the Nyquist frequency, half the sample rate)' : ''}`;
  const details = checks
    .filter(([, v]) => !inside(v, band))
    .map(([path, v]) => ({
      path,
      message: `${formatHz(v)} is ${v < band.loHz ? 'below' : 'above'} this spectrum's band, ${bandText}`,
    }));
  if (details.length === 0) return;
  const field = place.bandHz !== undefined ? 'bandHz' : 'frequencyHz';
  throw new AppError(400, 'validation_failed', `${field}: ${details.map((d) => d.message).join('; ')}`, details);
}

/**
 * The demo captures of the Larchmere Photonics Lab (samples/, written by `npm run samples`) uploaded
 * to the demo bench through the same service as a browser upload, so that a new user finds analysed
 * spectra at first sign-in. Idempotent: a file already on the bench (by name) is not uploaded again.
 * The operating points are part of the invented scenario, like the files.
 */
import path from 'node:path';
import { projectRoot } from '../../config/env';
import type { ParsedCaptureUploadFields } from '../../contracts/captures';
import type { BenchAccess } from '../benches/bench-policy';
import type { CapturesService } from './captures.service';

export interface DemoCapture {
  file: string;
  laser: string;
  /** what the file cannot tell, and how it was taken */
  fields: ParsedCaptureUploadFields;
}

export const DEMO_CAPTURES: readonly DemoCapture[] = [
  {
    file: 'kestrel-ecl-1550-iq.npy',
    laser: 'Kestrel ECL-1550',
    fields: {
      sampleRateHz: 250_000,
      setup: 'coherent-receiver',
      driveCurrentMa: 150,
      temperatureC: 25,
      outputPowerMw: 12,
      tags: ['demo', 'baseline'],
      notes: 'Coherent receiver against the cavity-stabilised reference, 10 kHz offset.',
    },
  },
  {
    file: 'kestrel-ecl-1550-phase.csv',
    laser: 'Kestrel ECL-1550',
    fields: {
      setup: 'heterodyne',
      setupParams: { referenceLinewidthHz: 1 },
      driveCurrentMa: 170,
      temperatureC: 25,
      outputPowerMw: 14,
      tags: ['demo'],
      notes: 'Phase record exported by the phase meter after the heterodyne beat.',
    },
  },
  {
    file: 'wren-dfb-1549-iq-int16.bin',
    laser: 'Wren DFB-1549',
    fields: {
      sampleRateHz: 500_000,
      dtype: 'int16',
      channels: 2,
      setup: 'coherent-receiver',
      driveCurrentMa: 120,
      temperatureC: 30,
      outputPowerMw: 8,
      tags: ['demo', 'mains'],
      notes: 'Digitiser dump; the 50 Hz line comes from the current driver.',
    },
  },
  {
    file: 'heron-fl-1560-beat.wav',
    laser: 'Heron FL-1560',
    fields: {
      kind: 'beat',
      setup: 'heterodyne',
      setupParams: { referenceLinewidthHz: 1 },
      driveCurrentMa: 400,
      temperatureC: 22,
      outputPowerMw: 50,
      tags: ['demo', 'relaxation-oscillation'],
      notes: 'Beat note at 48 kHz recorded with the audio digitiser; pump current given as drive current.',
    },
  },
];

/** Uploads the demo captures that are not on the bench yet; returns how many were added. */
export async function uploadDemoCaptures(options: {
  captures: CapturesService;
  /** an owner's or analyst's access to the demo bench (the uploader) */
  access: BenchAccess;
  /** laser name → laser id on the demo bench */
  laserIds: Record<string, string>;
  samplesDir?: string;
}): Promise<number> {
  const dir = options.samplesDir ?? path.join(projectRoot, 'samples');
  let added = 0;
  for (const demo of DEMO_CAPTURES) {
    if (await options.captures.findByFileName(options.access, demo.file)) continue;
    const laserId = options.laserIds[demo.laser];
    await options.captures.createFromPath(options.access, path.join(dir, demo.file), { ...demo.fields, ...(laserId ? { laserId } : {}) });
    added += 1;
  }
  return added;
}

/**
 * Demo data for the fictional Larchmere Photonics Lab: three people (password larchmere-demo-2026),
 * one bench with an owner, an analyst and a viewer, and three lasers. Idempotent: people are looked
 * up by e-mail, the bench by name among Mira's benches, members and lasers by e-mail and name, so a
 * second run adds nothing. Goes through the services, so the same rules apply as through the API.
 * Refuses NODE_ENV=production. Prints one summary line (or one error line and exits 1).
 * usage: tsx scripts/seed-demo.ts
 */
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Knex } from 'knex';
import { loadEnv } from '../server/config/env';
import type { BenchRole } from '../server/contracts/benches';
import type { LaserType } from '../server/contracts/lasers';
import { createDb } from '../server/db/knex';
import type { BenchAccess } from '../server/modules/benches/bench-policy';
import { createCapturesService } from '../server/modules/captures/captures.service';
import { uploadDemoCaptures } from '../server/modules/captures/demo-captures';
import { createServices, type Services } from '../server/services';
import { LocalDiskStorage } from '../server/storage/local-disk-storage';

export const DEMO_PASSWORD = 'larchmere-demo-2026';
export const DEMO_BENCH = {
  name: 'Larchmere narrow-linewidth bench',
  description: 'Larchmere Photonics Lab: frequency-noise captures of our narrow-linewidth lasers around 1550 nm.',
};

export const DEMO_PEOPLE: { key: 'mira' | 'tomas' | 'ines'; name: string; email: string; role: BenchRole }[] = [
  { key: 'mira', name: 'Mira Kestner', email: 'mira.kestner@example.org', role: 'owner' },
  { key: 'tomas', name: 'Tomas Aalto', email: 'tomas.aalto@example.org', role: 'analyst' },
  { key: 'ines', name: 'Ines Vale', email: 'ines.vale@example.org', role: 'viewer' },
];

export const DEMO_LASERS: { name: string; type: LaserType; wavelengthNm: number; notes: string }[] = [
  {
    name: 'Kestrel ECL-1550',
    type: 'external-cavity',
    wavelengthNm: 1550.12,
    notes: 'Quiet external-cavity laser; the reference for the other two.',
  },
  {
    name: 'Wren DFB-1549',
    type: 'dfb',
    wavelengthNm: 1549.32,
    notes: 'DFB with strong 1/f frequency noise and a 50 Hz mains spur.',
  },
  {
    name: 'Heron FL-1560',
    type: 'fibre',
    wavelengthNm: 1560.61,
    notes: 'Fibre laser; shows a relaxation-oscillation bump.',
  },
];

export interface SeedSummary {
  benchId: string;
  added: { people: number; benches: number; members: number; lasers: number; captures: number };
}

export interface DemoCaptureContext {
  db: Knex;
  services: Services;
  /** Mira's access to the demo bench (owner). */
  access: BenchAccess;
  /** laser name → laser id on the demo bench */
  laserIds: Record<string, string>;
  /** user key → user id */
  userIds: Record<'mira' | 'tomas' | 'ines', string>;
}

/**
 * Demo captures: upload the files in samples/ to the demo bench through the captures service (looked
 * up by file name, so a second run adds nothing) and return how many were added. Their analyses are
 * queued; the server's job runner analyses them as soon as it starts.
 */
export async function seedDemoCaptures(ctx: DemoCaptureContext): Promise<number> {
  const captures = createCapturesService({
    db: ctx.db,
    storage: new LocalDiskStorage(loadEnv().storageDir),
    lasers: ctx.services.lasers,
  });
  return uploadDemoCaptures({ captures, access: ctx.access, laserIds: ctx.laserIds });
}

export async function seedDemo(db: Knex, services: Services = createServices(db)): Promise<SeedSummary> {
  const added = { people: 0, benches: 0, members: 0, lasers: 0, captures: 0 };

  const userIds = {} as Record<'mira' | 'tomas' | 'ines', string>;
  for (const p of DEMO_PEOPLE) {
    let user = await services.auth.findUserByEmail(p.email);
    if (!user) {
      user = await services.auth.createAccount({ email: p.email, name: p.name, password: DEMO_PASSWORD });
      added.people += 1;
    }
    userIds[p.key] = user.id;
  }

  const miraId = userIds.mira;
  let bench = (await services.benches.list(miraId)).find((b) => b.name === DEMO_BENCH.name);
  if (!bench) {
    const created = await services.benches.create(miraId, DEMO_BENCH);
    bench = { ...created, memberCount: 1, laserCount: 0 };
    added.benches += 1;
  }
  const access = await services.benches.resolveAccess(miraId, bench.id);

  const members = await services.members.list(access);
  for (const p of DEMO_PEOPLE) {
    if (members.some((m) => m.userId === userIds[p.key])) continue;
    await services.members.add(access, { email: p.email, role: p.role });
    added.members += 1;
  }

  const laserIds: Record<string, string> = {};
  for (const l of DEMO_LASERS) {
    let laser = await services.lasers.findByName(access, l.name);
    if (!laser) {
      laser = await services.lasers.create(access, { name: l.name, type: l.type, wavelengthNm: l.wavelengthNm, notes: l.notes });
      added.lasers += 1;
    }
    laserIds[l.name] = laser.id;
  }

  added.captures = await seedDemoCaptures({ db, services, access, laserIds, userIds });
  return { benchId: bench.id, added };
}

function summaryLine(s: SeedSummary): string {
  const a = s.added;
  const total = a.people + a.benches + a.members + a.lasers + a.captures;
  if (total === 0) return `phaseloom: demo data already present ("${DEMO_BENCH.name}")`;
  return (
    `phaseloom: demo data: added ${a.people} people, ${a.benches} bench, ${a.members} memberships, ` +
    `${a.lasers} lasers, ${a.captures} captures ("${DEMO_BENCH.name}")`
  );
}

async function main(): Promise<void> {
  let env;
  try {
    env = loadEnv();
  } catch (e) {
    for (const line of (e as Error).message.split('\n').slice(1)) {
      process.stderr.write(`phaseloom: error: bad configuration: ${line}\n`);
    }
    process.exitCode = 1;
    return;
  }
  if (env.NODE_ENV === 'production') {
    process.stderr.write('phaseloom: error: the demo seed does not run with NODE_ENV=production\n');
    process.exitCode = 1;
    return;
  }
  const db = createDb(env);
  try {
    process.stderr.write(`${summaryLine(await seedDemo(db))}\n`);
  } catch (e) {
    process.stderr.write(`phaseloom: error: demo seed failed: ${(e as Error).message}\n`);
    process.exitCode = 1;
  } finally {
    await db.destroy();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  await main();
}

/**
 * An app on the test database with its own analysis job runner (one worker thread), for API tests
 * whose analyses must really run. Leftover queued or running rows of other files are marked failed
 * first, so they don't keep this file's worker busy.
 */
import type { Express } from 'express';
import { pino } from 'pino';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/config/env';
import { createAnalysisJobs, type AnalysisJobs } from '../../server/jobs/analysis-jobs';
import { createServices } from '../../server/services';
import type { Storage } from '../../server/storage/storage';
import { GENEROUS_LIMITS, PUBLIC_URL, testDb } from './api-app';

export async function startAppWithJobs(testFile: string, storage: Storage): Promise<{ app: Express; jobs: AnalysisJobs }> {
  const db = testDb();
  await db('analyses').whereIn('status', ['queued', 'running']).update({ status: 'failed', error: `cleared by ${testFile}` });
  const jobs = createAnalysisJobs({ db, storage, workers: 1 });
  const app = createApp({
    db,
    env: { ...loadEnv(), PHASELOOM_PUBLIC_URL: PUBLIC_URL },
    logger: pino({ level: 'silent' }),
    services: createServices(db),
    rateLimits: GENEROUS_LIMITS,
    storage,
    onAnalysesQueued: () => jobs.poke(),
  });
  await jobs.start();
  return { app, jobs };
}

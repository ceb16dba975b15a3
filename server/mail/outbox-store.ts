/**
 * The outbox folder: messages caught by the development mail catcher, one JSON file per message
 * (PHASELOOM_OUTBOX_DIR, default .data/outbox). The catcher writes; the server's /api/outbox and
 * the tests read. File names sort by arrival: <epoch ms, 15 digits>-<random>.json.
 */
import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { projectRoot } from '../config/env';
import type { OutboxMessage } from '../contracts/outbox';

export async function saveCaughtMessage(dir: string, message: Omit<OutboxMessage, 'id'>): Promise<OutboxMessage> {
  await mkdir(dir, { recursive: true });
  const id = `${String(Date.parse(message.receivedAt)).padStart(15, '0')}-${randomBytes(6).toString('hex')}`;
  const full: OutboxMessage = { id, ...message };
  const file = path.join(dir, `${id}.json`);
  // write then rename, so a reader never sees half a file
  await writeFile(`${file}.part`, JSON.stringify(full));
  await rename(`${file}.part`, file);
  return full;
}

/** Newest first; at most `limit`. A missing folder is an empty outbox. */
export async function listCaughtMessages(dir: string, limit = 200): Promise<OutboxMessage[]> {
  let names: string[];
  try {
    names = await readdir(dir);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw e;
  }
  const chosen = names
    .filter((n) => /^\d{15}-[0-9a-f]{12}\.json$/.test(n))
    .sort()
    .reverse()
    .slice(0, limit);
  const messages: OutboxMessage[] = [];
  for (const name of chosen) {
    try {
      messages.push(JSON.parse(await readFile(path.join(dir, name), 'utf8')) as OutboxMessage);
    } catch {
      // removed meanwhile, or not ours: skip it
    }
  }
  return messages;
}

/** PHASELOOM_OUTBOX_DIR resolved against the project root. */
export function outboxDirOf(env: { PHASELOOM_OUTBOX_DIR: string }): string {
  return path.resolve(projectRoot, env.PHASELOOM_OUTBOX_DIR);
}

// The mail path end to end: nodemailer over SMTP into the development mail catcher (smtp-server),
// kept in the outbox folder and listed by GET /api/outbox; the outbox is absent in production.
// Also the catcher's reading of MIME (RFC 2045 transfer encodings, RFC 2047 encoded words).
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/config/env';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { createSmtpMailer } from '../../server/mail/mailer';
import { decodeHeaderValue, readMessage } from '../../server/mail/mime-text';
import { listCaughtMessages } from '../../server/mail/outbox-store';
import { agent, closeTestDb, errorOf, makeTestApp } from '../helpers/api-app';

let catcher: MailCatcher;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-outbox-'));
  catcher = await startMailCatcher({ port: 0, dir });
});

afterAll(async () => {
  await catcher.close();
  rmSync(dir, { recursive: true, force: true });
  await closeTestDb();
});

describe('the mail catcher', () => {
  it('keeps a message sent by nodemailer over SMTP with its recipients, subject and UTF-8 text', async () => {
    const mailer = createSmtpMailer({ ...loadEnv(), NODE_ENV: 'test', PHASELOOM_SMTP_PORT: catcher.port });
    const text = `Line one — ünïcödé, a long line ${'x'.repeat(120)}\nLine two with = sign`;
    await mailer.send({ to: 'ines.vale@example.org', subject: 'Grüße — β-line report', text });
    const [m] = await listCaughtMessages(dir);
    expect(m.recipients).toEqual(['ines.vale@example.org']);
    expect(m.to).toContain('ines.vale@example.org');
    expect(m.subject).toBe('Grüße — β-line report');
    expect(m.text).toBe(text);
  });
});

describe('readMessage (RFC 2045 / RFC 2047)', () => {
  it('decodes base64 and Q encoded words, joining adjacent ones', () => {
    // "Grüße" in UTF-8: 47 72 C3 BC C3 9F 65
    expect(decodeHeaderValue('=?UTF-8?Q?Gr=C3=BC=C3=9Fe?= =?UTF-8?B?IQ==?=')).toBe('Grüße!');
    expect(decodeHeaderValue('=?utf-8?q?a_b?=')).toBe('a b');
  });

  it('reads quoted-printable with soft line breaks and the text part of a multipart message', () => {
    const raw = [
      'From: a@example.org',
      'To: b@example.org',
      'Subject: test',
      'Content-Type: multipart/alternative; boundary="XX"',
      '',
      '--XX',
      'Content-Type: text/plain; charset=utf-8',
      'Content-Transfer-Encoding: quoted-printable',
      '',
      'caf=C3=A9 and a soft=',
      ' break',
      '--XX',
      'Content-Type: text/html',
      '',
      '<p>html</p>',
      '--XX--',
      '',
    ].join('\r\n');
    expect(readMessage(raw)).toEqual({ from: 'a@example.org', to: 'b@example.org', subject: 'test', text: 'café and a soft break' });
  });
});

describe('GET /api/outbox', () => {
  it('lists caught messages newest first in development and test, filtered by recipient', async () => {
    const { app } = makeTestApp({ env: { PHASELOOM_OUTBOX_DIR: dir, NODE_ENV: 'test' } });
    const mailer = createSmtpMailer({ ...loadEnv(), NODE_ENV: 'test', PHASELOOM_SMTP_PORT: catcher.port });
    await mailer.send({ to: 'tomas.aalto@example.org', subject: 'second', text: 'two' });
    const all = await agent(app).get('/api/outbox');
    expect(all.status).toBe(200);
    expect(all.body.messages[0].subject).toBe('second');
    expect(all.body.messages.length).toBeGreaterThanOrEqual(2);
    const some = await agent(app).get('/api/outbox?to=TOMAS.AALTO@example.org');
    expect(some.body.messages.map((m: { subject: string }) => m.subject)).toEqual(['second']);
  });

  it('does not exist when NODE_ENV=production (404)', async () => {
    const { app } = makeTestApp({ env: { PHASELOOM_OUTBOX_DIR: dir, NODE_ENV: 'production' } });
    const res = await agent(app).get('/api/outbox');
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
  });
});

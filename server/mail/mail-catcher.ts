/**
 * The development mail catcher: an SMTP server (smtp-server package) on 127.0.0.1 that accepts every
 * message, without TLS or authentication, and keeps it in the outbox folder (outbox-store.ts). Used by
 * scripts/mail-catcher.ts (`npm start`, `npm test`) and started in-process by tests (port 0 = a free one).
 */
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { OutboxMessage } from '../contracts/outbox';
import { readMessage } from './mime-text';
import { saveCaughtMessage } from './outbox-store';

export interface MailCatcher {
  port: number;
  dir: string;
  close(): Promise<void>;
}

export interface MailCatcherOptions {
  host?: string;
  port: number;
  dir: string;
  /** told about each message kept */
  onMessage?: (m: OutboxMessage) => void;
  /** largest message accepted, bytes */
  maxBytes?: number;
}

export function startMailCatcher(options: MailCatcherOptions): Promise<MailCatcher> {
  const host = options.host ?? '127.0.0.1';
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Phaseloom development mail catcher',
    size: options.maxBytes ?? 10 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', callback);
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error('message too large'), { responseCode: 552 }));
          return;
        }
        const parsed = readMessage(Buffer.concat(chunks).toString('utf8'));
        saveCaughtMessage(options.dir, {
          receivedAt: new Date().toISOString(),
          recipients: session.envelope.rcptTo.map((r) => r.address),
          ...parsed,
        })
          .then((m) => {
            options.onMessage?.(m);
            callback();
          })
          .catch((e: Error) => callback(e));
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.on('error', reject);
    server.listen(options.port, host, () => {
      server.off('error', reject);
      const { port } = server.server.address() as AddressInfo;
      resolve({
        port,
        dir: options.dir,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}

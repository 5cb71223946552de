import fs from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import type { AddressObject } from 'mailparser';
import type { Logger } from 'pino';
import { SMTPServer } from 'smtp-server';
import { CaughtMail } from '../models';

export interface MailCatcher {
  port: number;
  url: string;
  stop(): Promise<void>;
}

export interface MailCatcherOptions {
  /** 0 (default) picks a free port. */
  port?: number;
  /** Folder for one .eml file per message (created owner-only), for whoever runs the machine. */
  emlDir?: string;
  logger?: Logger;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((item) => item.value.map((entry) => entry.address?.toLowerCase() ?? '')).filter(Boolean);
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
const header = (value: unknown) => (typeof value === 'string' ? value : null);
const idHeader = (value: unknown) => {
  const text = header(value);
  return text && uuidPattern.test(text) ? text : null;
};

/**
 * A local SMTP server on 127.0.0.1 that keeps every message instead of delivering it, for
 * development, demos and tests (used when SMTP_URL is not set). Each message is stored in
 * PostgreSQL, where the app shows it only to its addressee (and an invitation to the admin who
 * sent it), and written as an .eml file whose path is logged, so a person who is signed out
 * (a password reset) can be helped by whoever runs the machine.
 */
export async function startMailCatcher(options: MailCatcherOptions = {}): Promise<MailCatcher> {
  if (options.emlDir) fs.mkdirSync(options.emlDir, { recursive: true, mode: 0o700 });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Halflight mail catcher',
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks).toString('utf8');
          const parsed = await simpleParser(raw);
          const receivedAt = new Date();
          const mail = await CaughtMail.create({
            labId: idHeader(parsed.headers.get('x-halflight-lab')),
            kind: header(parsed.headers.get('x-halflight-kind')),
            senderId: idHeader(parsed.headers.get('x-halflight-sender')),
            fromAddress: parsed.from?.text ?? '',
            toAddresses: addresses(parsed.to),
            subject: parsed.subject ?? '(no subject)',
            textBody: parsed.text ?? '',
            htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
            raw,
            receivedAt,
          });
          if (options.emlDir) {
            const file = path.join(
              options.emlDir,
              `${receivedAt.toISOString().replace(/[:.]/g, '-')}-${mail.id.slice(0, 8)}.eml`,
            );
            fs.writeFileSync(file, raw, { mode: 0o600 });
            options.logger?.info(
              { caughtMail: { to: mail.toAddresses, subject: mail.subject, file } },
              `Caught mail to ${mail.toAddresses.join(', ')} saved as ${file}`,
            );
          }
          callback();
        } catch (error) {
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : (options.port ?? 0);
  return {
    port: boundPort,
    url: `smtp://127.0.0.1:${boundPort}`,
    stop: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

import { simpleParser } from 'mailparser';
import type { AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { CaughtMail } from '../models';

export interface MailCatcher {
  port: number;
  url: string;
  stop(): Promise<void>;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((item) => item.value.map((entry) => entry.address ?? '')).filter(Boolean);
}

/**
 * A local SMTP server on 127.0.0.1 that keeps every message in PostgreSQL instead of delivering
 * it, for development, demos and tests (used when SMTP_URL is not set). The sender's
 * X-Halflight-Lab header tags the message with its lab, so admins see only their lab's mail.
 */
export async function startMailCatcher(port = 0): Promise<MailCatcher> {
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
          const labHeader = parsed.headers.get('x-halflight-lab');
          await CaughtMail.create({
            labId: typeof labHeader === 'string' && /^[0-9a-f-]{36}$/.test(labHeader) ? labHeader : null,
            fromAddress: parsed.from?.text ?? '',
            toAddresses: addresses(parsed.to),
            subject: parsed.subject ?? '(no subject)',
            textBody: parsed.text ?? '',
            htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
            raw,
            receivedAt: new Date(),
          });
          callback();
        } catch (error) {
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: boundPort,
    url: `smtp://127.0.0.1:${boundPort}`,
    stop: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

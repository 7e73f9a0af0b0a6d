import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Database } from '../db/client';
import { mailMessages } from '../db/schema';

const addresses = (v: unknown): string[] => {
  const list = Array.isArray(v) ? v : v ? [v] : [];
  return list.flatMap((a: { value?: { address?: string }[] }) => (a.value ?? []).map((x) => x.address ?? '')).filter(Boolean);
};

/**
 * The local stand-in for a mail server (used when SMTP_URL is unset): it listens on 127.0.0.1 and
 * stores each message it receives, parsed, in mail_messages, where the Mailbox page reads it.
 */
export async function startFakeSmtp(db: Database, port = 0): Promise<{ url: string; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          await db.insert(mailMessages).values({
            from: addresses(mail.from)[0] ?? '',
            to: addresses(mail.to),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          });
          callback();
        })
        .catch((err) => callback(err as Error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const actual = typeof address === 'object' && address ? address.port : port;
  return { url: `smtp://127.0.0.1:${actual}`, close: () => new Promise((r) => server.close(() => r())) };
}

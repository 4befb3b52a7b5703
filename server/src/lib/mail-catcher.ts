// The local stand-in for a mail provider: an SMTP server on loopback that accepts everything
// and keeps it in the caught_mail table, where a steward can read it.
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { getSequelize } from '../db/sequelize';
import { log } from './logger';

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

export async function startMailCatcher(port = 0): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Sporewell local mail catcher',
    logger: false,
    size: 2 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks).toString('utf8');
          const parsed = await simpleParser(raw);
          const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
          await getSequelize().query(
            `INSERT INTO caught_mail (envelope_to, subject, body_text, raw) VALUES (:to, :subject, :text, :raw)`,
            { replacements: { to, subject: parsed.subject ?? '', text: parsed.text ?? '', raw } },
          );
          callback();
        } catch (error) {
          log.error('mail_catcher.store_failed', { error: (error as Error).message });
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  server.on('error', (error) => log.error('mail_catcher.error', { error: error.message }));
  const address = server.server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: actualPort,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

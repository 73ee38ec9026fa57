import { SMTPServer } from 'smtp-server';
import type { OutboxMessage } from './outbox-repository';

function decodeQuotedPrintable(s: string): string {
  const bytes: number[] = [];
  const soft = s.replace(/=\r?\n/g, '');
  for (let i = 0; i < soft.length; i++) {
    const c = soft[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(soft.slice(i + 1, i + 3))) {
      bytes.push(parseInt(soft.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      for (const b of Buffer.from(c, 'utf8')) bytes.push(b);
    }
  }
  return Buffer.from(bytes).toString('utf8');
}

function decodeWords(s: string): string {
  return s.replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_m, _cs, enc: string, text: string) =>
    enc.toUpperCase() === 'B' ? Buffer.from(text, 'base64').toString('utf8') : decodeQuotedPrintable(text.replace(/_/g, ' ')),
  );
}

/** Reads the headers and the plain-text body of a simple (single-part) message. */
function readMessage(raw: string): { headers: Record<string, string>; text: string } {
  const split = raw.search(/\r?\n\r?\n/);
  const head = split < 0 ? raw : raw.slice(0, split);
  const bodyRaw = split < 0 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const headers: Record<string, string> = {};
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const i = line.indexOf(':');
    if (i > 0) headers[line.slice(0, i).trim().toLowerCase()] = decodeWords(line.slice(i + 1).trim());
  }
  const cte = (headers['content-transfer-encoding'] ?? '7bit').toLowerCase();
  const text = cte === 'quoted-printable' ? decodeQuotedPrintable(bodyRaw) : cte === 'base64' ? Buffer.from(bodyRaw.replace(/\s+/g, ''), 'base64').toString('utf8') : bodyRaw;
  return { headers, text: text.replace(/\r\n/g, '\n') };
}

/** An SMTP server on loopback that hands every message it receives to `store`. */
export async function startFakeSmtp(store: (m: OutboxMessage) => void): Promise<{ port: number; close(): Promise<void> }> {
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    banner: 'Dubito development mail catcher',
    logger: false,
    size: 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        try {
          const raw = Buffer.concat(chunks).toString('utf8');
          const { headers, text } = readMessage(raw);
          const mailFrom = session.envelope.mailFrom;
          store({
            sender: (mailFrom && mailFrom.address) || headers.from || '',
            recipients: session.envelope.rcptTo.map((r) => r.address),
            subject: headers.subject ?? '',
            text,
            raw,
          });
          callback();
        } catch (e) {
          callback(e as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject, type EmailAddress } from 'mailparser';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import type { MailMessage } from './message-store';

export const maxMessageBytes = 5 * 1024 * 1024;

export interface SmtpIntake {
  port: number;
  close(): Promise<void>;
}

/**
 * An SMTP server that accepts any mail without TLS or credentials and hands each parsed message to
 * `onMessage`. STARTTLS is off because smtp-server's built-in certificate has expired; any AUTH
 * a client offers is accepted, so that an app configured with a user and password can still send.
 */
export async function startSmtpIntake(options: {
  port: number;
  host: string;
  onMessage: (message: MailMessage) => void;
}): Promise<SmtpIntake> {
  const server = new SMTPServer({
    banner: 'Keyloom local mailbox',
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    allowInsecureAuth: true,
    size: maxMessageBytes,
    logger: false,
    closeTimeout: 1000,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'local' });
    },
    onData(stream, session, callback) {
      receiveMessage(stream, session).then(
        (message) => {
          options.onMessage(message);
          callback(null, `Stored as ${message.id}`);
        },
        (error: unknown) => callback(error instanceof Error ? error : new Error(String(error))),
      );
    },
  });

  const port = await new Promise<number>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(options.port, options.host, () => {
      server.server.off('error', reject);
      resolve((server.server.address() as AddressInfo).port);
    });
  });

  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

async function receiveMessage(
  stream: SMTPServerDataStream,
  session: SMTPServerSession,
): Promise<MailMessage> {
  const raw = await readUpToLimit(stream);
  if (raw === undefined) {
    throw Object.assign(new Error('Message exceeds the 5 MB limit of this mailbox'), {
      responseCode: 552,
    });
  }
  const parsed = await simpleParser(raw);
  const envelopeFrom = session.envelope.mailFrom === false ? '' : session.envelope.mailFrom.address;
  return {
    id: randomUUID(),
    from: addressText(parsed.from) || envelopeFrom,
    to: session.envelope.rcptTo.map((recipient) => recipient.address),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    date: new Date().toISOString(),
  };
}

/** The whole message, or undefined when it is larger than the limit (the rest is read and dropped). */
async function readUpToLimit(stream: SMTPServerDataStream): Promise<Buffer | undefined> {
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of stream as AsyncIterable<Buffer>) {
    total += chunk.length;
    if (total <= maxMessageBytes) {
      chunks.push(chunk);
    }
  }
  if (stream.sizeExceeded || total > maxMessageBytes) {
    return undefined;
  }
  return Buffer.concat(chunks, total);
}

/** Addresses as a person writes them: `Name <address>`, or the bare address when there is no name. */
function addressText(address: AddressObject | AddressObject[] | undefined): string {
  if (address === undefined) {
    return '';
  }
  const headers = Array.isArray(address) ? address : [address];
  return headers.flatMap((header) => header.value.map(formatMailbox)).join(', ');
}

function formatMailbox(entry: EmailAddress): string {
  if (entry.group) {
    return `${entry.name}: ${entry.group.map(formatMailbox).join(', ')};`;
  }
  const address = entry.address ?? '';
  return entry.name ? `${entry.name} <${address}>` : address;
}

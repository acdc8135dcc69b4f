import { createServer } from 'node:http';
import { closeServer, httpUrl, listen } from '../http-listen';
import { createMailboxWebApp } from './mailbox-web';
import { MessageStore, type MailMessage } from './message-store';
import { startSmtpIntake } from './smtp-intake';

export type { MailMessage } from './message-store';

export interface MailboxOptions {
  smtpPort?: number;
  webPort?: number;
  host?: string;
}

export interface Mailbox {
  smtpPort: number;
  /** Base URL of the mailbox page and API, without a trailing slash. */
  webUrl: string;
  /** Received messages, newest first. */
  messages(): MailMessage[];
  clear(): void;
  close(): Promise<void>;
}

/** How many messages the mailbox keeps; older ones are dropped. */
export const mailboxCapacity = 500;

/** Starts an SMTP server that keeps what it receives, and a web page and JSON API to read it. */
export async function startMailbox(options: MailboxOptions = {}): Promise<Mailbox> {
  const host = options.host ?? '127.0.0.1';
  const store = new MessageStore(mailboxCapacity);

  const smtp = await startSmtpIntake({
    port: options.smtpPort ?? 0,
    host,
    onMessage: (message) => store.add(message),
  });

  const web = createServer(createMailboxWebApp(store, `${host}:${smtp.port}`));
  let webPort: number;
  try {
    webPort = await listen(web, options.webPort ?? 0, host);
  } catch (error) {
    await smtp.close();
    throw error;
  }

  return {
    smtpPort: smtp.port,
    webUrl: httpUrl(host, webPort),
    messages: () => store.list(),
    clear: () => {
      store.clear();
    },
    close: async () => {
      await Promise.all([smtp.close(), closeServer(web)]);
    },
  };
}

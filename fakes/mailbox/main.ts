import { closeOnSignal } from '../close-on-signal';
import { startMailbox } from './fake-mailbox';

const smtpPort = Number(process.env['FAKE_SMTP_PORT'] ?? 2525);
const webPort = Number(process.env['FAKE_MAILBOX_PORT'] ?? 3102);
const host = process.env['FAKE_HOST'] ?? '127.0.0.1';

const mailbox = await startMailbox({ smtpPort, webPort, host });
console.log(`Mailbox: SMTP on ${host}:${mailbox.smtpPort}, messages at ${mailbox.webUrl}`);
closeOnSignal('Mailbox', () => mailbox.close());

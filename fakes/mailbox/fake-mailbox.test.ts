import { createTransport } from 'nodemailer';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startMailbox, type MailMessage, type Mailbox } from './fake-mailbox';

let mailbox: Mailbox;
let transport: ReturnType<typeof createTransport>;

beforeAll(async () => {
  mailbox = await startMailbox();
  transport = createTransport({ host: '127.0.0.1', port: mailbox.smtpPort, secure: false });
});

afterAll(async () => {
  transport.close();
  await mailbox.close();
});

beforeEach(() => {
  mailbox.clear();
});

const inviteLink = 'http://127.0.0.1:3000/invites/abc123';

async function sendInvite(subject = 'You are invited to Copper Fen'): Promise<void> {
  await transport.sendMail({
    from: 'Keyloom <no-reply@keyloom.example>',
    to: ['tobias.reed@copperfen.example', 'Ada Quill <ada.quill@example.org>'],
    subject,
    text: `Mira invited you as an editor. Open ${inviteLink}.`,
    html: `<p>Mira invited you. <a href="${inviteLink}">Accept</a></p>`,
  });
}

describe('fake mailbox', () => {
  it('keeps a message sent over SMTP, readable through messages()', async () => {
    await sendInvite();
    const messages = mailbox.messages();
    expect(messages).toHaveLength(1);
    const [message] = messages;
    expect(message).toMatchObject({
      from: 'Keyloom <no-reply@keyloom.example>',
      to: ['tobias.reed@copperfen.example', 'ada.quill@example.org'],
      subject: 'You are invited to Copper Fen',
    });
    expect(message!.text).toContain(inviteLink);
    expect(message!.html).toContain(`<a href="${inviteLink}">Accept</a>`);
    expect(Number.isNaN(Date.parse(message!.date))).toBe(false);
  });

  it('lists messages newest first over the JSON API, filtered by recipient', async () => {
    await sendInvite('first');
    await transport.sendMail({
      from: 'a@keyloom.example',
      to: 'mira.vale@copperfen.example',
      subject: 'second',
      text: 'hi',
    });

    const all = (await (await fetch(`${mailbox.webUrl}/api/messages`)).json()) as MailMessage[];
    expect(all.map((message) => message.subject)).toEqual(['second', 'first']);

    const forMira = (await (
      await fetch(
        `${mailbox.webUrl}/api/messages?to=${encodeURIComponent('Mira.Vale@copperfen.example')}`,
      )
    ).json()) as MailMessage[];
    expect(forMira.map((message) => message.subject)).toEqual(['second']);

    const one = await fetch(`${mailbox.webUrl}/api/messages/${all[1]!.id}`);
    expect(((await one.json()) as MailMessage).subject).toBe('first');
    expect((await fetch(`${mailbox.webUrl}/api/messages/no-such-id`)).status).toBe(404);
  });

  it('escapes HTML in the list and on the message page, and links the addresses in the text', async () => {
    await sendInvite('<img src=x onerror=alert(1)> & "friends"');
    const list = await (await fetch(`${mailbox.webUrl}/`)).text();
    expect(list).toContain('<title>Keyloom mailbox (local)</title>');
    expect(list).toContain('&lt;img src=x onerror=alert(1)&gt; &amp; &quot;friends&quot;');
    expect(list).not.toContain('<img src=x');

    const [message] = mailbox.messages();
    const page = await (await fetch(`${mailbox.webUrl}/messages/${message!.id}`)).text();
    expect(page).not.toContain('<img src=x');
    expect(page).toContain(`<a href="${inviteLink}" rel="noreferrer">${inviteLink}</a>.`);
    expect(page).toMatch(/<iframe sandbox srcdoc="&lt;p&gt;Mira invited you\. &lt;a href=&quot;/);
    expect(page).not.toContain('<p>Mira invited you');
  });

  it('clears through clear() and through DELETE /api/messages', async () => {
    await sendInvite();
    expect(mailbox.messages()).toHaveLength(1);
    mailbox.clear();
    expect(mailbox.messages()).toHaveLength(0);

    await sendInvite();
    const response = await fetch(`${mailbox.webUrl}/api/messages`, { method: 'DELETE' });
    expect(response.status).toBe(200);
    expect(mailbox.messages()).toHaveLength(0);
    expect(await (await fetch(`${mailbox.webUrl}/api/messages`)).json()).toEqual([]);
  });

  it('refuses a message over 5 MB', async () => {
    const sending = transport.sendMail({
      from: 'a@keyloom.example',
      to: 'b@keyloom.example',
      subject: 'too big',
      text: 'x'.repeat(6 * 1024 * 1024),
    });
    await expect(sending).rejects.toThrow(/552|size|limit/i);
    expect(mailbox.messages()).toHaveLength(0);
  });
});

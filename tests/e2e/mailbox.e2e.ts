import nodemailer from 'nodemailer';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium, newPage, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

describe('the local mailbox page', () => {
  it('shows a message sent over SMTP, with its link clickable', async () => {
    const smtpPort = inject('mailboxSmtpPort');
    const transport = nodemailer.createTransport({
      host: '127.0.0.1',
      port: smtpPort,
      secure: false,
      ignoreTLS: true,
    });
    await transport.sendMail({
      from: 'Keyloom <keyloom@localhost>',
      to: 'tobias.reed@copperfen.example',
      subject: 'Mira Vale invites you to Copper Fen <as editor>',
      text: 'Join the band: http://127.0.0.1:3000/invites/example-token',
    });

    const page = await newPage(browser);
    await page.goto(inject('mailboxUrl'));
    const subject = page.getByRole('link', {
      name: 'Mira Vale invites you to Copper Fen <as editor>',
    });
    await subject.click();
    const link = page.getByRole('link', { name: 'http://127.0.0.1:3000/invites/example-token' });
    expect(await link.getAttribute('href')).toBe('http://127.0.0.1:3000/invites/example-token');
    await screenshot(page, 'mailbox-message');
    await page.close();
  });
});

import { escapeHtml } from '../escape-html';
import { htmlPage } from '../page-layout';
import type { MailMessage } from './message-store';

export const mailboxTitle = 'Keyloom mailbox (local)';
const standIn = 'an e-mail inbox';

const urlPattern = /\bhttps?:\/\/[^\s<>"']+/g;
const trailingPunctuation = /[.,;:!?)\]}]+$/;

export function messageListPage(messages: readonly MailMessage[], smtpAddress: string): string {
  const rows = messages
    .map(
      (message) => `
    <tr>
      <td>${escapeHtml(readableDate(message.date))}</td>
      <td>${escapeHtml(message.from)}</td>
      <td>${escapeHtml(message.to.join(', '))}</td>
      <td><a href="/messages/${encodeURIComponent(message.id)}">${escapeHtml(message.subject || '(no subject)')}</a></td>
    </tr>`,
    )
    .join('');

  const content =
    messages.length === 0
      ? '<p class="muted">No messages yet.</p>'
      : `<table>
  <thead><tr><th>Received</th><th>From</th><th>To</th><th>Subject</th></tr></thead>
  <tbody>${rows}
  </tbody>
</table>
<form method="post" action="/clear">
  <p><button type="submit">Delete all messages</button></p>
</form>`;

  return htmlPage(
    mailboxTitle,
    standIn,
    `<h1>${mailboxTitle}</h1>
<p class="notice">A local stand-in for an e-mail inbox: everything sent to SMTP <code>${escapeHtml(smtpAddress)}</code> lands here, whoever it is addressed to. Nothing is delivered anywhere else.</p>
<p><a class="button" href="/">Refresh</a> <span class="muted">${messages.length} message${messages.length === 1 ? '' : 's'}, newest first</span></p>
${content}`,
  );
}

export function messagePage(message: MailMessage): string {
  const htmlPart =
    message.html === null
      ? ''
      : `<h2>HTML part</h2>
<iframe sandbox srcdoc="${escapeHtml(message.html)}" title="HTML part of the message"></iframe>`;

  return htmlPage(
    `${message.subject || '(no subject)'} - ${mailboxTitle}`,
    standIn,
    `<p><a href="/">Back to all messages</a></p>
<h1>${escapeHtml(message.subject || '(no subject)')}</h1>
<dl>
  <dt>From</dt><dd>${escapeHtml(message.from)}</dd>
  <dt>To</dt><dd>${escapeHtml(message.to.join(', '))}</dd>
  <dt>Received</dt><dd>${escapeHtml(readableDate(message.date))}</dd>
</dl>
<h2>Text</h2>
<pre>${linkify(message.text) || '<span class="muted">(no text part)</span>'}</pre>
${htmlPart}`,
  );
}

export function notFoundPage(): string {
  return htmlPage(
    `Not found - ${mailboxTitle}`,
    standIn,
    `<h1>Not found</h1>
<p>There is no such message; it may have been deleted.</p>
<p><a href="/">Back to all messages</a></p>`,
  );
}

/** Escapes plain text and turns the http(s) addresses in it into links. */
export function linkify(text: string): string {
  let html = '';
  let position = 0;
  for (const match of text.matchAll(urlPattern)) {
    const url = match[0].replace(trailingPunctuation, '');
    html += escapeHtml(text.slice(position, match.index));
    html += `<a href="${escapeHtml(url)}" rel="noreferrer">${escapeHtml(url)}</a>`;
    position = match.index + url.length;
  }
  return html + escapeHtml(text.slice(position));
}

function readableDate(isoDate: string): string {
  return isoDate.replace('T', ' ').replace(/\.\d+Z$/, ' UTC');
}

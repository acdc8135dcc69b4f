import { escapeHtml } from '../escape-html';
import { htmlPage } from '../page-layout';
import type { GitHubIdentity } from './identities';

/** The query of an authorize request, carried through the sign-in page's forms unchanged. */
export interface AuthorizeRequest {
  clientId: string;
  redirectUri: string;
  state: string | undefined;
  scope: string | undefined;
}

export const signInPageTitle = 'Fake GitHub sign-in';
const standIn = 'GitHub sign-in';

export function signInPage(
  request: AuthorizeRequest,
  identities: readonly GitHubIdentity[],
): string {
  const hiddenFields = [
    hiddenField('client_id', request.clientId),
    hiddenField('redirect_uri', request.redirectUri),
    request.state === undefined ? '' : hiddenField('state', request.state),
    request.scope === undefined ? '' : hiddenField('scope', request.scope),
  ].join('');

  const identityRows = identities
    .map(
      (identity) => `
      <tr>
        <td><img src="/avatars/${escapeHtml(identity.login)}.svg" alt="" width="32" height="32"></td>
        <td><strong>${escapeHtml(identity.name)}</strong> <span class="muted">@${escapeHtml(identity.login)}</span><br>
          <span class="muted">${escapeHtml(identity.note)}</span></td>
        <td><button type="submit" name="login" value="${escapeHtml(identity.login)}" class="primary">Sign in as ${escapeHtml(identity.name)}</button></td>
      </tr>`,
    )
    .join('');

  const scopeText = request.scope
    ? `<p class="muted">Requested scope: <code>${escapeHtml(request.scope)}</code></p>`
    : '';

  return htmlPage(
    signInPageTitle,
    standIn,
    `<h1>${signInPageTitle}</h1>
<p class="notice">This is a local stand-in for GitHub, for development and tests. No password is asked and nothing leaves this computer.</p>
<p>The application <code>${escapeHtml(request.clientId)}</code> asks who you are. After you choose, you return to
<code>${escapeHtml(request.redirectUri)}</code>.</p>
${scopeText}
<h2>Demo people</h2>
<form method="get" action="/login/oauth/authorize">
${hiddenFields}
<table>
  <thead><tr><th></th><th>Person</th><th></th></tr></thead>
  <tbody>${identityRows}
  </tbody>
</table>
</form>
<h2>Someone else</h2>
<form method="get" action="/login/oauth/authorize">
${hiddenFields}
<label for="login">GitHub login</label>
<input type="text" id="login" name="login" required maxlength="39" pattern="[A-Za-z0-9](?:[A-Za-z0-9]|-(?=[A-Za-z0-9])){0,38}" autocomplete="off" placeholder="for example new-player">
<button type="submit">Sign in with this login</button>
<p class="muted">A new login gets an account of its own that stays the same each time you use it.</p>
</form>`,
  );
}

export function errorPage(title: string, message: string): string {
  return htmlPage(
    `${title} - Fake GitHub`,
    standIn,
    `<h1>${escapeHtml(title)}</h1>
<p>${escapeHtml(message)}</p>
<p class="muted">This is a local stand-in for GitHub, for development and tests.</p>`,
  );
}

export function profilePage(identity: GitHubIdentity): string {
  return htmlPage(
    `${identity.login} - Fake GitHub`,
    standIn,
    `<h1><img src="/avatars/${escapeHtml(identity.login)}.svg" alt="" width="48" height="48"> ${escapeHtml(identity.name)}</h1>
<p class="notice">A person of the local stand-in for GitHub.</p>
<dl>
  <dt>Login</dt><dd>${escapeHtml(identity.login)}</dd>
  <dt>Id</dt><dd>${identity.id}</dd>
  <dt>E-mail</dt><dd>${escapeHtml(identity.email)}</dd>
  ${identity.note ? `<dt>Note</dt><dd>${escapeHtml(identity.note)}</dd>` : ''}
</dl>`,
  );
}

function hiddenField(name: string, value: string): string {
  return `<input type="hidden" name="${name}" value="${escapeHtml(value)}">`;
}

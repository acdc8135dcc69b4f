import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';

export interface GitHubIdentity {
  id: number;
  login: string;
  name: string;
  email: string;
  /** Who this person is in the demo scenario; empty for logins typed on the sign-in page. */
  note: string;
}

/** GitHub's rule: letters, digits and single hyphens, not at either end, at most 39 characters. */
const loginPattern = /^[A-Za-z0-9](?:[A-Za-z0-9]|-(?=[A-Za-z0-9])){0,38}$/;

const generatedIdFloor = 200_000;
const generatedIdSpan = 800_000;

let cachedDemoIdentities: readonly GitHubIdentity[] | undefined;

/** The demo people of `identities.json`; the server's demo seed uses the same ids. */
export function demoIdentities(): readonly GitHubIdentity[] {
  cachedDemoIdentities ??= parseIdentities(
    readFileSync(new URL('./identities.json', import.meta.url), 'utf8'),
  );
  return cachedDemoIdentities;
}

export function isValidLogin(login: string): boolean {
  return loginPattern.test(login);
}

/**
 * The identity for a login: a demo person when the login is one of theirs (compared without regard to
 * case, as GitHub does), otherwise a new person whose id is derived from the login, so that signing in
 * with the same login twice gives the same account. Returns undefined for a malformed login.
 */
export function identityForLogin(login: string): GitHubIdentity | undefined {
  if (!isValidLogin(login)) {
    return undefined;
  }
  const lowerLogin = login.toLowerCase();
  const demo = demoIdentities().find((identity) => identity.login.toLowerCase() === lowerLogin);
  if (demo) {
    return demo;
  }
  return {
    id: generatedIdForLogin(lowerLogin),
    login,
    name: login,
    email: `${lowerLogin}@users.keyloom.example`,
    note: '',
  };
}

/** A stable id in 200000..999999, well away from the demo ids. */
export function generatedIdForLogin(login: string): number {
  const digest = createHash('sha256').update(login.toLowerCase()).digest();
  return generatedIdFloor + (digest.readUInt32BE(0) % generatedIdSpan);
}

function parseIdentities(json: string): GitHubIdentity[] {
  const parsed: unknown = JSON.parse(json);
  if (!Array.isArray(parsed)) {
    throw new Error('identities.json must hold an array of identities');
  }
  return parsed.map((entry: unknown, index) => {
    const record = (entry ?? {}) as Record<string, unknown>;
    const { id, login, name, email, note } = record;
    if (
      typeof id !== 'number' ||
      !Number.isInteger(id) ||
      typeof login !== 'string' ||
      !isValidLogin(login) ||
      typeof name !== 'string' ||
      typeof email !== 'string'
    ) {
      throw new Error(
        `identities.json entry ${index} needs an integer id, a valid login, a name and an email`,
      );
    }
    return { id, login, name, email, note: typeof note === 'string' ? note : '' };
  });
}

import { randomBytes } from 'node:crypto';

/** GitHub's authorization codes expire after ten minutes. */
export const codeLifetimeMs = 10 * 60 * 1000;

interface PendingCode {
  login: string;
  clientId: string;
  redirectUri: string;
  scope: string;
  expiresAt: number;
}

export interface IssuedToken {
  accessToken: string;
  scope: string;
}

export type RedeemResult =
  | { ok: true; token: IssuedToken }
  | { ok: false; error: 'bad_verification_code' | 'redirect_uri_mismatch'; description: string };

/** Authorization codes (single use, short-lived) and the access tokens they turn into, in memory. */
export class OAuthGrants {
  private readonly codes = new Map<string, PendingCode>();
  private readonly tokens = new Map<string, string>();

  issueCode(grant: {
    login: string;
    clientId: string;
    redirectUri: string;
    scope: string;
  }): string {
    this.forgetExpiredCodes();
    const code = randomBytes(10).toString('hex');
    this.codes.set(code, { ...grant, expiresAt: Date.now() + codeLifetimeMs });
    return code;
  }

  /**
   * Trades a code for a token. A code is spent by its first successful trade; a code that is unknown,
   * spent, expired or issued to another client is refused, as is a redirect_uri other than the one the
   * code was issued for (when the caller sends one).
   */
  redeemCode(code: string, clientId: string, redirectUri: string | undefined): RedeemResult {
    const pending = this.codes.get(code);
    if (!pending || pending.clientId !== clientId || pending.expiresAt <= Date.now()) {
      if (pending && pending.expiresAt <= Date.now()) {
        this.codes.delete(code);
      }
      return {
        ok: false,
        error: 'bad_verification_code',
        description: 'The code passed is incorrect or expired.',
      };
    }
    if (redirectUri !== undefined && redirectUri !== pending.redirectUri) {
      return {
        ok: false,
        error: 'redirect_uri_mismatch',
        description:
          'The redirect_uri MUST match the registered callback URL for this application.',
      };
    }
    this.codes.delete(code);
    const accessToken = `gho_${randomBytes(18).toString('hex')}`;
    this.tokens.set(accessToken, pending.login);
    return { ok: true, token: { accessToken, scope: pending.scope } };
  }

  loginForToken(accessToken: string): string | undefined {
    return this.tokens.get(accessToken);
  }

  private forgetExpiredCodes(): void {
    const now = Date.now();
    for (const [code, pending] of this.codes) {
      if (pending.expiresAt <= now) {
        this.codes.delete(code);
      }
    }
  }
}

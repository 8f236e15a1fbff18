// Reads the session id out of the Auth.js session cookie. Auth.js's own getSession runs its whole session
// action for that — deriving the key again and re-encrypting a refreshed cookie that nobody sends back —
// which cost more than the request's real work. Here the key is derived once per process and the
// cookie is only decrypted. The format is Auth.js's (@auth/core jwt.ts): a JWE, "dir" with
// A256CBC-HS512, keyed by HKDF-SHA256 of the secret with the cookie's name as salt.
import { hkdfSync } from 'node:crypto';
import { parse as parseCookies } from 'cookie';
import { jwtDecrypt } from 'jose';

export interface SessionCookieReader {
  /** The `sid` the cookie carries, or undefined for no cookie, a forged, expired or unreadable one. */
  sessionId(cookieHeader: string | undefined): Promise<string | undefined>;
}

/** Auth.js's cookie name: the __Secure- prefix when cookies are marked secure. */
export function sessionCookieName(secureCookies: boolean): string {
  return `${secureCookies ? '__Secure-' : ''}authjs.session-token`;
}

export function sessionCookieReader(opts: { secret: string; secureCookies: boolean }): SessionCookieReader {
  const name = sessionCookieName(opts.secureCookies);
  const key = new Uint8Array(hkdfSync('sha256', opts.secret, name, `Auth.js Generated Encryption Key (${name})`, 64));
  return {
    async sessionId(cookieHeader) {
      // A session that would not fit one cookie is split by Auth.js into name.0, name.1…; ours carries
      // only an id, so it never is, and a split one is not ours.
      const token = cookieHeader ? parseCookies(cookieHeader)[name] : undefined;
      if (!token) return undefined;
      try {
        const { payload } = await jwtDecrypt(token, key, {
          clockTolerance: 15,
          keyManagementAlgorithms: ['dir'],
          contentEncryptionAlgorithms: ['A256CBC-HS512'],
        });
        return typeof payload.sid === 'string' ? payload.sid : undefined;
      } catch {
        return undefined;
      }
    },
  };
}

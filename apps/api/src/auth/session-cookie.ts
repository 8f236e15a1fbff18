// Reads the session id out of the Auth.js session cookie. Auth.js's own getSession runs its whole session
// action for that — deriving the key again and re-encrypting a refreshed cookie that nobody sends back —
// which cost more than the request's real work. Here the key is derived once per process and the
// cookie is only decrypted. The format is Auth.js's (@auth/core jwt.ts): a JWE, "dir" with
// A256CBC-HS512, keyed by HKDF-SHA256 of the secret with the cookie's name as salt.
// Decrypting still cost a quarter to half a millisecond of CPU (jose runs it through WebCrypto), on every request
// of a person who sends the same cookie each time: so a cookie that decrypted is remembered, exactly as
// sent, with its id and expiry. Only our key can make a cookie that decrypts, so nobody can plant an
// entry; the session row is still read from the database on every request, so sign-out and revocation
// take effect at once; and a remembered cookie stops counting at the expiry it carried.
import { hkdfSync } from 'node:crypto';
import { parse as parseCookies } from 'cookie';
import { jwtDecrypt } from 'jose';
import { LRUCache } from 'lru-cache';

export interface SessionCookieReader {
  /** The `sid` the cookie carries, or undefined for no cookie, a forged, expired or unreadable one. */
  sessionId(cookieHeader: string | undefined): Promise<string | undefined>;
}

/** Auth.js's cookie name: the __Secure- prefix when cookies are marked secure. */
export function sessionCookieName(secureCookies: boolean): string {
  return `${secureCookies ? '__Secure-' : ''}authjs.session-token`;
}

/** Seconds of clock difference allowed on a cookie's expiry (as Auth.js's own reading allows). */
const CLOCK_TOLERANCE = 15;

/** Cookies remembered at most: one per person active at once, a few hundred bytes each. */
const REMEMBERED_COOKIES = 10_000;

interface Decrypted {
  sid: string | undefined;
  /** The token's `exp` in seconds since the epoch, when it has one. */
  exp: number | undefined;
}

export function sessionCookieReader(opts: { secret: string; secureCookies: boolean }): SessionCookieReader {
  const name = sessionCookieName(opts.secureCookies);
  const key = new Uint8Array(hkdfSync('sha256', opts.secret, name, `Auth.js Generated Encryption Key (${name})`, 64));
  const decrypted = new LRUCache<string, Decrypted>({ max: REMEMBERED_COOKIES });
  return {
    async sessionId(cookieHeader) {
      // A session that would not fit one cookie is split by Auth.js into name.0, name.1…; ours carries
      // only an id, so it never is, and a split one is not ours.
      const token = cookieHeader ? parseCookies(cookieHeader)[name] : undefined;
      if (!token) return undefined;
      const known = decrypted.get(token);
      if (known) {
        if (known.exp === undefined || known.exp > Math.floor(Date.now() / 1000) - CLOCK_TOLERANCE) return known.sid;
        decrypted.delete(token);
        return undefined;
      }
      try {
        const { payload } = await jwtDecrypt(token, key, {
          clockTolerance: CLOCK_TOLERANCE,
          keyManagementAlgorithms: ['dir'],
          contentEncryptionAlgorithms: ['A256CBC-HS512'],
        });
        const sid = typeof payload.sid === 'string' ? payload.sid : undefined;
        decrypted.set(token, { sid, exp: payload.exp });
        return sid;
      } catch {
        return undefined;
      }
    },
  };
}

// The session cookie reader against tokens made the way Auth.js makes them (@auth/core jwt.ts encode:
// EncryptJWT, alg "dir", enc A256CBC-HS512, key = HKDF-SHA256(secret, salt = cookie name,
// info "Auth.js Generated Encryption Key (<name>)", 64 bytes)). The real Auth.js cookie is read in
// tests/api/session-cookie.test.ts.
import { hkdfSync, randomUUID } from 'node:crypto';
import { EncryptJWT } from 'jose';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { sessionCookieName, sessionCookieReader } from './session-cookie.ts';

const secret = 'a-test-secret-of-at-least-thirty-two-characters';

async function authJsToken(opts: { secret: string; name: string; sid: unknown; expiresIn?: number }) {
  const key = new Uint8Array(hkdfSync('sha256', opts.secret, opts.name, `Auth.js Generated Encryption Key (${opts.name})`, 64));
  const now = Math.floor(Date.now() / 1000);
  return new EncryptJWT({ sid: opts.sid, sub: randomUUID() })
    .setProtectedHeader({ alg: 'dir', enc: 'A256CBC-HS512' })
    .setIssuedAt()
    .setExpirationTime(now + (opts.expiresIn ?? 3600))
    .setJti(randomUUID())
    .encrypt(key);
}

describe('session cookie reader', () => {
  const reader = sessionCookieReader({ secret, secureCookies: false });
  const name = sessionCookieName(false);

  it('reads the session id among other cookies', async () => {
    const sid = randomUUID();
    const token = await authJsToken({ secret, name, sid });
    expect(await reader.sessionId(`theme=dark; ${name}=${token}; other=1`)).toBe(sid);
  });

  it('refuses a token made with another secret, an expired one, a tampered one and a missing one', async () => {
    const sid = randomUUID();
    expect(await reader.sessionId(`${name}=${await authJsToken({ secret: `${secret}-other`, name, sid })}`)).toBeUndefined();
    expect(await reader.sessionId(`${name}=${await authJsToken({ secret, name, sid, expiresIn: -60 })}`)).toBeUndefined();
    const token = await authJsToken({ secret, name, sid });
    const tampered = token.slice(0, -4) + (token.endsWith('AAAA') ? 'BBBB' : 'AAAA');
    expect(await reader.sessionId(`${name}=${tampered}`)).toBeUndefined();
    expect(await reader.sessionId(`${name}=not-a-token`)).toBeUndefined();
    expect(await reader.sessionId(undefined)).toBeUndefined();
    expect(await reader.sessionId('theme=dark')).toBeUndefined();
  });

  describe('a cookie read before (remembered, not decrypted again)', () => {
    afterEach(() => vi.useRealTimers());

    it('gives the same id again, and nothing once the expiry it carried has passed', async () => {
      vi.useFakeTimers({ toFake: ['Date'] });
      const remembering = sessionCookieReader({ secret, secureCookies: false });
      const sid = randomUUID();
      const cookie = `${name}=${await authJsToken({ secret, name, sid, expiresIn: 60 })}`;
      expect(await remembering.sessionId(cookie)).toBe(sid);
      expect(await remembering.sessionId(`other=1; ${cookie}`)).toBe(sid);
      vi.setSystemTime(Date.now() + 60_000);
      // Within the clock tolerance it still counts, as it would when decrypted.
      expect(await remembering.sessionId(cookie)).toBe(sid);
      vi.setSystemTime(Date.now() + 16_000);
      expect(await remembering.sessionId(cookie)).toBeUndefined();
      expect(await remembering.sessionId(cookie)).toBeUndefined();
    });

    it('does not accept a tampered copy of it, nor remember a cookie that failed', async () => {
      const remembering = sessionCookieReader({ secret, secureCookies: false });
      const sid = randomUUID();
      const token = await authJsToken({ secret, name, sid });
      expect(await remembering.sessionId(`${name}=${token}`)).toBe(sid);
      const tampered = token.slice(0, -4) + (token.endsWith('AAAA') ? 'BBBB' : 'AAAA');
      expect(await remembering.sessionId(`${name}=${tampered}`)).toBeUndefined();
      const forged = await authJsToken({ secret: `${secret}-other`, name, sid });
      expect(await remembering.sessionId(`${name}=${forged}`)).toBeUndefined();
      expect(await remembering.sessionId(`${name}=${forged}`)).toBeUndefined();
      expect(await remembering.sessionId(`${name}=${token}`)).toBe(sid);
    });
  });

  it('takes no id that is not a string', async () => {
    expect(await reader.sessionId(`${name}=${await authJsToken({ secret, name, sid: 42 })}`)).toBeUndefined();
  });

  it('behind HTTPS reads only the __Secure- cookie, keyed by that name', async () => {
    const secure = sessionCookieReader({ secret, secureCookies: true });
    const secureName = sessionCookieName(true);
    expect(secureName).toBe('__Secure-authjs.session-token');
    const sid = randomUUID();
    expect(await secure.sessionId(`${secureName}=${await authJsToken({ secret, name: secureName, sid })}`)).toBe(sid);
    // The plain cookie's key differs (its name is the salt), and its name is not the one read.
    expect(await secure.sessionId(`${name}=${await authJsToken({ secret, name, sid })}`)).toBeUndefined();
  });
});

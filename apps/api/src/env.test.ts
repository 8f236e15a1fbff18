import { describe, expect, it } from 'vitest';
import { MissingSettingsError, readEnv } from './env.ts';

const production = {
  DATABASE_URL: 'postgres://admin:pw@db.internal:5432/postgres',
  APP_ORIGIN: 'https://ops.example.com',
  AUTH_SECRET: 'x'.repeat(40),
  SMTP_URL: 'smtps://mailer:pw@smtp.example.com',
  TWILIO_ACCOUNT_SID: 'AC0123',
  TWILIO_AUTH_TOKEN: 'token',
  TWILIO_FROM: '+13125550100',
};

describe('readEnv', () => {
  it('is production unless demo mode is asked for, and refuses to run without each real setting, naming it', () => {
    let caught: unknown;
    try {
      readEnv({});
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(MissingSettingsError);
    const names = (caught as MissingSettingsError).missing.map((m) => m.name);
    expect(names).toEqual([
      'DATABASE_URL',
      'APP_ORIGIN',
      'AUTH_SECRET',
      'SMTP_URL',
      'TWILIO_ACCOUNT_SID',
      'TWILIO_AUTH_TOKEN',
      'TWILIO_FROM',
    ]);
    expect((caught as Error).message).toMatch(/SMTP_URL: the mail server/);
  });

  it('names only what is missing', () => {
    const { SMTP_URL: _mail, TWILIO_AUTH_TOKEN: _sms, ...partial } = production;
    expect(() => readEnv(partial)).toThrow(/SMTP_URL[\s\S]*TWILIO_AUTH_TOKEN/);
    expect(() => readEnv(partial)).not.toThrow(/AUTH_SECRET:/);
  });

  it('takes a complete production configuration as given', () => {
    const env = readEnv(production);
    expect(env).toMatchObject({
      mode: 'production',
      appOrigin: 'https://ops.example.com',
      smtpUrl: production.SMTP_URL,
      twilio: { accountSid: 'AC0123', authToken: 'token', from: '+13125550100' },
    });
  });

  it('runs the demo with nothing set', () => {
    const env = readEnv({ BUMPERLINE_MODE: 'demo', PORT: '3100' });
    expect(env).toMatchObject({ mode: 'demo', appOrigin: 'http://127.0.0.1:3100' });
    expect('authSecret' in env && env.authSecret).toBeFalsy(); // made per installation at start, never a constant
  });

  it('reads the trust-proxy setting as Express understands it', () => {
    const demo = { BUMPERLINE_MODE: 'demo' };
    expect(readEnv(demo).TRUST_PROXY).toBe('loopback');
    expect(readEnv({ ...demo, TRUST_PROXY: 'false' }).TRUST_PROXY).toBe(false);
    expect(readEnv({ ...demo, TRUST_PROXY: '2' }).TRUST_PROXY).toBe(2);
    expect(readEnv({ ...demo, TRUST_PROXY: '10.0.0.0/8, 127.0.0.1' }).TRUST_PROXY).toBe('10.0.0.0/8, 127.0.0.1');
  });
});

import { mkdtempSync, statSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { installationSecrets } from './installation-secrets.ts';

describe('installationSecrets', () => {
  it('makes random secrets once per installation and keeps them, readable only by their owner', () => {
    const a = mkdtempSync(path.join(os.tmpdir(), 'bl-secrets-'));
    const b = mkdtempSync(path.join(os.tmpdir(), 'bl-secrets-'));
    const first = installationSecrets(a);
    expect(installationSecrets(a)).toEqual(first);
    expect(installationSecrets(b).authSecret).not.toBe(first.authSecret);
    expect(installationSecrets(b).smsAuthToken).not.toBe(first.smsAuthToken);
    expect(statSync(path.join(a, 'demo-secrets.json')).mode & 0o077).toBe(0);
  });
});

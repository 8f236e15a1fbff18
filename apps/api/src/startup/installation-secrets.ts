// Secrets for a demo installation: random, made on the first start and kept in the data folder (mode 600),
// so sessions survive a restart and nothing can be derived from the source. Production takes its secrets
// from settings instead (see env.ts).
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

const stored = z.object({ authSecret: z.string().min(32), smsAuthToken: z.string().min(32) });
export type InstallationSecrets = z.infer<typeof stored>;

export function installationSecrets(dataDir: string): InstallationSecrets {
  const file = path.join(dataDir, 'demo-secrets.json');
  if (existsSync(file)) {
    const parsed = stored.safeParse(JSON.parse(readFileSync(file, 'utf8')));
    if (parsed.success) return parsed.data;
  }
  const fresh: InstallationSecrets = {
    authSecret: randomBytes(32).toString('base64url'),
    smsAuthToken: randomBytes(32).toString('hex'),
  };
  mkdirSync(dataDir, { recursive: true });
  writeFileSync(file, JSON.stringify(fresh), { mode: 0o600 });
  return fresh;
}

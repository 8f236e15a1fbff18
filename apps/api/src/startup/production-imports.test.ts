// A production start must not even load the demo's fakes: they may only be reached through the dynamic
// import of startup/demo.ts that main.ts makes in demo mode. This walks the static imports from main.ts.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../..');
const workspaces: Record<string, string> = {
  '@bumperline/api': 'apps/api/src',
  '@bumperline/db': 'packages/db/src',
  '@bumperline/contracts': 'packages/contracts/src',
  '@bumperline/domain': 'packages/domain/src',
  '@bumperline/fakes': 'fakes/src',
};
// Static imports and re-exports that bring code at run time (type-only ones bring nothing).
const STATIC_IMPORT = /^\s*(?:import|export)\s+(?!type\b)(?:[^'";]*?\sfrom\s+)?'([^']+)'/gm;

function resolve(spec: string, from: string): string | undefined {
  if (spec.startsWith('.')) return path.resolve(path.dirname(from), spec);
  const pkg = Object.keys(workspaces).find((p) => spec.startsWith(`${p}/`));
  return pkg ? path.join(root, workspaces[pkg]!, `${spec.slice(pkg.length + 1)}.ts`) : undefined;
}

function staticGraph(entry: string): Set<string> {
  const seen = new Set<string>([entry]);
  for (const file of seen) {
    for (const [, spec] of readFileSync(file, 'utf8').matchAll(STATIC_IMPORT)) {
      const target = resolve(spec!, file);
      if (target) seen.add(target);
    }
  }
  return seen;
}

describe('the production start', () => {
  it('loads no fake, no demo data and no developer page', () => {
    const graph = [...staticGraph(path.join(root, 'apps/api/src/main.ts'))].map((f) => path.relative(root, f));
    expect(graph).toContain('apps/api/src/app.ts');
    expect(graph.length).toBeGreaterThan(30);
    const demoOnly = graph.filter((f) => /^fakes\/|\/demo\/|startup\/demo\.ts$|routes\/dev(-phone)?\.ts$/.test(f));
    expect(demoOnly).toEqual([]);
  });

  it('would notice if one were imported statically', () => {
    const graph = [...staticGraph(path.join(root, 'apps/api/src/startup/demo.ts'))].map((f) => path.relative(root, f));
    expect(graph).toContain('fakes/src/mail/mail-fake.ts');
    expect(graph).toContain('apps/api/src/routes/dev-phone.ts');
  });
});

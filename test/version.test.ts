import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { VERSION } from '../src/version.js';

describe('project metadata', () => {
  it('src/version.ts agrees with package.json (written into every summary.json)', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(VERSION).toBe(pkg.version);
  });

  it('the README shows the demo and test command lines that CI runs', () => {
    const readme = readFileSync('README.md', 'utf8');
    expect(readme).toMatch(/^npm ci && npm run demo$/m);
    expect(readme).toMatch(/^npm ci && npm test$/m);
    expect(readFileSync('.ci/run', 'utf8')).toMatch(/npm ci && npm test/);
  });

  it('every dependency is pinned to an exact version', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as Record<
      string,
      Record<string, string>
    >;
    for (const deps of [pkg.dependencies, pkg.devDependencies]) {
      for (const [name, v] of Object.entries(deps))
        // An exact version, with a pre-release or revision tag where the package uses one
        // (semver 2.0.0 section 9, e.g. 1.5.6-r.1); no range operators.
        expect(`${name}@${v}`).toMatch(/@\d+\.\d+\.\d+(-[0-9A-Za-z.]+)?$/);
    }
  });
});

// --help teaches: the top level lists the main tasks with an example each, and every command's
// help ends with examples in both unit systems. The runnable examples are run.
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';

const COMMANDS = [
  ['demo'],
  ['run'],
  ['sweep'],
  ['fit'],
  ['init'],
  ['weather', 'check'],
  ['weather', 'make'],
  ['spacing'],
  ['size'],
  ['system'],
];

/** The example command lines of a help text (lines that start with "tileflux "). */
function exampleLines(help: string): string[] {
  const at = help.search(/^Examples:?$/m);
  if (at < 0) return [];
  const lines: string[] = [];
  let current = '';
  for (const raw of help.slice(at).split('\n')) {
    const l = raw.trim();
    if (current) {
      current += ' ' + l.replace(/\\$/, '').trim();
      if (!l.endsWith('\\')) {
        lines.push(current);
        current = '';
      }
    } else if (l.startsWith('tileflux ')) {
      if (l.endsWith('\\')) current = l.replace(/\\$/, '').trim();
      else lines.push(l);
    }
  }
  return lines;
}

/**
 * US customary: --units us, a weather export read in standard (US) units, or a quantity in
 * inches, feet, acres or gallons per minute.
 */
const US = /--units us|--export-units standard|"[\d.]+ ?(in|ft|ac|gpm)(\/[a-z]+)?"|\b\d+ ?ft\b/;

describe('help that teaches', () => {
  it('the top level lists the main tasks with one example each', () => {
    const r = cli(['--help']);
    expect(r.status).toBe(0);
    const tasks = r.stdout.split('Main tasks')[1] ?? '';
    for (const c of [
      'demo',
      'weather check',
      'init',
      'run',
      'spacing',
      'size',
      'sweep',
      'fit',
      'system',
    ]) {
      expect(tasks, c).toMatch(new RegExp(`^    tileflux ${c}\\b`, 'm'));
    }
  });

  for (const c of COMMANDS) {
    it(`tileflux ${c.join(' ')} --help ends with examples in SI and in US units`, () => {
      const r = cli([...c, '--help']);
      expect(r.status).toBe(0);
      const examples = exampleLines(r.stdout);
      expect(examples.length, r.stdout).toBeGreaterThanOrEqual(2);
      expect(examples.every((l) => l.startsWith(`tileflux ${c.join(' ')}`))).toBe(true);
      expect(
        examples.some((l) => US.test(l)),
        'an example in US units',
      ).toBe(true);
      expect(
        examples.some((l) => !US.test(l)),
        'an example in SI units',
      ).toBe(true);
    });
  }

  it('the design examples of the top-level help run as printed', () => {
    const tasks = cli(['--help']).stdout.split('Main tasks')[1];
    for (const c of ['spacing', 'size']) {
      const line = tasks.split('\n').find((l) => l.trim().startsWith(`tileflux ${c} `))!;
      // Split the printed line as a shell would: quoted values stay whole.
      const args = [...line.trim().matchAll(/"([^"]*)"|(\S+)/g)].map((m) => m[1] ?? m[2]).slice(1);
      const r = cli(args);
      expect(r.status, `${line}\n${r.stderr}`).toBe(0);
    }
  });
});

/**
 * The folder order of src/ is enforced by ESLint (eslint.config.js, `layerRules`): a deliberate
 * import of a higher layer, or of a Node module in a file that must run in a browser, fails lint.
 */
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const eslint = new ESLint();

/** Messages of the import rule for `code` placed at `filePath`. */
async function importProblems(code: string, filePath: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message);
}

describe('layer rule', () => {
  it('refuses an import of a higher layer from the core', async () => {
    const code = "import { runField } from '../scenarios/run.js';\nexport const f = runField;\n";
    const problems = await importProblems(code, 'src/engine/probe.ts');
    expect(problems).toHaveLength(1);
    expect(problems[0]).toContain('engine/ is below');
  });

  it('refuses it from a nested folder too', async () => {
    const code = "import { progress } from '../../cli/progress.js';\nexport const p = progress;\n";
    expect(await importProblems(code, 'src/io/weather/probe.ts')).toHaveLength(1);
  });

  it('refuses Node modules in the pure parts of report/, not in its renderer', async () => {
    const code = "import { readFileSync } from 'node:fs';\nexport const r = readFileSync;\n";
    expect(await importProblems(code, 'src/report/charts.ts')).toHaveLength(1);
    expect(await importProblems(code, 'src/report/renderChart.ts')).toHaveLength(0);
  });

  it('lets a layer import its own and lower layers', async () => {
    const code =
      "import { simulate } from '../engine/simulate.js';\nimport { Q } from './x.js';\nexport const s = [simulate, Q];\n";
    expect(await importProblems(code, 'src/scenarios/probe.ts')).toHaveLength(0);
    expect(await importProblems(code, 'src/cli/probe.ts')).toHaveLength(0);
  });
});

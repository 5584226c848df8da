/** `tileflux init [FILE]`: write a fully commented starter field file. */
import type { Command } from 'commander';
import { action } from '../common.js';
import { summaryOf } from '../catalog.js';

export function registerInit(program: Command): void {
  program
    .command('init')
    .summary(summaryOf('init'))
    .description(
      'Write a starter field file in which every key is explained (meaning, unit, default) by a ' +
        'comment generated from the schema that validates field files. Without FILE it prints to ' +
        'stdout.',
    )
    .argument('[file]', 'where to write it, e.g. field.yaml')
    .option('-f, --force', 'overwrite FILE if it exists')
    .option('--json', 'print the JSON Schema of field files instead (for editors and scripts)')
    .addHelpText(
      'after',
      '\nExamples:\n' +
        '  A starter file, then a run in SI units:\n' +
        '    tileflux init my-field.yaml && tileflux run my-field.yaml --weather weather.csv\n' +
        '  Values take unit strings in either system (depth: 4 ft, spacing: 60 ft); results in US units:\n' +
        '    tileflux init my-field.yaml && tileflux run my-field.yaml --weather weather.csv --units us\n' +
        '  The JSON Schema of field files, for an editor:\n' +
        '    tileflux init --json > field.schema.json',
    )
    .action(
      action(async (file: string | undefined, o: { force?: boolean; json?: boolean }) =>
        (await import('../actions/init.js')).init(file, o),
      ),
    );
}

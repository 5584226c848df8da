// The command catalog lets `tileflux --help` list every command without loading any. These checks
// keep it true to the modules: the top-level help built from the catalog must equal the help of a
// program with every real command registered, so a changed argument or summary in a command module
// fails here instead of drifting silently. Also: which command a command line asks for.
import { Command } from 'commander';
import { describe, expect, it } from 'vitest';
import { COMMANDS, requestedCommand, summaryOf } from '../../src/cli/catalog.js';
import { addCatalogEntries, baseProgram } from '../../src/cli/program.js';

describe('command catalog', () => {
  it('lists the same commands, terms and summaries as the command modules register', async () => {
    const full = baseProgram();
    for (const entry of COMMANDS) (await entry.load())(full);
    const fromCatalog = baseProgram();
    addCatalogEntries(fromCatalog);
    expect(fromCatalog.helpInformation()).toBe(full.helpInformation());
    expect(full.commands.map((c: Command) => c.name())).toEqual([...COMMANDS.map((c) => c.name)]);
    const help = full.createHelp();
    for (const c of full.commands) {
      const entry = COMMANDS.find((e) => e.name === c.name());
      expect(help.subcommandTerm(c)).toBe(entry?.term);
    }
  });

  it('loads the command the first word names, or the word after help', () => {
    expect(requestedCommand(['run', 'field.yaml', '--weather', 'w.csv'])?.name).toBe('run');
    expect(requestedCommand(['help', 'size'])?.name).toBe('size');
    expect(requestedCommand(['--help'])).toBeUndefined();
    expect(requestedCommand(['-V'])).toBeUndefined();
    expect(requestedCommand([])).toBeUndefined();
    expect(requestedCommand(['help'])).toBeUndefined();
    expect(requestedCommand(['sise'])).toBeUndefined();
  });

  it('refuses a summary for a command it does not list', () => {
    expect(summaryOf('weather')).toMatch(/weather CSV/);
    expect(() => summaryOf('nonsense')).toThrow(/no command "nonsense"/);
  });
});

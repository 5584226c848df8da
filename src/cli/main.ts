#!/usr/bin/env node
/**
 * The `tileflux` command line. Each command lives in `commands/`; `catalog.ts` lists them so that
 * only the command asked for is loaded (the top-level help loads none).
 */
import { requestedCommand } from './catalog.js';
import { addCatalogEntries, baseProgram } from './program.js';

const program = baseProgram();
const requested = requestedCommand(process.argv.slice(2));
if (requested) (await requested.load())(program);
else addCatalogEntries(program);

await program.parseAsync(process.argv);

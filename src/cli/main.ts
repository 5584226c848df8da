#!/usr/bin/env node
/**
 * The `tileflux` command line. Each command registers its options in `commands/` and does its
 * work in `actions/`; `catalog.ts` lists them so that only the command asked for is loaded (the
 * top-level help loads none), and its work only when its action runs (not for its `--help`).
 */
import { requestedCommand } from './catalog.js';
import { addCatalogEntries, baseProgram } from './program.js';

const program = baseProgram();
const requested = requestedCommand(process.argv.slice(2));
if (requested) (await requested.load())(program);
else addCatalogEntries(program);

await program.parseAsync(process.argv);

#!/usr/bin/env node
// Strip outputs, execution counts and run timings from the notebooks before committing them:
// outputs are not kept in the repository (test/notebooks/notebooks.test.ts fails on them).
//
//   node notebooks/strip-outputs.mjs            strip every notebooks/*.ipynb in place
//   node notebooks/strip-outputs.mjs a.ipynb    strip the files named
//   node notebooks/strip-outputs.mjs --check    list notebooks that still carry outputs; exit 1 if any
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
const check = args.includes('--check');
const named = args.filter((a) => a !== '--check');
const files = named.length
  ? named
  : readdirSync(here)
      .filter((f) => f.endsWith('.ipynb'))
      .sort()
      .map((f) => join(here, f));

/**
 * The notebook without outputs, execution counts, per-cell run metadata and the kernel's
 * language version (it changes with the Deno release that ran it last).
 */
function stripped(nb) {
  delete nb.metadata?.language_info?.version;
  for (const cell of nb.cells) {
    if (cell.cell_type === 'code') {
      cell.outputs = [];
      cell.execution_count = null;
    }
    if (cell.metadata) {
      for (const key of ['execution', 'collapsed', 'scrolled']) delete cell.metadata[key];
    }
  }
  return nb;
}

let dirty = 0;
for (const file of files) {
  const text = readFileSync(file, 'utf8');
  // The layout Jupyter itself writes: one-space indent, trailing newline.
  const clean = JSON.stringify(stripped(JSON.parse(text)), null, 1) + '\n';
  if (clean === text) continue;
  dirty++;
  if (check)
    console.log(`${file}: has outputs or run metadata; run node notebooks/strip-outputs.mjs`);
  else {
    writeFileSync(file, clean);
    console.log(`stripped ${file}`);
  }
}
if (check && dirty > 0) process.exit(1);

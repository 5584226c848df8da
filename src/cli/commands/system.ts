/**
 * `tileflux system SYSTEM.yaml [--profile PROFILE.csv] --out DIR`: design a whole drain system
 * (mains reach by reach, laterals), lay the grades on a ground profile from the outlet upward,
 * check the depth of cut, and write reaches.csv, laterals.csv, profile.csv, charts/ and
 * report.html into an output folder, atomically.
 */
import type { Command } from 'commander';
import { action, CAUTION, IMAGES_HELP } from '../common.js';
import { summaryOf } from '../catalog.js';
import type { SystemFlags } from '../actions/system.js';

const HELP = `
Examples:
  The demo field's plan, grades laid on its surveyed profile:
    tileflux system data-demo/system.yaml --profile data-demo/profile.csv --out plan
  The same with sizes rounded down (shows the smaller coefficient each pipe then delivers):
    tileflux system data-demo/system.yaml --profile data-demo/profile.csv --out plan-down --round down
  Fixed grades only (every reach gives grade:), feet and inches:
    tileflux system my-system.yaml --out plan --units us

SYSTEM.yaml lists mains as reaches from the downstream end upward (length, optional grade,
laterals {count, length, spacing, grade}, area, inletFlow); a main that is not at the outlet
names the main and station it joins. PROFILE.csv has main,station_m,elevation_m (or _ft).
See the README section "Drain systems".

${CAUTION}
Trenching is dangerous: locate buried utilities and follow the excavation safety rules.`;

/** Register `tileflux system`. */
export function registerSystem(program: Command): void {
  program
    .command('system')
    .summary(summaryOf('system'))
    .description(
      'Size every reach of every main and every lateral group of a drain system for the area ' +
        'above it times the drainage coefficient (Manning, full pipe), lay the grades on a ' +
        'ground profile from the outlet upward between the minimum (flushing) grade and the ' +
        'ground, report the depth of cut and flag stations outside the cover and depth limits.',
    )
    .argument('<system>', 'system file (YAML)')
    .option('-p, --profile <csv>', 'ground profile: main,station_m,elevation_m (or _ft)')
    .option('-o, --out <dir>', 'output folder (required)')
    .option(
      '--round <rule>',
      'round sizes up (default, common practice) or down; overrides the file',
    )
    .option('--units <system>', 'units of written and printed figures: si or us', 'si')
    .option('--no-charts', 'skip the charts/ folder, the charts’ Vega-Lite specs')
    .option('--images', IMAGES_HELP)
    .option('--no-report', 'skip report.html')
    .option('-f, --force', 'replace the output folder if it exists')
    .option('--json', 'print the design summary as JSON')
    .addHelpText('after', HELP)
    .action(
      action(async (systemPath: string, o: SystemFlags) =>
        (await import('../actions/system.js')).system(systemPath, o),
      ),
    );
}

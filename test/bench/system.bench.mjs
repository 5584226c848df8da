// Drain-system design: how many whole designs per second the library computes (built library in
// dist/): the demo plan on its profile, and a large invented plan of 20 mains x 10 reaches with
// laterals on every reach and a profile surveyed every 10 m.
import { readFileSync } from 'node:fs';
import { designSystem } from '../../dist/drainage/systemDesign.js';
import { parseProfile, parseSystem } from '../../dist/io/system.js';
import { timeIt } from './timing.mjs';

function largePlan() {
  const mains = [];
  const rows = ['main,station_m,elevation_m'];
  for (let i = 0; i < 20; i++) {
    const reaches = Array.from({ length: 10 }, () => ({
      length: '100 m',
      laterals: [{ count: 2, length: '150 m' }],
    }));
    mains.push({
      name: `m${i}`,
      ...(i > 0
        ? { joins: { main: i < 5 ? 'm0' : `m${i % 5}`, station: `${100 * (1 + (i % 9))} m` } }
        : {}),
      reaches,
    });
    for (let s = 0; s <= 1000; s += 10) {
      rows.push(`m${i},${s},${(100 + 0.004 * s + 0.3 * Math.sin(s / 90 + i)).toFixed(3)}`);
    }
  }
  const yaml = JSON.stringify({
    name: 'large invented plan',
    coefficient: '0.5 in/d',
    sizes: '4,5,6,8,10,12,15,18,24,30,36 in',
    outlet: { depth: '1.4 m' },
    laterals: { spacing: '18 m', grade: '0.3 %' },
    mains,
  });
  return { system: parseSystem(yaml, 'large'), profile: parseProfile(rows.join('\n'), 'large') };
}

export default async function bench() {
  const demo = parseSystem(readFileSync('data-demo/system.yaml', 'utf8'), 'demo');
  const demoProfile = parseProfile(readFileSync('data-demo/profile.csv', 'utf8'), 'demo');
  const large = largePlan();
  let sink = 0;
  const demoMs = timeIt(() => {
    sink += designSystem(demo.tree, demo.settings, demoProfile).fieldCoefficientMmD;
  });
  const largeMs = timeIt(
    () => {
      sink += designSystem(large.system.tree, large.system.settings, large.profile).reaches.length;
    },
    { minMs: 2000, warmup: 1 },
  );
  if (!Number.isFinite(sink)) throw new Error('non-finite result in the system bench');
  return [
    {
      name: 'demo plan designs (6 reaches, 5 lateral groups, profile)',
      value: 1000 / demoMs,
      unit: '/s',
    },
    {
      name: 'large plan designs (200 reaches, 200 lateral groups, 2020 stations)',
      value: 1000 / largeMs,
      unit: '/s',
    },
  ];
}

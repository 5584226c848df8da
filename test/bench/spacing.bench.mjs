// Drain design equations: how many spacing solutions, equivalent depths and Hooghoudt fluxes
// the library computes per second (built library in dist/). Inputs vary over a fixed grid of
// 1000 layouts so that no call repeats the one before it.
import {
  equivalentDepth,
  gloverSpacing,
  hooghoudtFlux,
  hooghoudtSpacing,
  kirkhamGeometryFactor,
} from '../../dist/drainage/index.js';
import { timeIt } from './timing.mjs';

const N = 1000;
const layouts = Array.from({ length: N }, (_, i) => ({
  kAboveMPerDay: 0.1 + (i % 10) * 0.3,
  kBelowMPerDay: 0.1 + ((i * 7) % 10) * 0.3,
  layerBelowDrainsM: 0.5 + ((i * 3) % 20) * 0.5,
  drainRadiusM: 0.05 + (i % 3) * 0.025,
  headM: 0.3 + ((i * 11) % 10) * 0.08,
  rateMPerDay: 0.004 + ((i * 13) % 10) * 0.002,
  spacingM: 8 + ((i * 17) % 50) * 1.5,
}));

const moodyLayouts = layouts.map((p) => ({ ...p, method: 'moody' }));

export default async function bench() {
  let sink = 0;
  const perSecond = (ms) => (N / ms) * 1000;

  const spacing = timeIt(() => {
    for (const p of layouts) sink += hooghoudtSpacing(p).spacingM;
  });
  const spacingMoody = timeIt(() => {
    for (const p of moodyLayouts) sink += hooghoudtSpacing(p).spacingM;
  });
  const glover = timeIt(() => {
    for (const p of layouts) {
      sink += gloverSpacing({
        kMPerDay: p.kAboveMPerDay,
        drainablePorosity: 0.05,
        drainDepthM: 1.2,
        layerBelowDrainsM: p.layerBelowDrainsM,
        drainRadiusM: p.drainRadiusM,
        fromDepthM: 0,
        toDepthM: 0.3,
        days: 2,
      }).spacingM;
    }
  });
  const eqDepth = timeIt(() => {
    for (const p of layouts)
      sink += equivalentDepth(p.spacingM, p.layerBelowDrainsM, p.drainRadiusM);
  });
  const kirkham = timeIt(() => {
    for (const p of layouts) {
      sink += kirkhamGeometryFactor({
        drainDepthM: 1.2,
        layerBelowDrainsM: p.layerBelowDrainsM,
        drainRadiusM: p.drainRadiusM,
        spacingM: p.spacingM,
      });
    }
  });
  const flux = timeIt(() => {
    for (const p of layouts) {
      sink += hooghoudtFlux({
        kAboveMPerDay: p.kAboveMPerDay,
        kBelowMPerDay: p.kBelowMPerDay,
        equivalentDepthM: p.layerBelowDrainsM * 0.7,
        headM: p.headM,
        spacingM: p.spacingM,
      });
    }
  });
  if (!Number.isFinite(sink)) throw new Error('non-finite result in the drainage bench');
  return [
    { name: 'Hooghoudt spacing solutions (vdMW d)', value: perSecond(spacing), unit: '/s' },
    { name: 'Hooghoudt spacing solutions (Moody d)', value: perSecond(spacingMoody), unit: '/s' },
    { name: 'Glover-Dumm spacing solutions', value: perSecond(glover), unit: '/s' },
    { name: 'equivalentDepth calls (vdMW, checked)', value: perSecond(eqDepth), unit: '/s' },
    { name: 'kirkhamGeometryFactor calls', value: perSecond(kirkham), unit: '/s' },
    { name: 'hooghoudtFlux calls', value: perSecond(flux), unit: '/s' },
  ];
}

/**
 * Drain design equations: equivalent depth, Hooghoudt steady-state flux
 * and spacing, drainage intensity, Kirkham's ponded-surface rate, Glover-Dumm drawdown and
 * spacing, Manning pipe capacity and commercial pipe sizes. Pure functions, SI units (m, m/d,
 * m3/s), no Node imports.
 */
export {
  equivalentDepth,
  equivalentDepthAndSlope,
  checkEquivalentDepthInputs,
  minimumSpacingM,
  EQUIVALENT_DEPTH_METHODS,
  type EquivalentDepthMethod,
} from './equivalentDepth.js';
export {
  hooghoudtFlux,
  hooghoudtSpacing,
  drainageIntensity,
  type HooghoudtFluxInput,
  type HooghoudtSpacingInput,
  type DrainageIntensityInput,
} from './hooghoudt.js';
export {
  kirkhamGeometryFactor,
  kirkhamFlux,
  kirkhamHeadM,
  type KirkhamGeometryInput,
  type KirkhamFluxInput,
} from './kirkham.js';
export {
  gloverHeadRatio,
  gloverSpacing,
  gloverRatioOfTime,
  gloverTimeOfRatio,
  type GloverInput,
  type GloverSpacingInput,
} from './glover.js';
export {
  manningFullCapacity,
  manningDiameter,
  manningDiameterInches,
  fullFlowVelocity,
  minimumGrade,
  SEDIMENT_VELOCITY_MS,
} from './manning.js';
export {
  selectPipeSize,
  pipeSizeList,
  pipeDiameterM,
  INCH_SIZES,
  METRIC_SIZES,
  ROUGHNESS,
  type PipeSizeList,
  type PipeMaterial,
  type SelectedPipe,
} from './pipeSizes.js';
export { solveSpacing, type SpacingRoot } from './spacingRoot.js';
export {
  drainageCoefficient,
  parseCoefficientPreset,
  DEFAULT_COEFFICIENT_PRESET,
  DRAINAGE_COEFFICIENT_SOURCE,
  COEFFICIENT_SOILS,
  COEFFICIENT_CROPS,
  COEFFICIENT_INLETS,
  type CoefficientPreset,
  type CoefficientSoil,
  type CoefficientCrop,
  type CoefficientInlets,
  type DrainageCoefficient,
} from './drainageCoefficient.js';

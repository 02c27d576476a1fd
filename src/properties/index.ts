/**
 * Fluid properties from temperature (and pressure), for data reduction: rigs log temperature,
 * not viscosity.
 *
 *   water: density   IAPWS-IF97 region 1          (if97-region1.ts; liquid test: if97-saturation.ts)
 *          viscosity IAPWS R12-08 at that density (r12-viscosity.ts)
 *   air:   density   ideal gas, R = 287.0531 J/(kg K); viscosity Sutherland's law (air.ts)
 *
 * Three faces of the same models:
 * - checked SI functions (waterDensity(T, p) ...) that throw InputError 'property-out-of-range'
 *   with the range in the message, for single points (the props command, a design point);
 * - formula functions (PROPERTY_FUNCTIONS: water_density(T) ...) with dimension rules and exact
 *   derivative rules, which return NaN outside the range so that one bad row never stops a column;
 * - explainPropertyFailures(formula, valueAt) which names the call, the argument and the range
 *   behind such a NaN.
 */
export { AIR_GAS_CONSTANT_J_PER_KG_K, AIR_RANGE, airDensity, airKinematicViscosity, airRangeViolation, airViscosity, SUTHERLAND_BETA, SUTHERLAND_S_K } from './air.js';
export {
  callArguments,
  DENSITY,
  DYNAMIC_VISCOSITY,
  KINEMATIC_VISCOSITY,
  PRESSURE,
  PROPERTY_FUNCTIONS_INFO,
  propertyFunctionInfo,
  TEMPERATURE,
  type Fluid,
  type PropertyFunctionInfo,
} from './catalogue.js';
export { explainPropertyFailures, type PropertyFailure } from './explain.js';
export { PROPERTY_FUNCTIONS, PROPERTY_SPECS } from './functions.js';
export { IF97_R_J_PER_KG_K, region1Density, region1DensityWithDerivatives, region1Gibbs, region1SpecificVolume, region1State, type Region1State } from './if97-region1.js';
export { saturationPressurePa } from './if97-saturation.js';
export { PROPERTY_OUT_OF_RANGE, type RangeViolation } from './messages.js';
export { r12Viscosity, r12ViscosityWithDerivatives } from './r12-viscosity.js';
export {
  STANDARD_ATMOSPHERE_PA,
  WATER_RANGE,
  waterDensity,
  waterKinematicViscosity,
  waterRangeViolation,
  waterState,
  waterStateUnchecked,
  waterViscosity,
  type WaterState,
} from './water.js';

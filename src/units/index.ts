/**
 * The unit engine: unit text -> factor to SI, offset, dimension (M L T Θ N I J).
 *
 *   text --tokenize--> tokens --parseTokens--> tree --evaluate (resolveName per symbol)--> Unit
 *   Unit, Unit --converter--> Converter (exact rational affine map where the definitions are exact)
 *
 * Factors come from NIST SP 811 (2008) Appendix B.8/B.9 and the SI Brochure 9th ed. (2019); each
 * definition in defs-*.ts cites its line. Errors are InputError with kinds 'unit-*'; warnings go to
 * a WarningSink as data.
 */
export { converter, toSI, type Converter } from './convert.js';
export { Dimension, BASE_DIMENSIONS, BASE_DIMENSION_WORDS, type BaseDimension } from './dimension.js';
export { knownUnits, type UnitInfo } from './info.js';
export { parseUnit } from './parse.js';
export { describeDimension, quantityNames } from './quantities.js';
export { siUnitOf } from './si-spelling.js';
export { suggestUnits } from './suggest.js';
export { dimensionless, type TemperatureKind, type Unit, type UnitFactor } from './unit.js';

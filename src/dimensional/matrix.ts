import type { Rational } from '../common/rational.js';
import { BASE_DIMENSIONS, type BaseDimension, type Dimension } from '../units/index.js';
import { rankOf } from './linear.js';

/**
 * The dimensional matrix of a problem: one column per variable, one row per base dimension that
 * occurs in at least one variable (in SI order M L T Θ N I J), entries the exponents. Its rank r
 * gives the number of independent dimensionless groups, n - r (Buckingham, Phys. Rev. 4 (1914)
 * 345; the rank form of the theorem as in check-values.md 5.1).
 */

/** A variable as the engine needs it: a name and a dimension. */
export interface NamedDimension {
  readonly name: string;
  readonly dimension: Dimension;
}

export interface DimensionalMatrix {
  readonly variables: readonly string[];
  /** The base dimensions that occur, in SI order; one row each. */
  readonly bases: readonly BaseDimension[];
  /** entries[row][column]: the exponent of bases[row] in variables[column]. */
  readonly entries: readonly (readonly Rational[])[];
}

/**
 * Builds the dimensional matrix. Base dimensions that occur in no variable are left out (a
 * zero row changes nothing but the display).
 * @example dimensionalMatrix([{ name: 'U', dimension: L T^-1 }, { name: 'D', dimension: L }]).bases // => ['L', 'T']
 */
export function dimensionalMatrix(variables: readonly NamedDimension[]): DimensionalMatrix {
  const bases = BASE_DIMENSIONS.filter((b) => variables.some((v) => !v.dimension.exponent(b).isZero()));
  return {
    variables: variables.map((v) => v.name),
    bases,
    entries: bases.map((b) => variables.map((v) => v.dimension.exponent(b))),
  };
}

/** The column of one variable (its exponents over the matrix's bases). @example columnOf(pipeMatrix, 0) // => [1, -1, -2] (dp: M L^-1 T^-2) */
export function columnOf(m: DimensionalMatrix, index: number): Rational[] {
  return m.entries.map((row) => row[index]!);
}

/**
 * The rank of the sub-matrix made of some columns (all by default), exactly.
 * @example matrixRank(pipeFlowMatrix) // => 3 (M, L and T all independent)
 */
export function matrixRank(m: DimensionalMatrix, columns: readonly number[] = m.variables.map((_, i) => i)): number {
  return rankOf(
    m.entries.map((row) => columns.map((j) => row[j]!)),
    columns.length,
  );
}

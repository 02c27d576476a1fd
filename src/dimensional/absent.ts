import { BASE_DIMENSION_WORDS } from '../units/index.js';
import type { ClassifiedVariable } from './classify.js';
import { matrixRank, type DimensionalMatrix } from './matrix.js';

/**
 * Variables that no dimensionless group can contain. A variable belongs to some group exactly
 * when its column is a combination of the other columns, i.e. when leaving it out does not
 * lower the rank of the dimensional matrix (a pendulum's mass: no other variable carries M, so
 * the period cannot depend on it; Buckingham 1914, the classic pendulum example).
 */

export interface AbsentVariable {
  readonly name: string;
  readonly reason: string;
}

/**
 * The variables outside every group, each with the reason.
 * @example absentVariables(matrixOf(T, L, g, m), vars) // => [{ name: 'm', reason: 'it alone carries mass (M): ...' }]
 */
export function absentVariables(m: DimensionalMatrix, variables: readonly ClassifiedVariable[]): AbsentVariable[] {
  const rank = matrixRank(m);
  const all = variables.map((_, j) => j);
  const out: AbsentVariable[] = [];
  variables.forEach((v, j) => {
    if (v.dimension.isDimensionless()) return;
    if (matrixRank(m, all.filter((k) => k !== j)) === rank) return;
    const alone = m.bases.filter((b, row) => !m.entries[row]![j]!.isZero() && m.entries[row]!.every((e, k) => k === j || e.isZero()));
    const what =
      alone.length > 0
        ? `it alone carries ${alone.map((b) => `${BASE_DIMENSION_WORDS[b]} (${b})`).join(' and ')}`
        : 'the other variables cannot cancel its dimension';
    out.push({ name: v.name, reason: `${what}, so no dimensionless group contains it: a complete relation cannot depend on ${v.name}` });
  });
  return out;
}

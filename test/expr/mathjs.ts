/**
 * mathjs 15 (a general-purpose mathematics library) configured as an independent reference for
 * the formula engine: `predictable` gives NaN instead of complex results, and the smallest
 * positive relative tolerance makes its comparisons exact as in IEEE 754 (its default compares
 * numbers with a relative tolerance of 1e-12).
 */
import { all, create } from 'mathjs';

if (all === undefined) throw new Error('mathjs: the `all` factory map is missing');

export const mathjs = create(all, { predictable: true, relTol: Number.MIN_VALUE, absTol: 0 });

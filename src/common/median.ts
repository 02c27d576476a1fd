/**
 * The median of the finite values of an array (NaN and infinities left out); NaN when there is
 * none. The argument is not changed.
 * @example finiteMedian(Float64Array.of(3, NaN, 1, 2, 10)) // => 2.5
 */
export function finiteMedian(values: ArrayLike<number>): number {
  const finite: number[] = [];
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i]!)) finite.push(values[i]!);
  if (finite.length === 0) return NaN;
  const sorted = Float64Array.from(finite).sort();
  const m = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[m]! : (sorted[m - 1]! + sorted[m]!) / 2;
}

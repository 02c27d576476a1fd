/**
 * Element-wise operations on columns as plain loops. (Float64Array.from(x, fn) goes through the
 * iterator protocol and a callback per element; on a million rows it is an order of magnitude
 * slower than these loops, measured in npm run bench.)
 */

/** ln of every element. @example logOf(Float64Array.of(1, Math.E)) // => [0, 1] */
export function logOf(x: Float64Array): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = Math.log(x[i]!);
  return out;
}

/** exp of every element. @example expOf(Float64Array.of(0)) // => [1] */
export function expOf(x: Float64Array): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = Math.exp(x[i]!);
  return out;
}

/** Square root of every element. @example sqrtOf(Float64Array.of(4)) // => [2] */
export function sqrtOf(x: Float64Array): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = Math.sqrt(x[i]!);
  return out;
}

/** Square of every element. @example squareOf(Float64Array.of(3)) // => [9] */
export function squareOf(x: Float64Array): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = x[i]! * x[i]!;
  return out;
}

/** Absolute value of every element. @example absOf(Float64Array.of(-2)) // => [2] */
export function absOf(x: Float64Array): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = Math.abs(x[i]!);
  return out;
}

/** a + sign * b element-wise. @example addScaled(Float64Array.of(1), Float64Array.of(2), -1) // => [-1] */
export function addScaled(a: Float64Array, b: Float64Array, sign: number): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i]! + sign * b[i]!;
  return out;
}

/** a - b element-wise. @example differenceOf(Float64Array.of(3), Float64Array.of(1)) // => [2] */
export function differenceOf(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i]! - b[i]!;
  return out;
}

/** a * b element-wise. @example multiplyEach(Float64Array.of(2), Float64Array.of(3)) // => [6] */
export function multiplyEach(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i]! * b[i]!;
  return out;
}

/** Whether every element is > 0 (NaN is not). @example allPositive(Float64Array.of(1, 0)) // => false */
export function allPositive(x: Float64Array): boolean {
  for (let i = 0; i < x.length; i++) if (!(x[i]! > 0)) return false;
  return true;
}

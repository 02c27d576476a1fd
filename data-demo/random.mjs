/**
 * The seeded random numbers of the demo generators (invented data: the seeds are in each
 * generator, so every file can be written again byte for byte).
 */

/** mulberry32: a small seeded PRNG (public-domain algorithm by Tommy Ettinger). */
export function mulberry32(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** One standard normal deviate from two uniform draws of `rand`, by the Box-Muller transform (Box and Muller 1958). */
export function normal(rand) {
  const u = 1 - rand();
  const v = rand();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

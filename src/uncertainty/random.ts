/**
 * A seeded pseudo-random generator for Monte Carlo propagation, so that a run can be repeated
 * exactly: xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom number generators",
 * ACM Trans. Math. Softw. 47(4), 2021), 32-bit words, period 2^128 - 1, seeded through SplitMix64
 * (Steele, Lea & Flood, OOPSLA 2014) as its authors recommend; standard normal variates by the
 * Box-Muller transform (Box & Muller, Ann. Math. Stat. 29:610-611, 1958).
 */

const MASK64 = (1n << 64n) - 1n;

/**
 * SplitMix64 step: the next state and output (Steele, Lea & Flood 2014; reference code by Vigna).
 * @example splitMix64(1234567n)[1] // => 6457827717110365317n (Rosetta Code, "Pseudo-random numbers/Splitmix64")
 */
export function splitMix64(state: bigint): [bigint, bigint] {
  const next = (state + 0x9e3779b97f4a7c15n) & MASK64;
  let z = next;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return [next, z ^ (z >> 31n)];
}

const rotl = (x: number, k: number) => (x << k) | (x >>> (32 - k));

/** A xoshiro128** stream. Not for cryptography. */
export class RandomStream {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spare = NaN;

  /**
   * From a state of four 32-bit words (not all zero), or use RandomStream.seeded(seed).
   * @throws {RangeError} for an all-zero state.
   */
  constructor(state: readonly [number, number, number, number]) {
    [this.s0, this.s1, this.s2, this.s3] = state.map((w) => w | 0) as [number, number, number, number];
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) throw new RangeError('RandomStream: the state must not be all zero');
  }

  /**
   * A stream seeded from an integer through SplitMix64.
   * @example RandomStream.seeded(1).uniform() // => a number in [0, 1), the same on every run
   */
  static seeded(seed: number): RandomStream {
    let state = BigInt.asUintN(64, BigInt(Math.trunc(seed)));
    const words: number[] = [];
    for (let i = 0; i < 2; i++) {
      const [next, out] = splitMix64(state);
      state = next;
      words.push(Number(out & 0xffffffffn), Number(out >> 32n));
    }
    return new RandomStream(words as [number, number, number, number]);
  }

  /** The next 32-bit output as an unsigned integer (xoshiro128**). @example new RandomStream([1, 2, 3, 4]).nextUint32() // => 11520 */
  nextUint32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** A double uniform on [0, 1) with 53 random bits. @example RandomStream.seeded(1).uniform() // => a value in [0, 1) */
  uniform(): number {
    const hi = this.nextUint32() >>> 5; // 27 bits
    const lo = this.nextUint32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) / 9007199254740992;
  }

  /**
   * A standard normal variate (Box-Muller; the second value of each pair is kept for the next call).
   * @example RandomStream.seeded(1).normal() // => a draw from N(0, 1)
   */
  normal(): number {
    if (!Number.isNaN(this.spare)) {
      const z = this.spare;
      this.spare = NaN;
      return z;
    }
    const u1 = 1 - this.uniform(); // (0, 1]: ln(u1) is finite
    const u2 = this.uniform();
    const radius = Math.sqrt(-2 * Math.log(u1));
    this.spare = radius * Math.sin(2 * Math.PI * u2);
    return radius * Math.cos(2 * Math.PI * u2);
  }
}

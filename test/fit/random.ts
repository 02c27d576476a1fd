/**
 * Seeded pseudo-random numbers for the statistical tests (so that every run sees the same data):
 * mulberry32 (a 32-bit generator by T. Ettinger, public domain; from memory) for uniforms, and the
 * Box-Muller transform for normals (Box & Muller (1958), Ann. Math. Statist. 29:610-611).
 */
export class SeededRandom {
  private state: number;
  private spare: number | undefined;

  constructor(seed: number) {
    this.state = seed >>> 0;
  }

  /** Uniform on [0, 1). */
  uniform(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  /** Standard normal. */
  normal(): number {
    if (this.spare !== undefined) {
      const s = this.spare;
      this.spare = undefined;
      return s;
    }
    let u = 0;
    while (u === 0) u = this.uniform();
    const v = this.uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    this.spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  }

  /** Log-uniform on [lo, hi]. */
  logUniform(lo: number, hi: number): number {
    return lo * (hi / lo) ** this.uniform();
  }
}

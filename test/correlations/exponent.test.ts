import { describe, expect, it } from 'vitest';
import { BLASIUS, checkExponent, COLEBROOK, correlationAt, DITTUS_BOELTER, localExponent, SCHILLER_NAUMANN } from '../../src/correlations/index.js';
import { expectRel } from './helpers.js';

describe('localExponent', () => {
  it('is exact for a pure power law: Blasius -1/4 (Blasius 1913), Dittus-Boelter Re^0.8 Pr^0.4 (Dittus & Boelter 1930)', () => {
    expect(localExponent(BLASIUS, 'Re', { Re: 3e4 })).toBe(-0.25);
    expect(localExponent(DITTUS_BOELTER, 'Re', { Re: 1e5, Pr: 3 })).toBe(0.8);
    expect(localExponent(DITTUS_BOELTER, 'Pr', { Re: 1e5, Pr: 3 })).toBe(0.4);
  });

  it('Colebrook smooth pipe: d ln f/d ln Re = -4/(x ln 10 + 2), x = 1/sqrt(f), by implicit differentiation of 1/sqrt(f) = -2 log10(2.51/(Re sqrt f)) (algebra on Colebrook 1939)', () => {
    for (const re of [1e4, 1e5, 1e6, 1e7]) {
      const x = 1 / Math.sqrt(correlationAt(COLEBROOK, { Re: re, roughness: 0 }));
      // Central difference error ~ h^2/6 * third log-derivative with h = 1e-4: below 1e-8 relative.
      expectRel(localExponent(COLEBROOK, 'Re', { Re: re, roughness: 0 }), -4 / (x * Math.LN10 + 2), 1e-7, `Re ${re}`);
    }
  });

  it('Schiller-Naumann: d ln C_D/d ln Re = -1 + 0.687 * 0.15 Re^0.687/(1 + 0.15 Re^0.687) (derivative of the 1933 form)', () => {
    const re = 100;
    const t = 0.15 * re ** 0.687;
    expectRel(localExponent(SCHILLER_NAUMANN, 'Re', { Re: re }), -1 + (0.687 * t) / (1 + t), 1e-7);
  });
});

describe('checkExponent: the sentence in words (issue 6)', () => {
  it('an interval that contains -0.25 is consistent with Blasius', () => {
    const r = checkExponent({ name: 'Re', estimate: -0.247, interval: [-0.262, -0.232], levelPercent: 95 }, BLASIUS, { Re: 3e4 });
    expect(r.consistent).toBe(true);
    expect(r.sentence).toBe("The fitted exponent of Re, -0.247 (95 % interval -0.262 to -0.232), is consistent with the -0.25 of 'blasius'.");
  });

  it('an interval above -0.25 says the data fall off more slowly with Re', () => {
    const r = checkExponent({ name: 'Re', estimate: -0.21, interval: [-0.22, -0.2], levelPercent: 95 }, BLASIUS, { Re: 3e4 });
    expect(r.consistent).toBe(false);
    expect(r.sentence).toBe(
      "The fitted exponent of Re, -0.21 (95 % interval -0.22 to -0.2), differs from the -0.25 of 'blasius' by more than its interval allows: the data fall off more slowly with Re than the handbook form.",
    );
  });

  it('for a form that is not a power law it compares with the local slope and says where', () => {
    const r = checkExponent({ name: 'Re', estimate: -0.3, interval: [-0.32, -0.28], levelPercent: 95 }, COLEBROOK, { Re: 1e5, roughness: 0 });
    expect(r.localSlope).toBe(true);
    expect(r.consistent).toBe(false);
    expect(r.sentence).toMatch(/its local slope at Re = 1e5, roughness = 0/);
    expect(r.sentence).toMatch(/fall off faster with Re/);
  });
});

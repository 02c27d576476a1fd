import { afterAll, describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/io.js';
import { tmpFolder } from '../cli/tmp-folder.js';

/**
 * Overflow and underflow in the model during a fit, through `similis fit --json`. The data are
 * invented: y = exp(0.5 x) (1 + 0.01 sin i) at x = 0, 0.5, ..., 10 (i = 2x), so the truth is
 * a = 0.5 and a fit must land within 0.01 of it (the 1 % pattern moves a by far less).
 * exp(a*10) overflows double precision above a = 70.9 (ln(1.8e308) = 709.8); its square (the sum
 * of squares) already above a = 35.5.
 */
const rows = ['x,y'];
for (let i = 0; i <= 20; i++) rows.push(`${i / 2},${Math.exp(0.5 * (i / 2)) * (1 + 0.01 * Math.sin(i))}`);
const folder = tmpFolder({ 'd.csv': rows.join('\n') + '\n' });
afterAll(() => folder.remove());

interface FitDoc {
  fit: { status: string; statusDetail: { code: string; converged: boolean }; parameters: { estimate: number }[]; notFinite: unknown[] };
  warnings: { code: string; message: string }[];
  error?: { kind: string; message: string; hint?: string };
}
async function fitFrom(start: number): Promise<{ code: number; doc: FitDoc }> {
  const r = await folder.run('fit', 'd.csv', '--derive', 'X=x', '--group', 'Y=y', '--response', 'Y', '--model', 'exp(a*X)', '--param', `a=${start}`, '--method', 'nonlinear', '--json');
  return { code: r.code, doc: JSON.parse(r.out) as FitDoc };
}

describe('overflow in a fit of exp(a*x)', () => {
  it('start a = 5 (trial steps far up overflow): converges to the truth a = 0.5', async () => {
    const { code, doc } = await fitFrom(5);
    expect(code).toBe(EXIT.ok);
    expect(doc.fit.statusDetail.converged).toBe(true);
    expect(doc.fit.parameters[0]!.estimate).toBeCloseTo(0.5, 2);
    expect(doc.fit.notFinite).toEqual([]);
  });

  it('start a = 40 (the sum of squares overflows at the start): no false convergence; converges to a = 0.5', async () => {
    // Before the fix the overflowed sum of squares made the Bates-Watts offset 0: "converged" at a = 40.
    const { code, doc } = await fitFrom(40);
    expect(code).toBe(EXIT.ok);
    expect(doc.fit.statusDetail.converged).toBe(true);
    expect(doc.fit.parameters[0]!.estimate).toBeCloseTo(0.5, 2);
    expect(doc.fit.notFinite).toEqual([]);
  });

  it('start a = 200 (the model itself overflows at the start): bad input naming the rows and the start values', async () => {
    const { code, doc } = await fitFrom(200);
    expect(code).toBe(EXIT.badInput);
    expect(doc.error!.kind).toBe('fit-start-invalid');
    expect(doc.error!.message).toContain('d.csv:');
    expect(doc.error!.hint).toContain('start values');
  });

  it('start a = -300 (the model underflows to 0 at the start): a clean not-converged status and a warning, never "converged"', async () => {
    const { code, doc } = await fitFrom(-300);
    expect(code).toBe(EXIT.ok);
    expect(doc.fit.statusDetail).toMatchObject({ code: 'stalled', converged: false });
    expect(doc.warnings.map((w) => w.code)).toContain('fit-not-converged');
  });
});

import { describe, expect, it } from 'vitest';
import { expectRelClose } from '../units/tolerance.js';
import { column, reduceTexts, studyOf } from './helpers.js';

/**
 * Worked textbook examples reduced from their raw inputs, as rig files in the units the books use
 * (../shared/reference/check-values.md section 1.5). check-values.md asks for the computed
 * numbers to rel 1e-3; the inputs are printed to 4 significant digits, so their rounding alone
 * moves Re and f by up to about 2.5e-4.
 */

const PIPE_STUDY = `
groups:
  Re: rho*V*D/mu
  f: dp*D/(L*0.5*rho*V^2)     # Darcy friction factor
  f_laminar: 64/Re             # Hagen-Poiseuille
`;

describe('reduceTable: Cengel & Cimbala Example 8-2, laminar water in US customary units', () => {
  // Inputs: water at 40 degF, rho = 62.42 lbm/ft^3, mu = 1.038e-3 lbm/(ft s), D = 0.12 in,
  // L = 30 ft, V = 3 ft/s; the book's pressure drop 929.1 lbf/ft^2 (= 6.452 psi).
  // Answers (check-values.md 1.5): Re = 1804, f = 64/Re = 0.03548.
  const rig = `# Cengel & Cimbala, Example 8-2 (inputs as in check-values.md 1.5)
# D = 0.12 in
# L = 30 ft
# rho = 62.42 lb/ft^3
# mu = 1.038e-3 lb/(ft*s)
V [ft/s],dp [lbf/ft^2],dp_psi [psi]
3,929.1,6.452
`;
  const { reduced } = reduceTexts({ 'cengel-8-2.csv': rig }, studyOf(PIPE_STUDY));
  const r = reduced[0]!;
  it('Re = 1804 (rel 1e-3, check-values.md 1.5)', () => {
    expectRelClose(column(r, 'Re')[0]!, 1804, 1e-3, 'Re');
  });
  it('f from the pressure drop = 0.03548 = 64/Re (rel 1e-3): lbf against lbm handled by the units', () => {
    expectRelClose(column(r, 'f')[0]!, 0.03548, 1e-3, 'f');
    expectRelClose(column(r, 'f')[0]!, column(r, 'f_laminar')[0]!, 1e-3, 'f vs 64/Re');
  });
  it('the same pressure drop given in psi (6.452 psi) gives the same f (rel 1e-3)', () => {
    const { reduced: psi } = reduceTexts({ 'psi.csv': rig }, studyOf(PIPE_STUDY.replace('f: dp*D', 'f: dp_psi*D')));
    expectRelClose(column(psi[0]!, 'f')[0]!, 0.03548, 1e-3, 'f from psi');
  });
  it('keeps the file and line of the row (line 7 of the file)', () => {
    expect(r.file).toBe('cengel-8-2.csv');
    expect([...r.lines]).toEqual([7]);
  });
});

describe('reduceTable: Cengel & Cimbala SI example, turbulent water in a stainless pipe', () => {
  // Inputs (check-values.md 1.5): water at 15 degC, rho = 999.1 kg/m^3, mu = 1.138e-3 kg/(m s),
  // D = 5 cm, Q = 6 L/s, L = 60 m, dp = 96.2 kPa. Computed: V = 3.056 m/s, Re = 134 140,
  // f = 0.01719 (Colebrook). dp is printed to 3 digits (rel 5e-4), so f is checked to rel 1e-3.
  const rig = `# D = 5 cm
# L = 60 m
# rho = 999.1 kg/m^3
# mu = 1.138e-3 kg/(m*s)
Q [L/s],dp [kPa]
6,96.2
`;
  const study = studyOf(`derived:\n  V: 4*Q/(pi*D^2)\n${PIPE_STUDY}`);
  const r = reduceTexts({ 'cengel-si.csv': rig }, study).reduced[0]!;
  it('V = 3.056 m/s from Q and D (rel 2e-4: printed to 4 digits)', () => {
    expectRelClose(column(r, 'V')[0]!, 3.056, 2e-4, 'V');
    expect(r.outputs[0]!.header).toBe('V [m s^-1]');
  });
  it('Re = 134 140 (rel 1e-3)', () => expectRelClose(column(r, 'Re')[0]!, 134_140, 1e-3, 'Re'));
  it('f = 0.01719 from the pressure drop (rel 1e-3)', () => expectRelClose(column(r, 'f')[0]!, 0.01719, 1e-3, 'f'));
});

describe('reduceTable: the synthetic check row of check-values.md 1.5', () => {
  // Water at 20 degC, rho = 998.21 kg/m^3, mu = 1.0016 mPa s, D = 0.1 m, V = 2 m/s, L = 100 m,
  // dp = 37 066 Pa: Re = 199 323.1, f = 0.018566 (both [C] in check-values.md).
  const rig = `# D = 0.1 m
# L = 100 m
# rho = 998.21 kg/m^3
# mu = 1.0016 mPa*s
V [m/s],dp [Pa]
2,37066
`;
  const r = reduceTexts({ 'synthetic.csv': rig }, studyOf(PIPE_STUDY)).reduced[0]!;
  it('Re = 199 323.1 (rel 1e-6: every input exact, Re printed to 7 digits)', () => {
    expectRelClose(column(r, 'Re')[0]!, 199_323.1, 1e-6, 'Re');
  });
  it('f = 0.018566 (rel 5e-5: dp printed to 5 digits, f to 5)', () => expectRelClose(column(r, 'f')[0]!, 0.018566, 5e-5, 'f'));
});

#!/usr/bin/env node
/**
 * Generates the small invented example of the `fit` command's help and tests (the demo campaigns are
 * written by generate-demo.mjs).
 * Nothing here was measured: it is a scenario we made up, written from a stated truth with seeded
 * noise, so that the tool's output can be compared with the truth.
 *
 * Scenario "mini-loop": one smooth drawn-copper tube on an invented water loop at 20 degC.
 * Truth used:
 *   water at 20 degC: rho = 998.21 kg/m^3, mu = 1.0016e-3 Pa s (IAPWS values as quoted in
 *     ../shared/reference/check-values.md section 3; the property functions will replace these);
 *   tube: D = 0.5 in (12.7 mm), pressure taps L = 1.2 m apart;
 *   friction (Darcy): f = 64/Re for Re < 2000 (Hagen-Poiseuille), f = 0.3164 Re^-0.25 above
 *     3000 (Blasius 1913), no points in between;
 *   noise: dp multiplied by (1 + 0.015 z), z standard normal, seed 7; flow rates exact.
 * Units as logged: flow in L/min, differential pressure in kPa, diameter in inches, length in m.
 *
 * Run: node data-demo/generate-mini-loop.mjs   (rewrites data-demo/mini-loop/loop-a.csv)
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { mulberry32, normal } from './random.mjs';

const RHO_KG_M3 = 998.21;
const MU_PA_S = 1.0016e-3;
const D_IN = 0.5;
const L_M = 1.2;
const SEED = 7;
const FLOWS_L_MIN = [0.3, 0.5, 0.8, 1.1, 2, 3, 4, 6, 8, 10, 12.5, 15];

const rand = mulberry32(SEED);
const diameterM = D_IN * 0.0254;
const areaM2 = (Math.PI * diameterM ** 2) / 4;
const rows = [];
for (const [i, flowLMin] of FLOWS_L_MIN.entries()) {
  const velocityMS = flowLMin / 60000 / areaM2;
  const re = (RHO_KG_M3 * velocityMS * diameterM) / MU_PA_S;
  if (re >= 2000 && re <= 3000) throw new Error(`flow ${flowLMin} L/min falls in the transition band (Re ${re})`);
  const f = re < 2000 ? 64 / re : 0.3164 * re ** -0.25;
  const dpPa = f * (L_M / diameterM) * 0.5 * RHO_KG_M3 * velocityMS ** 2 * (1 + 0.015 * normal(rand));
  rows.push(`R${String(i + 1).padStart(2, '0')},${flowLMin},${(dpPa / 1000).toPrecision(4)}`);
}

const csv = [
  '# invented example, not measured: see data-demo/generate-mini-loop.mjs for the truth',
  '# rig: mini-loop, tube A (drawn copper), water at 20 degC',
  `# D = ${D_IN} in`,
  `# L = ${L_M} m`,
  `# rho = ${RHO_KG_M3} kg/m^3`,
  `# mu = ${MU_PA_S} Pa*s`,
  'run,Q [L/min],dp [kPa]',
  ...rows,
  '',
].join('\n');

const out = fileURLToPath(new URL('./mini-loop/loop-a.csv', import.meta.url));
writeFileSync(out, csv);
process.stdout.write(`wrote ${rows.length} rows to data-demo/mini-loop/loop-a.csv\n`);

#!/usr/bin/env node
/**
 * Writes the two demo campaigns of similis: invented rig scenarios, nothing measured, no data from
 * any course, book or product. Each file is written from a stated truth with seeded noise, so that
 * what the tool recovers can be compared with what was put in; the truth is written beside the data
 * (README.md and truth.json in each scenario folder).
 *
 *   pressure-drop/  a water loop: drawn copper (smooth) and drawn steel (slightly rough) tubes of
 *                   several diameters and lengths, flow in L/min (one file in gpm, logged in US
 *                   units), dp in kPa or inH2O, water properties from the logged temperature
 *   settling/       a settling column: glass and steel spheres in water and water-glycerol
 *                   mixtures, timed between two light gates
 *
 * Water properties: the truth uses the built property functions of similis
 * (dist/properties/index.js: IAPWS-IF97 density, IAPWS R12-08 viscosity), the same ones the study
 * calls as water_density(T) and water_viscosity(T), so the truth and the reduction agree on the
 * fluid. Build first: `npm run build && node data-demo/generate-demo.mjs`.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { waterDensity, waterViscosity } from '../dist/properties/index.js';
import { mulberry32, normal } from './random.mjs';

const here = (path) => fileURLToPath(new URL(path, import.meta.url));

/** Standard normal deviates from a seed (random.mjs). */
function normals(seed) {
  const rand = mulberry32(seed);
  return () => normal(rand);
}

/** Four significant digits, as a logger prints them. */
const sig = (x, digits = 4) => String(Number(x.toPrecision(digits)));

// ---------------------------------------------------------------- pressure-drop loop

/** Exact factors to SI (NIST SP 811 (2008), Appendix B.9). */
const IN_M = 0.0254;
const FT_M = 0.3048;
const GPM_M3_S = (231 * IN_M ** 3) / 60; // US gallon = 231 in^3 (NIST SP 811 B.9)
const INH2O_PA = 249.08891; // conventional inch of water, 1000 kg/m^3 and g_n (NIST SP 811 B.9)
const LMIN_M3_S = 1e-3 / 60; // litre = 1e-3 m^3 (SI Brochure, 9th ed. (2019), Table 8)

/** Truth for the smooth (drawn copper) tubes: f = C Re^a (L/D)^b, Darcy. */
const LOOP_TRUTH = {
  // Blasius (1913): f = 0.3164 Re^-0.25 for smooth tubes, 3000 <= Re <= 1e5; times an invented
  // developing-flow factor (L/D / 60)^-0.04 standing for the extra loss near the entrance of the
  // shorter tubes (1 at L/D = 60; not a published correlation).
  C: 0.3164 * 60 ** 0.04,
  a: -0.25,
  b: -0.04,
};

/**
 * Colebrook (1939), J. Inst. Civ. Eng. 11(4):133-156, eq. (10): 1/sqrt(f) = -2 log10(eps_D/3.7 +
 * 2.51/(Re sqrt(f))), solved by fixed-point iteration on 1/sqrt(f) to rounding level.
 */
function colebrook(re, epsD) {
  let x = 7; // 1/sqrt(f)
  for (let i = 0; i < 200; i++) {
    const next = -2 * Math.log10(epsD / 3.7 + (2.51 * x) / re);
    if (Math.abs(next - x) < 1e-14 * x) return 1 / (next * next);
    x = next;
  }
  return 1 / (x * x);
}

/**
 * The Darcy friction factor the loop's tubes follow (the truth). Drawn copper is taken as
 * hydraulically smooth (its 1.5 um is written in the files for the Colebrook comparison only);
 * the steel tubes (`rough`) follow Colebrook's roughness effect.
 */
function loopFrictionFactor(re, lOverD, epsD, rough) {
  const developing = (lOverD / 60) ** LOOP_TRUTH.b;
  if (re < 2300) return (64 / re) * developing; // Hagen-Poiseuille (1839) laminar
  const smooth = LOOP_TRUTH.C * 60 ** -0.04 * re ** LOOP_TRUTH.a; // = 0.3164 Re^-0.25
  // Steel tubes: the smooth law raised by Colebrook's ratio rough/smooth at the same Re.
  const roughness = rough ? colebrook(re, epsD) / colebrook(re, 0) : 1;
  return smooth * developing * roughness;
}

/**
 * The tubes. `units` says how the file logs: metric (L/min, kPa or inH2O, degC, mm, m) or US (gpm,
 * inH2O, degF, in, ft). `bad` lists rows spoiled on purpose, by row number (1-based among the data rows).
 */
const TUBES = [
  { file: 'tube-a.csv', what: 'drawn copper, short', dMm: 8.0, lM: 0.2, epsUm: 1.5, t0C: 18, re: [6e3, 6e4], n: 18, dp: 'kPa', seed: 101, bad: [] },
  { file: 'tube-b.csv', what: 'drawn copper', dMm: 8.0, lM: 0.8, epsUm: 1.5, t0C: 22, re: [5e3, 5e4], n: 18, dp: 'kPa', seed: 102, bad: [{ row: 7, kind: 'blank-dp' }] },
  { file: 'tube-c.csv', what: 'drawn copper, short', dMm: 12.0, lM: 0.48, epsUm: 1.5, t0C: 26, re: [5e3, 8e4], n: 18, dp: 'inH2O', seed: 103, bad: [] },
  { file: 'tube-d.csv', what: 'drawn copper, long', dMm: 12.0, lM: 2.4, epsUm: 1.5, t0C: 31, re: [5e3, 6e4], n: 18, dp: 'kPa', laminar: [900, 1300, 1800], seed: 104, bad: [{ row: 12, kind: 'temperature-dropout' }] },
  { file: 'tube-e-us.csv', what: 'drawn copper, US gauge set', dIn: 0.625, lFt: 4, epsUm: 1.5, t0C: 35, re: [6e3, 7e4], n: 18, dp: 'inH2O', us: true, seed: 105, bad: [{ row: 5, kind: 'na-flow' }] },
  { file: 'tube-f.csv', what: 'drawn copper, short', dMm: 16.0, lM: 0.64, epsUm: 1.5, t0C: 20, re: [6e3, 8e4], n: 18, dp: 'kPa', seed: 106, bad: [] },
  { file: 'tube-g.csv', what: 'drawn copper, long', dMm: 16.0, lM: 3.2, epsUm: 1.5, t0C: 40, re: [5e3, 7e4], n: 18, dp: 'kPa', laminar: [1000, 1600], seed: 107, bad: [] },
  { file: 'tube-h-steel.csv', what: 'drawn steel (slightly rough)', dMm: 12.0, lM: 1.2, epsUm: 5, rough: true, t0C: 24, re: [6e3, 8e4], n: 8, dp: 'kPa', seed: 108, bad: [{ row: 6, kind: 'flow-dropout' }] },
  { file: 'tube-i-steel.csv', what: 'drawn steel (slightly rough)', dMm: 16.0, lM: 1.6, epsUm: 6, rough: true, t0C: 28, re: [6e3, 8e4], n: 8, dp: 'kPa', seed: 109, bad: [] },
];

/**
 * Noise (standard deviations). The instruments: flow meter, dp cell or manometer, thermometer (the
 * files state their uncertainties in # u(...) lines). Besides them the loop scatters: pump
 * pulsation and flow unsteadiness multiply each dp reading by (1 + 0.015 z), more than the
 * instruments' own uncertainty, as on most loops.
 */
const FLOW_NOISE = 0.004; // relative
const LOOP_SCATTER = 0.015; // relative, on dp
const DP_NOISE = { kPa: { rel: 0.0025, abs: 0.003 }, inH2O: { rel: 0.0025, abs: 0.01 } };
const T_NOISE_K = 0.1;

function writeTube(folder, tube) {
  const z = normals(tube.seed);
  const dM = tube.dIn !== undefined ? tube.dIn * IN_M : tube.dMm / 1000;
  const lM = tube.lFt !== undefined ? tube.lFt * FT_M : tube.lM;
  const epsD = (tube.epsUm * 1e-6) / dM;
  const lOverD = lM / dM;
  const res = [...(tube.laminar ?? []), ...Array.from({ length: tube.n }, (_, i) => tube.re[0] * (tube.re[1] / tube.re[0]) ** (i / (tube.n - 1)))];
  const lines = [];
  const dpUnitPa = tube.dp === 'kPa' ? 1000 : INH2O_PA;
  const noise = DP_NOISE[tube.dp];
  let kept = 0;
  res.forEach((reTarget, i) => {
    const row = i + 1;
    const tC = tube.t0C + (1.5 * i) / res.length; // the water warms as the pump runs
    const tK = tC + 273.15;
    const rho = waterDensity(tK);
    const mu = waterViscosity(tK);
    const u = (reTarget * mu) / (rho * dM);
    const q = (u * Math.PI * dM ** 2) / 4;
    const re = (rho * u * dM) / mu;
    const f = loopFrictionFactor(re, lOverD, epsD, tube.rough === true);
    const dpPa = f * lOverD * 0.5 * rho * u ** 2;
    const qLogged = q * (1 + FLOW_NOISE * z());
    const dpLogged = (dpPa / dpUnitPa) * (1 + LOOP_SCATTER * z()) * (1 + noise.rel * z()) + noise.abs * z();
    const tLogged = tC + T_NOISE_K * z();
    let cells = tube.us
      ? [sig(qLogged / GPM_M3_S), sig(dpLogged), (tLogged * 1.8 + 32).toFixed(2)]
      : [sig(qLogged / LMIN_M3_S), sig(dpLogged), tLogged.toFixed(2)];
    const bad = tube.bad.find((b) => b.row === row);
    if (bad?.kind === 'blank-dp') cells[1] = '';
    if (bad?.kind === 'temperature-dropout') cells[2] = '-99.90'; // an open thermocouple reads the logger's floor
    if (bad?.kind === 'na-flow') cells[0] = 'NA';
    if (bad?.kind === 'flow-dropout') cells = ['0', sig(noise.abs * 3), cells[2]]; // the meter drops out; dp shows its offset
    if (bad === undefined && re > 4000) kept++;
    lines.push([`${tube.file.slice(5, 6).toUpperCase()}${String(row).padStart(2, '0')}`, ...cells].join(','));
  });
  const head = tube.us
    ? ['# rig: loop rig 2, US gauge set (flow meter in gpm, manometer board in inches of water)', `# tube: ${tube.what}`, `# D = ${tube.dIn} in`, `# L = ${tube.lFt} ft`, '# eps = 1.5 um', '# u(Q) = 0.5 %', '# u(dp) = 0.25 % + 0.01 inH2O', '# u(T) = 0.2 delta_degF', 'run,Q [gpm],dp [inH2O],T [degF]']
    : [
        '# rig: loop rig 2',
        `# tube: ${tube.what}`,
        `# D = ${tube.dMm} mm`,
        `# L = ${tube.lM} m`,
        `# eps = ${tube.epsUm} um`,
        '# u(Q) = 0.5 %',
        tube.dp === 'kPa' ? '# u(dp) = 0.25 % + 0.003 kPa' : '# u(dp) = 0.25 % + 0.01 inH2O',
        '# u(T) = 0.1 delta_degC',
        `run,Q [L/min],dp [${tube.dp}],T [degC]`,
      ];
  writeFileSync(`${folder}/${tube.file}`, ['# invented data, not measured: see data-demo/generate-demo.mjs and README.md here for the truth', ...head, ...lines, ''].join('\n'));
  return { file: tube.file, what: tube.what, diameterM: dM, lengthM: lM, lOverD, epsD, rows: res.length, turbulentKept: kept, bad: tube.bad };
}

// ---------------------------------------------------------------- settling column

const G_N = 9.80665; // standard acceleration of gravity (SI Brochure, 9th ed. (2019), CGPM 1901)
/** Truth: Schiller & Naumann (1933): Cd = 24/Re (1 + 0.15 Re^0.687); the density ratio plays no part. */
const SETTLING_TRUTH = { a: 0.15, b: 0.687, c: 0 };
const GATES_M = 0.5;

/** Liquids: invented mixtures at 20 degC, with the density and viscosity "measured" for each batch. */
const LIQUIDS = {
  water: { label: 'water', rho: 998.2, muMPaS: 1.002 },
  g40: { label: 'water-glycerol, 40 % glycerol by mass', rho: 1099, muMPaS: 3.72 },
  g60: { label: 'water-glycerol, 60 % glycerol by mass', rho: 1153, muMPaS: 10.8 },
  g80: { label: 'water-glycerol, 80 % glycerol by mass', rho: 1209, muMPaS: 60.1 },
};
const SPHERES = { glass: { label: 'soda-lime glass spheres', rho: 2500 }, steel: { label: 'chrome steel balls', rho: 7790 } };

const RUNS = [
  { file: 'water-glass.csv', liquid: 'water', sphere: 'glass', dMm: [1, 1.5, 2], seed: 201 },
  { file: 'g40-glass.csv', liquid: 'g40', sphere: 'glass', dMm: [1, 2, 3, 4, 5], seed: 202, missedGate: 9 },
  { file: 'g40-steel.csv', liquid: 'g40', sphere: 'steel', dMm: [1, 1.5, 2, 3], seed: 203 },
  { file: 'g60-glass.csv', liquid: 'g60', sphere: 'glass', dMm: [1, 2, 3, 4, 5, 6], seed: 204 },
  { file: 'g60-steel.csv', liquid: 'g60', sphere: 'steel', dMm: [1, 1.5, 2, 3, 4, 5], seed: 205 },
  { file: 'g80-glass.csv', liquid: 'g80', sphere: 'glass', dMm: [2, 3, 4, 5, 6], seed: 206 },
  { file: 'g80-steel.csv', liquid: 'g80', sphere: 'steel', dMm: [1, 1.5, 2, 3, 4, 5], seed: 207 },
];
const DROPS_PER_SIZE = 4;
const D_SPREAD_MM = 0.01; // sphere to sphere, around the nominal size
const D_MICROMETER_MM = 0.003; // micrometer reading
const T_GATE = { rel: 0.001, abs: 0.002 }; // light-gate timing, s

/** Terminal velocity where the truth's drag balances weight less buoyancy (bisection on ln v). */
function terminalVelocity(dM, rhoP, rho, mu) {
  let lo = 1e-9;
  let hi = 100;
  for (let i = 0; i < 200; i++) {
    const v = Math.sqrt(lo * hi);
    const re = (rho * v * dM) / mu;
    const cd = (24 / re) * (1 + SETTLING_TRUTH.a * re ** SETTLING_TRUTH.b) * (rhoP / rho) ** SETTLING_TRUTH.c;
    // Force balance on a sphere at terminal velocity, weight less buoyancy = drag: Cd = 4 g d (rho_p - rho) / (3 rho v^2)
    // (Clift, Grace & Weber (1978), Bubbles, Drops and Particles, chapter 5; from memory, equation number not given).
    const needed = (4 * G_N * dM * (rhoP - rho)) / (3 * rho * v * v);
    if (cd > needed) hi = v;
    else lo = v;
  }
  return Math.sqrt(lo * hi);
}

function writeRun(folder, run) {
  const z = normals(run.seed);
  const liquid = LIQUIDS[run.liquid];
  const sphere = SPHERES[run.sphere];
  const mu = liquid.muMPaS / 1000;
  const lines = [];
  const reRange = [Infinity, -Infinity];
  let row = 0;
  for (const dNominal of run.dMm) {
    for (let k = 0; k < DROPS_PER_SIZE; k++) {
      row++;
      const dMm = dNominal + D_SPREAD_MM * z();
      const v = terminalVelocity(dMm / 1000, sphere.rho, liquid.rho, mu);
      const re = (liquid.rho * v * dMm) / 1000 / mu;
      reRange[0] = Math.min(reRange[0], re);
      reRange[1] = Math.max(reRange[1], re);
      const t = GATES_M / v;
      const tLogged = t * (1 + T_GATE.rel * z()) + T_GATE.abs * z();
      const dLogged = dMm + D_MICROMETER_MM * z();
      const time = row === run.missedGate ? '' : tLogged.toFixed(3); // the lower gate missed the ball
      lines.push([`${run.sphere[0].toUpperCase()}${String(row).padStart(2, '0')}`, dLogged.toFixed(3), time].join(','));
    }
  }
  const head = [
    '# invented data, not measured: see data-demo/generate-demo.mjs and README.md here for the truth',
    '# rig: settling column 1, glass tube 80 mm bore, two light gates',
    `# liquid: ${liquid.label} at 20 degC (density by hydrometer, viscosity by falling-ball viscometer)`,
    `# spheres: ${sphere.label}`,
    `# H = ${GATES_M * 1000} mm`,
    `# rho = ${liquid.rho} kg/m^3`,
    `# mu = ${liquid.muMPaS} mPa*s`,
    `# rho_p = ${sphere.rho} kg/m^3`,
    '# u(t) = 0.1 % + 0.002 s',
    '# u(d) = 0.003 mm',
    '# u(H) = 0.5 mm',
    'ball,d [mm],t [s]',
  ];
  writeFileSync(`${folder}/${run.file}`, [...head, ...lines, ''].join('\n'));
  return { file: run.file, liquid: liquid.label, sphere: sphere.label, densityRatio: sphere.rho / liquid.rho, rows: row, reynoldsRange: reRange.map((x) => Number(x.toPrecision(3))), missedGate: run.missedGate ?? null };
}

// ---------------------------------------------------------------- the truth, in words

function loopReadme(t) {
  const row = (x) => `| ${x.file} | ${x.what} | ${sig(x.diameterM * 1000)} mm | ${sig(x.lengthM)} m | ${sig(x.lOverD)} | ${sig(x.epsD, 2)} | ${x.rows} | ${x.bad.map((b) => `row ${b.row}: ${BAD_WORDS[b.kind]}`).join('; ') || '-'} |`;
  return `# Pressure-drop loop (invented data)

Written by \`node data-demo/generate-demo.mjs\` (after \`npm run build\`): nothing here was measured.
The machine-readable truth is \`truth.json\`; the study is \`study.yaml\`.

## The truth the files were written from

- Water at the logged temperature, density and viscosity from the built property functions of
  similis (\`dist/properties/index.js\`: IAPWS-IF97 region 1 density, IAPWS R12-08 viscosity), the same
  functions the study calls as \`water_density(T)\` and \`water_viscosity(T)\`. Each run warms by 1.5 K.
- Drawn copper tubes (hydraulically smooth): Darcy friction factor
  **f = C Re^a (L/D)^b with C = ${t.smoothTubes.C.toPrecision(6)}, a = ${t.smoothTubes.a}, b = ${t.smoothTubes.b}**
  for Re > 4000, that is Blasius (1913) 0.3164 Re^-0.25 times an invented developing-flow factor
  (L/D / 60)^-0.04 that stands for the extra loss near the entrance of short tubes (not a published
  correlation). Files: ${t.smoothTubes.files.join(', ')}.
- Drawn steel tubes (slightly rough): the same law times Colebrook's roughness effect,
  colebrook(Re, eps/D) / colebrook(Re, 0) (Colebrook 1939), so they sit higher and fall off more
  slowly with Re. Files: ${t.roughTubes.files.join(', ')}. A campaign with them is a mixture of two
  populations: the index flags them (file-disagrees).
- Laminar runs (tubes d and g): f = 64/Re (L/D / 60)^-0.04 (Hagen-Poiseuille); the study leaves them
  out with \`where: Re > 4000\`, and says so.
- Noise (standard deviations): flow meter ${100 * t.noise.flowRelative} % of reading; loop scatter on dp
  ${100 * t.noise.dpScatterRelative} % of reading (pump pulsation, unsteadiness: more than the instruments
  state, as on most loops); dp cell 0.25 % + 0.003 kPa, manometer board 0.25 % + 0.01 inH2O;
  thermometer ${t.noise.temperatureK} K. The files state the instruments' uncertainties in \`# u(...)\` lines.
- Units as logged: L/min, kPa or inH2O, degC, mm and m; tube e in US units (gpm, inH2O, degF, in, ft).

| file | tube | D | L | L/D | eps/D | rows | rows spoiled on purpose |
|---|---|---|---|---|---|---|---|
${t.tubes.map(row).join('\n')}

What the tool should find: the copper tubes agree with one another; the two steel tubes disagree
with the pooled fit; the spoiled rows are left out, each with its line and reason; fitted on the
copper tubes alone (\`similis batch data-demo/pressure-drop/tube-[a-g]*.csv --study
data-demo/pressure-drop/study.yaml --out reports/copper\`) the 95 % intervals of C, a and b contain
the truth above.
`;
}

function settleReadme(t) {
  const row = (x) => `| ${x.file} | ${x.liquid} | ${x.sphere} | ${x.densityRatio.toPrecision(4)} | ${x.rows} | ${x.reynoldsRange[0]} to ${x.reynoldsRange[1]} | ${x.missedGate === null ? '-' : `row ${x.missedGate}: the lower gate missed the ball (blank time)`} |`;
  return `# Settling column (invented data)

Written by \`node data-demo/generate-demo.mjs\`: nothing here was measured. The machine-readable
truth is \`truth.json\`; the study is \`study.yaml\`.

## The truth the files were written from

- Each sphere falls at the terminal velocity where drag balances weight less buoyancy,
  Cd = 4 g d (rho_p - rho) / (3 rho Vt^2), g = ${t.gravity} m/s^2, with the drag law
  **Cd = 24/Re (1 + a Re^b) rho_ratio^c, a = ${t.a}, b = ${t.b}, c = ${t.c}** (Schiller & Naumann 1933;
  the density ratio rho_p/rho plays no part: c = 0). No wall effect (the bore is wide), no
  acceleration left at the first gate.
- The liquids' density and viscosity are written in each file as measured for that batch at 20 degC;
  the truth uses exactly these values. Spheres: ${DROPS_PER_SIZE} drops per nominal size; each ball's
  diameter differs from nominal by ${D_SPREAD_MM} mm (standard deviation) and is read with a micrometer
  (${D_MICROMETER_MM} mm).
- Timing between light gates ${t.gatesM * 1000} mm apart: ${100 * t.noise.timing.rel} % + ${t.noise.timing.abs} s
  (standard deviations); the files state u(t), u(d) and u(H).
- The study weights each point by 1/Cd^2 (the errors are relative), fits Cd against Re and the
  density ratio, and compares with Schiller-Naumann and Clift-Gauvin.

| file | liquid | spheres | rho_p/rho | rows | Re | spoiled row |
|---|---|---|---|---|---|---|
${t.runs.map(row).join('\n')}

What the tool should find: every file agrees with the pooled fit (about one file in twenty is
flagged by chance at a 95 % level), the pooled 95 % intervals of a, b and c contain the truth above,
and the blank time is left out with its line.
`;
}

const BAD_WORDS = {
  'blank-dp': 'dp cell left blank',
  'temperature-dropout': 'thermometer dropout (-99.9 degC)',
  'na-flow': 'flow logged as NA',
  'flow-dropout': 'flow meter dropout (Q = 0, dp at its offset)',
};

// ---------------------------------------------------------------- write everything

const loopFolder = here('./pressure-drop');
const settleFolder = here('./settling');
mkdirSync(loopFolder, { recursive: true });
mkdirSync(settleFolder, { recursive: true });
const tubes = TUBES.map((t) => writeTube(loopFolder, t));
const runs = RUNS.map((r) => writeRun(settleFolder, r));

const loopTruth = {
  scenario: 'pressure-drop loop (invented)',
  smoothTubes: { law: 'f = C * Re^a * (L/D)^b (Darcy), Re > 4000', ...LOOP_TRUTH, files: TUBES.filter((t) => t.rough !== true).map((t) => t.file) },
  roughTubes: { law: 'the smooth law times colebrook(Re, eps/D) / colebrook(Re, 0)', files: TUBES.filter((t) => t.rough === true).map((t) => t.file) },
  laminar: 'f = 64/Re * (L/D / 60)^-0.04 below Re 2300 (left out of the fit by where: Re > 4000)',
  noise: { flowRelative: FLOW_NOISE, dpScatterRelative: LOOP_SCATTER, dp: DP_NOISE, temperatureK: T_NOISE_K },
  tubes,
};
writeFileSync(`${loopFolder}/truth.json`, JSON.stringify(loopTruth, null, 2) + '\n');
const settleTruth = {
  scenario: 'settling column (invented)',
  law: 'Cd = 24/Re * (1 + a*Re^b) * rho_ratio^c (Schiller & Naumann 1933 with c = 0)',
  ...SETTLING_TRUTH,
  gravity: G_N,
  gatesM: GATES_M,
  noise: { timing: T_GATE, diameterSpreadMm: D_SPREAD_MM, micrometerMm: D_MICROMETER_MM },
  runs,
};
writeFileSync(`${settleFolder}/truth.json`, JSON.stringify(settleTruth, null, 2) + '\n');
writeFileSync(`${loopFolder}/README.md`, loopReadme(loopTruth));
writeFileSync(`${settleFolder}/README.md`, settleReadme(settleTruth));
process.stdout.write(`wrote ${tubes.length} tube files to data-demo/pressure-drop and ${runs.length} column files to data-demo/settling (truth in truth.json beside them)\n`);

import { InputError, type SourceSpan } from '../../common/errors.js';
import {
  AIR_RANGE,
  airDensity,
  airKinematicViscosity,
  airViscosity,
  propertyFunctionInfo,
  STANDARD_ATMOSPHERE_PA,
  WATER_RANGE,
  waterState,
  type Fluid,
} from '../../properties/index.js';
import { describeDimension, parseUnit, toSI, type Unit } from '../../units/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { formatNumber, formatTable } from '../format.js';

const WHERE = 'command line';
const FLUIDS: readonly Fluid[] = ['water', 'air'];
const NUMBER_START = /^[+-]?(?:\d|\.\d)/;
const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/;

/** One "value unit" group of the command line, with its column for messages. */
interface Quantity {
  readonly valueText: string;
  readonly unitText: string;
  readonly column: number;
}

/**
 * `similis props <fluid> <temperature> [pressure]`: density, dynamic and kinematic viscosity of
 * liquid water or dry air at a state, with the published source and validity range of each.
 * @throws {InputError} 'usage' for an unknown fluid or a malformed state, unit errors, and
 *   'property-out-of-range' outside the models' ranges.
 * @example runProps(ctx, 'water', ['20', 'degC']).json.properties[0].value // => 998.2061...
 */
export function runProps(ctx: CommandContext, fluidText: string, state: readonly string[]): CommandOutcome {
  const fluid = fluidText.trim().toLowerCase();
  if (!(FLUIDS as readonly string[]).includes(fluid)) {
    throw new InputError('usage', `unknown fluid ${JSON.stringify(fluidText)}: the known fluids are ${FLUIDS.join(', ')}`, { file: WHERE, text: fluidText });
  }
  const text = state.join(' ');
  const quantities = splitQuantities(text);
  if (quantities.length === 0 || quantities.length > 2) {
    throw new InputError('usage', 'give a temperature with its unit and, optionally, an absolute pressure with its unit ("20 degC 101.325 kPa")', {
      file: WHERE,
      text,
    });
  }
  const temperatureK = toSIValue(ctx, quantities[0]!, text, 'temperature');
  const pressureGiven = quantities[1] !== undefined;
  const pressurePa = pressureGiven ? toSIValue(ctx, quantities[1]!, text, 'pressure') : STANDARD_ATMOSPHERE_PA;
  const rows = fluid === 'water' ? waterRows(temperatureK, pressurePa) : airRows(temperatureK, pressurePa);
  const range = fluid === 'water' ? WATER_RANGE.text : AIR_RANGE.text;
  return outcome(fluid as Fluid, temperatureK, pressurePa, pressureGiven, rows, range);
}

/** Splits "20 degC 101.325 kPa" (or "20degC 1 bar") into value-unit groups. */
function splitQuantities(text: string): Quantity[] {
  const groups: Quantity[] = [];
  const tokens = [...text.matchAll(/\S+/g)];
  for (const t of tokens) {
    const word = t[0];
    const column = (t.index ?? 0) + 1;
    if (NUMBER_START.test(word)) {
      const valueText = NUMBER.exec(word)?.[0] ?? word;
      groups.push({ valueText, unitText: word.slice(valueText.length), column });
    } else if (groups.length > 0) {
      const last = groups[groups.length - 1]!;
      groups[groups.length - 1] = { ...last, unitText: last.unitText === '' ? word : `${last.unitText} ${word}` };
    } else {
      throw new InputError('usage', `expected a number first, found ${JSON.stringify(word)} (for example "20 degC")`, {
        file: WHERE,
        column,
        endColumn: column + word.length,
        text,
      });
    }
  }
  return groups;
}

function toSIValue(ctx: CommandContext, q: Quantity, text: string, kind: 'temperature' | 'pressure'): number {
  const where: SourceSpan = { file: WHERE, column: q.column, endColumn: q.column + q.valueText.length, text };
  if (q.unitText === '') {
    const example = kind === 'temperature' ? `${q.valueText} degC` : `${q.valueText} kPa`;
    throw new InputError('usage', `the ${kind} ${q.valueText} has no unit: write it with one, as in "${example}"`, where);
  }
  const value = Number(q.valueText);
  if (!Number.isFinite(value)) throw new InputError('usage', `${q.valueText} is not a number`, where);
  const unitColumn = text.indexOf(q.unitText, q.column - 1 + q.valueText.length) + 1;
  let unit: Unit;
  try {
    unit = parseUnit(q.unitText, {
      warn: (w) => ctx.warnings.warn({ ...w, where: { file: WHERE, column: unitColumn + (w.where?.column ?? 1) - 1 } }),
    });
  } catch (e) {
    if (e instanceof InputError) throw e.relocate({ file: WHERE, column: unitColumn, text });
    throw e;
  }
  const unitWhere: SourceSpan = { file: WHERE, column: unitColumn, endColumn: unitColumn + q.unitText.length, text };
  const wanted = kind === 'temperature' ? 'Θ' : 'M L^-1 T^-2';
  if (unit.dimension.toString() !== wanted) {
    const sample = kind === 'temperature' ? 'K, degC or degF' : 'Pa, kPa, bar or psi (absolute)';
    throw new InputError('usage', `${q.unitText} is ${describeDimension(unit.dimension)}, but a ${kind} is expected here (${sample})`, unitWhere);
  }
  if (kind === 'temperature' && unit.temperature === 'difference') {
    throw new InputError('usage', `${q.unitText} is a temperature difference; a fluid state needs an absolute temperature (K, degC or degF)`, unitWhere);
  }
  return toSI(unit).apply(value);
}

interface PropertyRow {
  readonly quantity: string;
  readonly fn: string;
  readonly value: number;
  /** A practical unit beside SI: [factor from SI, unit]. */
  readonly practical?: readonly [number, string];
}

function waterRows(temperatureK: number, pressurePa: number): PropertyRow[] {
  const s = waterState(temperatureK, pressurePa);
  return [
    { quantity: 'density', fn: 'water_density', value: s.densityKgPerM3 },
    { quantity: 'dynamic viscosity', fn: 'water_viscosity', value: s.viscosityPaS, practical: [1e3, 'mPa s'] },
    { quantity: 'kinematic viscosity', fn: 'water_kinematic_viscosity', value: s.kinematicViscosityM2PerS, practical: [1e6, 'mm^2/s (cSt)'] },
  ];
}

function airRows(temperatureK: number, pressurePa: number): PropertyRow[] {
  return [
    { quantity: 'density', fn: 'air_density', value: airDensity(temperatureK, pressurePa) },
    { quantity: 'dynamic viscosity', fn: 'air_viscosity', value: airViscosity(temperatureK), practical: [1e6, 'uPa s'] },
    {
      quantity: 'kinematic viscosity',
      fn: 'air_kinematic_viscosity',
      value: airKinematicViscosity(temperatureK, pressurePa),
      practical: [1e6, 'mm^2/s (cSt)'],
    },
  ];
}

/** 7 significant digits; small values in exponent form (1.813406e-5, not 0.00001813406). */
function siText(x: number): string {
  return Math.abs(x) < 1e-2 && x !== 0 ? x.toExponential(6).replace(/\.?0+e/, 'e') : formatNumber(x, 7);
}

function outcome(fluid: Fluid, temperatureK: number, pressurePa: number, pressureGiven: boolean, rows: readonly PropertyRow[], range: string): CommandOutcome {
  const info = rows.map((r) => propertyFunctionInfo(r.fn)!);
  const pressureNote = pressureGiven ? '' : ' (standard atmosphere: no pressure given)';
  const header =
    `${fluid === 'water' ? 'liquid water' : 'dry air'} at T = ${formatNumber(temperatureK, 8)} K (${formatNumber(temperatureK - 273.15, 8)} degC), ` +
    `p = ${formatNumber(pressurePa / 1e3, 8)} kPa${pressureNote}`;
  const table = formatTable([
    ['quantity', 'value', 'SI unit', 'also'],
    ...rows.map((r, i) => [
      r.quantity,
      siText(r.value),
      info[i]!.resultUnit,
      r.practical === undefined ? '' : `${formatNumber(r.value * r.practical[0], 7)} ${r.practical[1]}`,
    ]),
  ]);
  const sources = formatTable(rows.map((r, i) => [`  ${r.quantity}`, info[i]!.source]));
  const calls = info.map((f) => `${f.name}(${f.argumentNames.map((a, k) => (k === 0 ? a : k >= f.minArgs ? `[, ${a}]` : `, ${a}`)).join('')})`);
  const text =
    `${header}\n\n${table}\n\nsources:\n${sources}\nvalid for: ${range}\n` +
    `in formulas (SI: T in K, p in Pa): ${calls.join(', ')}\n`;
  return {
    text,
    json: {
      fluid,
      temperatureK,
      pressurePa,
      pressureAssumed: !pressureGiven,
      properties: rows.map((r, i) => ({ quantity: r.quantity, function: r.fn, value: r.value, unit: info[i]!.resultUnit, source: info[i]!.source })),
      range,
    },
  };
}

import { InputError } from '../../common/errors.js';
import { converter, describeDimension, knownUnits, parseUnit, siUnitOf, toSI, type Unit } from '../../units/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { formatNumber, formatTable } from '../format.js';

const WHERE = 'command line';
const NUMBER = /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)(?=\s|$|[^\d.eE+-])\s*/;

/**
 * `similis units [value] unit [--to unit]` and `similis units --list`.
 * Converts a value, describes a unit, or lists every known unit.
 */
export function runUnits(ctx: CommandContext, words: readonly string[], opts: { to?: string; list?: boolean }): CommandOutcome {
  if (opts.list === true) return listUnits();
  const text = words.join(' ').trim();
  if (text === '') {
    throw new InputError('usage', 'give a unit to describe ("lb/ft^3") or a value and a unit to convert ("12.5 psi --to kPa")', {
      file: WHERE,
    });
  }
  const m = NUMBER.exec(text);
  const valueText = m?.[1];
  const unitStart = m === null ? 0 : m[0].length;
  const unitText = text.slice(unitStart);
  if (valueText !== undefined && unitText === '') {
    throw new InputError('usage', `a unit is needed after the value ${valueText} (for example "${valueText} kPa")`, {
      file: WHERE,
      column: text.length + 1,
      text,
    });
  }
  const from = parseAt(ctx, unitText, { file: WHERE, column: unitStart + 1, text });
  if (opts.to === undefined) {
    if (valueText !== undefined) {
      const si = toSI(from);
      return conversionOutcome(Number(valueText), valueText, from, si.apply(Number(valueText)), siUnitOf(from.dimension), si.exact);
    }
    return describeOutcome(from);
  }
  const to = parseAt(ctx, opts.to, { file: '--to', column: 1, text: opts.to });
  const conv = converter(from, to);
  const value = valueText === undefined ? 1 : Number(valueText);
  return conversionOutcome(value, valueText ?? '1', from, conv.apply(value), to.text, conv.exact);
}

function parseAt(ctx: CommandContext, unitText: string, outer: { file: string; column: number; text: string }): Unit {
  try {
    return parseUnit(unitText, {
      warn: (w) => ctx.warnings.warn({ ...w, where: { file: outer.file, column: outer.column + (w.where?.column ?? 1) - 1 } }),
    });
  } catch (e) {
    if (e instanceof InputError) throw e.relocate(outer);
    throw e;
  }
}

function conversionOutcome(
  value: number,
  valueText: string,
  from: Unit,
  result: number,
  toText: string,
  exact: boolean,
): CommandOutcome {
  const temperatureNote =
    from.temperature === 'absolute'
      ? '   (absolute temperatures: the offset is applied)'
      : from.temperature === 'difference' && from.dimension.toString() === 'Θ'
        ? '   (a temperature difference: no offset)'
        : '';
  return {
    text: `${valueText} ${from.text} = ${formatNumber(result)} ${toText}${temperatureNote}\n`,
    json: { value, from: from.text, to: toText, result, exact, dimension: from.dimension.toString(), temperature: from.temperature },
  };
}

function describeOutcome(u: Unit): CommandOutcome {
  const si = siUnitOf(u.dimension);
  const exactText = u.factor.exact === null ? 'not exact (involves pi or a root)' : `exact: ${u.factor.exact.toString()}`;
  const rows: string[][] = [
    ['unit', `${u.text}${u.canonical !== u.text ? `   (read as ${u.canonical})` : ''}`],
    ['quantity', describeDimension(u.dimension)],
    ['factor to SI', `1 ${u.text} = ${formatNumber(u.factor.value)} ${si}   (${exactText})`],
  ];
  if (u.temperature === 'absolute') {
    rows.push(['offset', `absolute temperature: K = (value + ${formatNumber(u.offset.toNumber())}) x ${formatNumber(u.factor.value)}`]);
  } else if (u.temperature === 'difference') {
    rows.push(['temperature', 'a temperature difference (no offset)']);
  }
  return {
    text: formatTable(rows) + '\n',
    json: {
      unit: u.text,
      canonical: u.canonical,
      dimension: u.dimension.toString(),
      quantity: describeDimension(u.dimension),
      siUnit: si,
      factor: u.factor.value,
      exactFactor: u.factor.exact?.toString() ?? null,
      offset: u.offset.toNumber(),
      temperature: u.temperature,
    },
  };
}

function listUnits(): CommandOutcome {
  const units = knownUnits();
  const rows = [['symbol', 'aliases', 'name', '1 unit in SI', 'exact', 'source']];
  for (const u of units) {
    rows.push([
      u.symbol + (u.takesPrefixes ? ' *' : ''),
      u.aliases.join(' '),
      u.name,
      `${formatNumber(u.siValue)} ${u.siUnit}`,
      u.exact ? 'yes' : 'no',
      u.source,
    ]);
  }
  const text =
    formatTable(rows) +
    '\n\n* takes SI prefixes (k, M, m, u or µ, ...). Temperatures: degC and degF alone are absolute; ' +
    'inside compound units they are differences.\n';
  return { text, json: { units } };
}

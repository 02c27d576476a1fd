/**
 * Number formatting for terminal output. JSON output carries full doubles; text output shows
 * `digits` significant digits (default 12) without trailing zeros, so that 86.18446616460451
 * prints as 86.1844661646 and 20.000000000000004 as 20.
 *
 * @example formatNumber(86.18446616460451) // => '86.1844661646'
 */
export function formatNumber(x: number, digits = 12): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-5 && abs < 1e15) {
    const fixed = Number(x.toPrecision(digits));
    return String(fixed);
  }
  const [mantissa, exponent] = x.toExponential(digits - 1).split('e');
  const trimmed = (mantissa ?? '').replace(/\.?0+$/, '');
  return `${trimmed}e${exponent}`;
}

/** Left-aligned columns separated by two spaces; the first row is the header. */
export function formatTable(rows: readonly (readonly string[])[]): string {
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, i) => (widths[i] = Math.max(widths[i] ?? 0, [...c].length)));
  return rows
    .map((r) =>
      r
        .map((c, i) => (i === r.length - 1 ? c : c + ' '.repeat((widths[i] ?? 0) - [...c].length)))
        .join('  ')
        .trimEnd(),
    )
    .join('\n');
}

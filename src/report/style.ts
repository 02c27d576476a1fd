/**
 * The report's stylesheet: plain, print-friendly, readable in black and white, A4/Letter width.
 * System fonts only (no web fonts, no network).
 */
export const PAGE_CSS = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: #fff; color: #111; font: 14px/1.45 Helvetica, Arial, sans-serif; }
main { max-width: 190mm; margin: 0 auto; padding: 16px 12px 40px; }
h1 { font-size: 22px; margin: 8px 0 6px; }
h2 { font-size: 17px; margin: 28px 0 8px; padding-bottom: 3px; border-bottom: 1.5px solid #111; }
h3 { font-size: 14px; margin: 16px 0 6px; }
p { margin: 6px 0; }
code, pre { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 12.5px; }
pre { white-space: pre-wrap; word-break: break-word; background: #f6f6f6; border: 1px solid #ccc; padding: 8px; }
code.hash { font-size: 10.5px; word-break: break-all; }
table { border-collapse: collapse; margin: 8px 0 12px; width: 100%; }
th, td { border-bottom: 1px solid #ccc; padding: 3px 6px; text-align: left; vertical-align: top; }
thead th { border-bottom: 1.5px solid #111; font-weight: 600; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.formula { font-size: 17px; margin: 10px 0; padding: 8px 10px; border-left: 4px solid #111; background: #f6f6f6; }
.verdict { font-size: 15px; padding: 8px 10px; border: 1.5px solid #111; }
.verdict-caution { border-style: dashed; }
.verdict-doubtful { border-width: 3px; }
.cautions { border: 2px solid #111; padding: 4px 12px 8px; margin: 14px 0; }
.cautions h2 { border: none; margin: 6px 0 2px; font-size: 15px; }
.cautions ul { margin: 4px 0; padding-left: 20px; }
figure { margin: 14px 0 18px; break-inside: avoid; }
figcaption { font-size: 13px; margin-bottom: 4px; }
.plot svg { max-width: 100%; height: auto; }
details summary { cursor: pointer; }
@media print {
  body { font-size: 11pt; }
  main { max-width: none; padding: 0; }
  h2 { break-after: avoid; }
  table, figure { break-inside: avoid; }
  details > summary { list-style: none; }
}
@page { size: auto; margin: 15mm; }
`;

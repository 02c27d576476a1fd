/**
 * Turns the accessible labels vega writes on data points (`aria-label="loop-a.csv:17"`, from the
 * `description` channel) into SVG `<title>` children, which every browser shows as a tooltip on
 * hover and which survive printing to PDF. The label text is already escaped by vega for an
 * attribute, and an attribute-escaped string is also valid element text.
 *
 * @example pointTitles('<path aria-label="a.csv:3" role="graphics-symbol" aria-roledescription="symbol mark" d="M0,0"/>')
 * // => '<path d="M0,0"><title>a.csv:3</title></path>'
 */
export function pointTitles(svg: string): string {
  return svg.replace(
    /<(path|rect|circle|line|text) aria-label="([^"]*)" role="graphics-symbol" aria-roledescription="[^"]*"([^>]*?)\/>/g,
    (_m, tag: string, label: string, rest: string) => `<${tag}${rest}><title>${label}</title></${tag}>`,
  );
}

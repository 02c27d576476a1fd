/**
 * Ranking of known names by closeness to a misspelt one, for "did you mean" lists.
 *
 * Distance: optimal string alignment distance (Levenshtein with adjacent transpositions;
 * Damerau, Comm. ACM 7(3):171-176, 1964), on lower-cased text, so that 'rHo' is next to 'rho'.
 */

/**
 * The optimal string alignment distance between two strings.
 * @example editDistance('Reynolds', 'Renolds') // => 1
 */
export function editDistance(a: string, b: string): number {
  const x = Array.from(a);
  const y = Array.from(b);
  const rows = x.length + 1;
  const cols = y.length + 1;
  const d = new Array<number>(rows * cols).fill(0);
  for (let i = 0; i < rows; i++) d[i * cols] = i;
  for (let j = 0; j < cols; j++) d[j] = j;
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = x[i - 1] === y[j - 1] ? 0 : 1;
      let best = Math.min(d[(i - 1) * cols + j]! + 1, d[i * cols + j - 1]! + 1, d[(i - 1) * cols + j - 1]! + cost);
      if (i > 1 && j > 1 && x[i - 1] === y[j - 2] && x[i - 2] === y[j - 1]) {
        best = Math.min(best, d[(i - 2) * cols + j - 2]! + 1);
      }
      d[i * cols + j] = best;
    }
  }
  return d[rows * cols - 1]!;
}

/**
 * Known names ordered nearest first (ties alphabetical), at most `limit` of them.
 * @example nearestNames('mu_', ['rho', 'mu', 'D']) // => ['mu', 'D', 'rho']
 */
export function nearestNames(target: string, known: Iterable<string>, limit = 8): string[] {
  const t = target.toLowerCase();
  const scored = [...new Set(known)].map((name) => {
    const n = name.toLowerCase();
    // A shared prefix counts as closer than an unrelated name of the same distance.
    const prefixBonus = n.startsWith(t) || t.startsWith(n) ? 0.5 : 0;
    return { name, score: editDistance(t, n) - prefixBonus };
  });
  scored.sort((p, q) => p.score - q.score || (p.name < q.name ? -1 : p.name > q.name ? 1 : 0));
  return scored.slice(0, limit).map((s) => s.name);
}

import { editDistance } from '../expr/nearest.js';

/**
 * The known word a misspelt one most likely meant ("did you mean"), or undefined when none is
 * close: optimal string alignment distance (Damerau 1964) of at most 2, or a third of the word,
 * on lower-cased text.
 * @example didYouMean('gropus', ['title', 'groups', 'derived']) // => 'groups'
 */
export function didYouMean(word: string, known: readonly string[]): string | undefined {
  const w = word.toLowerCase();
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const k of known) {
    const d = editDistance(w, k.toLowerCase());
    if (d < bestDistance) {
      best = k;
      bestDistance = d;
    }
  }
  const limit = Math.max(2, Math.floor(word.length / 3));
  return bestDistance <= limit ? best : undefined;
}

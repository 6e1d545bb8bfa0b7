/** Edit distance and "did you mean" suggestions for schema messages. */

/** Levenshtein distance (insert, delete, substitute each cost 1). */
export function editDistance(a: string, b: string): number {
  if (a === b) return 0;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      cur[j] = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
    }
    prev = cur;
  }
  return prev[b.length]!;
}

/**
 * The candidate closest to `word` (case-insensitive), or null when none is reasonably close: at most about
 * 40 % of the length of the word in edits, or the word is a prefix of a candidate (racem -> racemate).
 */
export function closestWord(word: string, candidates: readonly string[]): string | null {
  const w = word.toLowerCase();
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const lc = c.toLowerCase();
    const d = lc.startsWith(w) && w.length >= 3 ? 0.5 : editDistance(w, lc);
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  if (best === null) return null;
  const limit = Math.max(2, Math.round(w.length * 0.4));
  return bestDistance <= limit ? best : null;
}

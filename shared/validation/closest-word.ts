/** Edit distance between two words (insertions, deletions, substitutions, adjacent swaps). */
function distance(a: string, b: string): number {
  const rows = Array.from({ length: a.length + 1 }, (_, i) => [
    i,
    ...Array<number>(b.length).fill(0),
  ]);
  for (let j = 1; j <= b.length; j++) rows[0][j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      rows[i][j] = Math.min(rows[i - 1][j] + 1, rows[i][j - 1] + 1, rows[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        rows[i][j] = Math.min(rows[i][j], rows[i - 2][j - 2] + 1);
      }
    }
  }
  return rows[a.length][b.length];
}

/** The candidate nearest to a mistyped word, when one is close enough to be a likely typo. */
export function closestWord(word: string, candidates: readonly string[]): string | undefined {
  const lower = word.toLowerCase();
  let best: { candidate: string; score: number } | undefined;
  for (const candidate of candidates) {
    const score = distance(lower, candidate.toLowerCase());
    if (!best || score < best.score) best = { candidate, score };
  }
  const allowed = Math.max(1, Math.floor(word.length / 3));
  return best && best.score <= allowed ? best.candidate : undefined;
}

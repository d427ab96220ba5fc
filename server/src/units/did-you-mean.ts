// "Did you mean ...?" for unknown units, names and properties: the closest known word by edit
// distance. Lives in units/ because it is the lowest layer that needs it (units import nothing).

/** Levenshtein distance, with a transposition of two neighbours counting as one edit. */
export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  if (m === 0) return n;
  if (n === 0) return m;
  let prevPrev = new Array<number>(n + 1).fill(0);
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  let cur = new Array<number>(n + 1).fill(0);
  for (let i = 1; i <= m; i++) {
    cur[0] = i;
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1])
        best = Math.min(best, prevPrev[j - 2]! + 1);
      cur[j] = best;
    }
    [prevPrev, prev, cur] = [prev, cur, prevPrev];
  }
  return prev[n]!;
}

/** The most edits a suggestion may need: about a third of the word, at least 1, at most 3 (common
 * practice for spelling suggestions, no source: beyond that a suggestion is more noise than help). */
function allowedEdits(word: string): number {
  return Math.max(1, Math.min(3, Math.floor(word.length / 3)));
}

/** The candidate closest to `word`, if it is close enough to be a likely typo. A match ignoring
 * case wins outright (`MM` for `mm`). */
export function closestWord(word: string, candidates: Iterable<string>): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  const lower = word.toLowerCase();
  for (const c of candidates) {
    if (c === word) continue;
    if (c.toLowerCase() === lower) return c;
    const d = editDistance(word, c);
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  if (best !== undefined && bestDistance <= allowedEdits(word)) return best;
  return onlyCompletion(word, candidates);
}

/** A half-typed word (`extens`) is most likely the one candidate it begins; three letters at
 * least, so that `m` does not stand for `mass` (common practice, no source). */
const LEAST_PREFIX = 3;

function onlyCompletion(word: string, candidates: Iterable<string>): string | undefined {
  if (word.length < LEAST_PREFIX) return undefined;
  const lower = word.toLowerCase();
  const starts = [...candidates].filter((c) => c !== word && c.toLowerCase().startsWith(lower));
  return starts.length === 1 ? starts[0] : undefined;
}

/** " Did you mean `x`?" or "" — to append to a message. */
export function didYouMean(word: string, candidates: Iterable<string>): string {
  const best = closestWord(word, candidates);
  return best ? `; did you mean \`${best}\`?` : "";
}

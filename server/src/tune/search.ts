// A bounded global search for the least of a function over a box (some variables whole
// numbers): several starts (the present design, the box's centre, a fixed sequence of scattered
// points), a Nelder-Mead simplex from the best few (Nelder and Mead, Computer Journal 7, 1965;
// Lagarias et al., SIAM J. Optim. 9, 1998, for its coefficients), then a coordinate polish by
// golden-section search (Kiefer, Proc. AMS 4, 1953) on each variable in turn. Why this mix: the
// worst hand force is a maximum over poses, so it has kinks where the simplex does well and no
// gradient does; the polish pins a one-variable optimum (the exact zero-free-length balance) to
// the tolerance asked; starts from several points guard against the local optima that moving
// an anchor creates. Bounded: by evaluations, and by the cooperative stop (stop.ts), which
// is asked before every evaluation.
import { pastDeadline } from "../stop";
import { narrowBracket } from "../mechanics/golden-section";

export interface SearchOptions {
  /** The most evaluations (the search ends with the best found so far). */
  maxEvaluations: number;
  /** Scattered starts besides the present design and the centre. */
  starts: number;
  /** Local searches from the best starts. */
  localSearches: number;
  /** Called now and then with the fraction done (0..1). */
  progress?: (fraction: number) => void;
}

export interface SearchResult {
  /** The best point found, in the variables' own values. */
  best: number[];
  value: number;
  /** The best of each local search (best first), for a fallback when the best fails a re-check. */
  others: { point: number[]; value: number }[];
  evaluations: number;
  /** True when the cooperative stop ended it early. */
  stopped: boolean;
}

export interface Box {
  lo: number[];
  hi: number[];
  integer: boolean[];
  /** Where the present design lies (clamped into the box). */
  start: number[];
}

/** Normalised size below which a simplex or bracket counts as converged. */
const TOLERANCE = 1e-9;

class Stop extends Error {}

/** Deterministic scattered points in the unit cube (a Halton sequence, bases the first primes):
 * the same search twice gives the same answer. */
function halton(index: number, base: number): number {
  let f = 1;
  let r = 0;
  let i = index;
  while (i > 0) {
    f /= base;
    r += f * (i % base);
    i = Math.floor(i / base);
  }
  return r;
}
const PRIMES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53];

export function minimise(f: (x: number[]) => number, box: Box, options: SearchOptions): SearchResult {
  const n = box.lo.length;
  let evaluations = 0;
  let best: { point: number[]; value: number } = { point: box.start.slice(), value: Infinity };
  // Work in the unit cube; whole-number variables are rounded when evaluated.
  const toReal = (u: number[]) =>
    u.map((ui, i) => {
      const c = Math.min(1, Math.max(0, ui));
      const x = box.lo[i]! + c * (box.hi[i]! - box.lo[i]!);
      return box.integer[i] ? Math.round(x) : x;
    });
  const memo = new Map<string, number>();
  const evalU = (u: number[]): number => {
    if (evaluations >= options.maxEvaluations || pastDeadline()) throw new Stop();
    const x = toReal(u);
    const key = x.join(",");
    const hit = memo.get(key);
    if (hit !== undefined) return hit;
    evaluations++;
    if (evaluations % 50 === 0) options.progress?.(Math.min(1, evaluations / options.maxEvaluations));
    const v = f(x);
    const value = Number.isFinite(v) ? v : Infinity;
    memo.set(key, value);
    if (value < best.value) best = { point: x, value };
    return value;
  };
  const span = (i: number) => box.hi[i]! - box.lo[i]!;
  const startU = box.start.map((x, i) => (span(i) > 0 ? (x - box.lo[i]!) / span(i) : 0));
  const others: { point: number[]; value: number }[] = [];
  let stopped = false;
  try {
    const starts: { u: number[]; value: number }[] = [];
    const tryStart = (u: number[]) => starts.push({ u, value: evalU(u) });
    tryStart(startU);
    tryStart(new Array(n).fill(0.5));
    for (let k = 1; k <= options.starts; k++)
      tryStart(Array.from({ length: n }, (_, i) => halton(k, PRIMES[i % 16]!)));
    starts.sort((a, b) => a.value - b.value);
    for (const s of starts.slice(0, options.localSearches)) {
      const local = polish(evalU, nelderMead(evalU, s.u, n), n);
      others.push({ point: toReal(local.u), value: local.value });
    }
  } catch (e) {
    if (!(e instanceof Stop)) throw e;
    stopped = pastDeadline();
  }
  others.sort((a, b) => a.value - b.value);
  options.progress?.(1);
  return { best: best.point, value: best.value, others, evaluations, stopped };
}

/** Nelder-Mead in the unit cube (points clamped into it), standard coefficients. */
function nelderMead(f: (u: number[]) => number, start: number[], n: number): { u: number[]; value: number } {
  if (n === 0) return { u: start, value: f(start) };
  const clamp = (u: number[]) => u.map((x) => Math.min(1, Math.max(0, x)));
  const step = 0.15;
  let simplex = [start.slice()];
  for (let i = 0; i < n; i++) {
    const p = start.slice();
    p[i] = p[i]! + (p[i]! + step <= 1 ? step : -step);
    simplex.push(clamp(p));
  }
  let values = simplex.map(f);
  for (let iter = 0; iter < 200 * n; iter++) {
    const order = values.map((v, i) => i).sort((a, b) => values[a]! - values[b]!);
    simplex = order.map((i) => simplex[i]!);
    values = order.map((i) => values[i]!);
    const size = Math.max(
      ...simplex.slice(1).map((p) => Math.max(...p.map((x, i) => Math.abs(x - simplex[0]![i]!)))),
    );
    if (size < TOLERANCE) break;
    const centroid = new Array(n).fill(0);
    for (let k = 0; k < n; k++) for (let i = 0; i < n; i++) centroid[i] += simplex[k]![i]! / n;
    const worst = simplex[n]!;
    const along = (t: number) => clamp(centroid.map((c, i) => c + t * (c - worst[i]!)));
    const r = along(1);
    const fr = f(r);
    if (fr < values[0]!) {
      const e = along(2);
      const fe = f(e);
      if (fe < fr) [simplex[n], values[n]] = [e, fe];
      else [simplex[n], values[n]] = [r, fr];
    } else if (fr < values[n - 1]!) [simplex[n], values[n]] = [r, fr];
    else {
      const c = fr < values[n]! ? along(0.5) : along(-0.5);
      const fc = f(c);
      if (fc < Math.min(fr, values[n]!)) [simplex[n], values[n]] = [c, fc];
      else {
        for (let k = 1; k <= n; k++) {
          simplex[k] = simplex[k]!.map((x, i) => simplex[0]![i]! + 0.5 * (x - simplex[0]![i]!));
          values[k] = f(simplex[k]!);
        }
      }
    }
  }
  const i = values.indexOf(Math.min(...values));
  return { u: simplex[i]!, value: values[i]! };
}

/** Coordinate descent by golden-section search in a bracket around each variable, the bracket
 * halving each round: pins a kink the simplex circles. */
function polish(
  f: (u: number[]) => number,
  from: { u: number[]; value: number },
  n: number,
): { u: number[]; value: number } {
  let u = from.u.slice();
  let value = from.value;
  for (let radius = 0.25; radius > 1e-7; radius /= 4) {
    for (let i = 0; i < n; i++) {
      const lo = Math.max(0, u[i]! - radius);
      const hi = Math.min(1, u[i]! + radius);
      const at = (x: number) => {
        const p = u.slice();
        p[i] = x;
        return f(p);
      };
      const x = goldenSection(at, lo, hi, Math.max(TOLERANCE, radius * 0.01));
      const fx = at(x);
      if (fx < value) {
        u[i] = x;
        value = fx;
      }
    }
  }
  return { u, value };
}

/** The least of a one-variable function on [lo, hi] (exact for a unimodal one). */
export function goldenSection(
  f: (x: number) => number,
  lo: number,
  hi: number,
  tolerance = TOLERANCE,
): number {
  const [a, b] = narrowBracket(f, lo, hi, (width) => width > tolerance);
  const m = (a + b) / 2;
  return f(m) <= Math.min(f(lo), f(hi)) ? m : f(lo) <= f(hi) ? lo : hi;
}

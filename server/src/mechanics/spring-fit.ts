// Best-fit spring settings and the ideal zero-free-length rate, from a solved sweep.
// Where a spring is taut its force is linear in its two design parameters (rate and initial
// tension, or rate and preload; a gas strut's force, a cord's area), kinematics do not change,
// and statics are linear: so the hand force at every pose is affine in them and the worst hand
// force over the range is convex. The minimax is found by nested golden-section search (outer:
// the first parameter, inner: the second), on an active set of poses grown until it holds the
// worst pose of the whole sweep (cutting planes), which keeps it cheap on big grids.
// Friction: a pivot's friction holds up to its torque for free, so where a dof has friction the
// hand force is that of the holding torque beyond it (hand-force.ts), no longer affine in the
// settings: each sample then keeps its holding torques and their change per unit of spring force,
// and the search evaluates the torque beyond friction (still the convex |tau| - f per dof).
import type { ArmModel, Spring, Vec2 } from "../model/types";
import type { Pose, SweepResult } from "./types";
import { springForceBasis, springParameters } from "./forces";
import { atJoint, springKind } from "../model/spring-kinds";
import { handForceVector, torqueBeyondFriction } from "./hand-force";
import { rotate } from "./plane";
import { pastDeadline } from "../stop";
import { springDofValue } from "./spring-table";
import { narrowBracket } from "./golden-section";

/** Golden-section iterations per parameter: the bracket shrinks by 0.618 each, so 30 reach
 * 5e-7 of the bracket, past the four significant digits a quick fix writes. */
const GOLDEN_ITERATIONS = 30;
/** Poses seeded into the active set, and added per round. */
const ACTIVE_SEED = 48;
const ACTIVE_ADD = 24;
/** Rounds of active-set growth; the worst pose is usually inside after one or two. */
const ACTIVE_ROUNDS = 8;
/** The ideal rate needs the anchor straight above the pivot: within 1 deg (common practice, no
 * source: a degree of misalignment leaves a residual of about 2 % of the gravity torque). */
const VERTICAL_TOLERANCE = (1 * Math.PI) / 180;
/** The gravity torque must follow m g l cos(angle of the hook line) to this fraction (the
 * centre of mass on the hook line) for the simple geometry to apply. */
const COSINE_FIT_TOLERANCE = 0.02;

export interface SpringFit {
  springId: string;
  names: [string, string | undefined];
  current: [number, number];
  best: [number, number];
  worstHandForceBefore: number;
  worstHandForceAfter: number;
}

/** Samples: per pose, case and payload, the hand force now (a), its change per unit of spring
 * force (b), the spring force now and the basis of the force in the parameters (without
 * friction: the hand force is a + b (c0 p0 + c1 p1 - force)). With friction on some dof, also per
 * sample (`torques`, FRICTION_WIDTH(ndof) numbers): the hand force per unit holding torque of each
 * dof (P, 2 x ndof), the holding torques now and their change per unit of spring force. */
interface FitSamples {
  count: number;
  data: Float64Array; // ax ay bx by force c0 c1 per sample
  friction?: { ndof: number; perDof: Float64Array; torques: Float64Array; finiteColumns: boolean };
}

const frictionWidth = (ndof: number) => 4 * ndof;

/** The spring's wind-up from free (torsion: its joint, looked up once) or its length at a pose. */
function springTurnOrLength(model: ArmModel, s: Spring): (pose: Pose) => number {
  if (atJoint(s)) {
    const j = model.joints.find((x) => x.id === s.joint);
    return j ? (pose) => (pose.jointAngles[j.id] ?? j.angle) - j.angle : () => 0;
  }
  return (pose) => pose.springs[s.id]?.length ?? NaN;
}

function collectSamples(model: ArmModel, sweep: SweepResult, s: Spring): FitSamples {
  const ndof = sweep.dofs.length;
  const dofIds = sweep.dofs.map((d) => d.id);
  const perDof = Float64Array.from(
    sweep.dofs,
    (d) => model.joints.find((j) => j.id === d.jointId)?.friction ?? 0,
  );
  const withFriction = perDof.some((f) => f > 0);
  const fw = frictionWidth(ndof);
  // One sample per pose, payload and case at most: sized once (a typed array's growth is dear in
  // the untuned tier).
  let capacity = 0;
  for (const pose of sweep.poses) capacity += pose.cases.length;
  capacity *= model.payloads.length;
  const torques = new Float64Array(withFriction ? fw * capacity : 0);
  const unitTorque = new Float64Array(Math.max(ndof, 1));
  const rows = new Float64Array(7 * capacity);
  let count = 0;
  const jac = new Float64Array(2 * Math.max(ndof, 1));
  const g = new Float64Array(Math.max(ndof, 1));
  const basis = new Float64Array(2);
  const turnOrLength = springTurnOrLength(model, s);
  for (const pose of sweep.poses) {
    const perUnit = pose.springTorquePerUnit;
    if (!perUnit?.springIndex.has(s.id)) continue;
    for (let i = 0; i < ndof; i++) g[i] = springDofValue(perUnit, s.id, dofIds[i]!) ?? 0;
    springForceBasis(model, s, turnOrLength(pose), basis);
    for (const p of model.payloads) {
      const pj = pose.payloadJacobian?.[p.id];
      if (!pj) continue;
      for (let i = 0; i < ndof; i++) {
        const v = pj[dofIds[i]!];
        jac[2 * i] = v?.x ?? 0;
        jac[2 * i + 1] = v?.y ?? 0;
      }
      const b = handForceVector(jac, g, ndof);
      // Hand force per unit holding torque of each dof (hand-force.ts is linear in the torques).
      const P: Vec2[] = [];
      if (withFriction)
        for (let i = 0; i < ndof; i++) {
          unitTorque.fill(0);
          unitTorque[i] = 1;
          P.push(handForceVector(jac, unitTorque, ndof));
        }
      for (const c of pose.cases) {
        const force = c.springForce[s.id];
        if (!c.handForceVector?.[p.id] || force === undefined) continue;
        // Without friction the sweep's hand force is the affine part; with friction it is not,
        // and the affine part (for the least-squares bracket) is taken from the raw torques.
        const a = withFriction ? affinePart(P, dofIds, c.holdingTorque) : c.handForceVector[p.id]!;
        if (withFriction) {
          const t = fw * count;
          for (let i = 0; i < ndof; i++) {
            torques[t + i] = P[i]!.x;
            torques[t + ndof + i] = P[i]!.y;
            torques[t + 2 * ndof + i] = c.holdingTorque[dofIds[i]!] ?? 0;
            torques[t + 3 * ndof + i] = g[i]!;
          }
        }
        const o = 7 * count++;
        rows[o] = a.x;
        rows[o + 1] = a.y;
        rows[o + 2] = b.x;
        rows[o + 3] = b.y;
        rows[o + 4] = force;
        rows[o + 5] = basis[0]!;
        rows[o + 6] = basis[1]!;
      }
    }
  }
  return {
    count,
    data: rows.subarray(0, 7 * count),
    ...(withFriction ? { friction: frictionPart(ndof, perDof, torques.subarray(0, fw * count)) } : {}),
  };
}

/** The friction part of the samples; `finiteColumns` when every hand force per unit holding
 * torque is finite, so a dof that friction holds adds nothing (a zero torque times a finite
 * column) and the scans may skip it. */
function frictionPart(ndof: number, perDof: Float64Array, torques: Float64Array): FitSamples["friction"] {
  let finiteColumns = true;
  for (let t = 0; t < torques.length; t += frictionWidth(ndof))
    for (let k = 0; k < 2 * ndof; k++) if (!Number.isFinite(torques[t + k]!)) finiteColumns = false;
  return { ndof, perDof, torques, finiteColumns };
}

/** The hand force of the raw holding torques (no friction), from the per-torque columns. */
function affinePart(P: Vec2[], dofIds: string[], holdingTorque: Record<string, number>): Vec2 {
  let x = 0;
  let y = 0;
  for (let i = 0; i < P.length; i++) {
    const col = P[i]!;
    const t = holdingTorque[dofIds[i]!] ?? 0;
    x += col.x * t;
    y += col.y * t;
  }
  return { x, y };
}

/** Scratch for the torques beyond friction of one sample (the search is single-threaded). */
let beyondScratch = new Float64Array(8);
let torqueScratch = new Float64Array(8);

/** The hand force of sample `i` with friction: torques tau0 + g df, each beyond its pivot's
 * friction, through P. */
function handAtWithFriction(s: NonNullable<FitSamples["friction"]>, i: number, df: number): number {
  const n = s.ndof;
  if (torqueScratch.length < n)
    ((torqueScratch = new Float64Array(n)), (beyondScratch = new Float64Array(n)));
  const t = frictionWidth(n) * i;
  const T = s.torques;
  for (let d = 0; d < n; d++) torqueScratch[d] = T[t + 2 * n + d]! + T[t + 3 * n + d]! * df;
  torqueBeyondFriction(torqueScratch, s.perDof, beyondScratch, n);
  let x = 0;
  let y = 0;
  for (let d = 0; d < n; d++) {
    x += T[t + d]! * beyondScratch[d]!;
    y += T[t + n + d]! * beyondScratch[d]!;
  }
  return Math.hypot(x, y);
}

function handAt(s: FitSamples, i: number, p0: number, p1: number): number {
  if (!s.friction) return affineHandAt(s.data, i, p0, p1);
  const d = s.data;
  const o = 7 * i;
  return handAtWithFriction(s.friction, i, d[o + 5]! * p0 + d[o + 6]! * p1 - d[o + 4]!);
}

/** The hand force a + b df of sample i, without friction. */
function affineHandAt(d: Float64Array, i: number, p0: number, p1: number): number {
  const o = 7 * i;
  const df = d[o + 5]! * p0 + d[o + 6]! * p1 - d[o + 4]!;
  return Math.hypot(d[o]! + d[o + 2]! * df, d[o + 1]! + d[o + 3]! * df);
}

/** Below this squared force (N^2) a square may have underflowed, and above the largest finite
 * double it has overflowed: there the scans fall back to Math.hypot on every sample. */
const SQUARE_FLOOR = 1e-280;
/** Samples whose squared force lies within this fraction of the largest square are re-measured
 * with Math.hypot: hypot and a sum of squares rank two forces alike unless they agree to a few
 * ulps (1e-15), so the sample hypot ranks first is always among them. */
const SQUARE_MARGIN = 1e-12;
const NEAR_TOP = 1 - SQUARE_MARGIN;

/** c0 p0 of every sample, for the last samples and p0 asked: the inner search holds p0 over its
 * thirty-odd evaluations, so the product is formed once per sample, not once per evaluation. It
 * is the same double, and the spring-force change stays (c0 p0 + c1 p1) - force, in that order. */
let firstTerms = new Float64Array(256);
let firstTermsSamples: FitSamples | undefined;
let firstTermsP0 = NaN;

function firstTermsOf(s: FitSamples, p0: number): Float64Array {
  if (s === firstTermsSamples && Object.is(p0, firstTermsP0)) return firstTerms;
  const { data: d, count } = s;
  if (firstTerms.length < count) firstTerms = new Float64Array(2 * count);
  for (let i = 0, o = 5; i < count; i++, o += 7) firstTerms[i] = d[o]! * p0;
  firstTermsSamples = s;
  firstTermsP0 = p0;
  return firstTerms;
}

/** The samples of the last scan whose square came within SQUARE_MARGIN of the running largest,
 * with their squares and force components (typed arrays, reused: the search is single-threaded;
 * in the untuned tier a second pass over every sample costs as much as a third of the first). */
let nearCount = 0;
let nearIndex = new Int32Array(256);
let nearSquare = new Float64Array(256);
let nearX = new Float64Array(256);
let nearY = new Float64Array(256);

function reserveNear(count: number): void {
  if (nearSquare.length >= count) return;
  nearSquare = new Float64Array(2 * count);
  nearX = new Float64Array(2 * count);
  nearY = new Float64Array(2 * count);
}

/** The largest Math.hypot among the kept samples whose square is within SQUARE_MARGIN of `top`
 * (the largest square of the scan): every sample that can rank first by hypot is kept, because
 * the running largest never exceeds `top`. */
function largestNearTop(top: number): number {
  const threshold = top * NEAR_TOP;
  let w = 0;
  for (let k = 0; k < nearCount; k++) {
    if (!(nearSquare[k]! >= threshold)) continue;
    const x = nearX[k]!;
    const y = nearY[k]!;
    const v = x === 0 && y === 0 ? 0 : Math.hypot(x, y);
    if (v > w) w = v;
  }
  return w;
}

/** The worst hand force over the samples: exactly the largest handAt (its Math.hypot, and NaN
 * with friction when a sample is NaN, as Math.max gives it), found by ranking squares in one pass
 * and calling hypot only near the top. */
function worstOf(s: FitSamples, p0: number, p1: number): number {
  if (!s.friction) return worstWithoutFriction(s, p0, p1);
  const top = keepNearTopWithFriction(s, s.friction, firstTermsOf(s, p0), p1);
  // A largest square of 0 (friction holds every sample, the usual case) kept every sample.
  if ((top > SQUARE_FLOOR || top === 0) && top < Infinity) return largestNearTop(top);
  let w = 0;
  for (let i = 0; i < s.count; i++) w = Math.max(w, handAt(s, i, p0, p1));
  return w;
}

/** One pass with friction: the hand force's components of every sample (handAtWithFriction's
 * arithmetic, inline: no calls per sample), keeping those near the running largest square.
 * Returns the largest square, NaN when some sample's is NaN. */
function keepNearTopWithFriction(
  s: FitSamples,
  f: NonNullable<FitSamples["friction"]>,
  first: Float64Array,
  p1: number,
): number {
  const { data: d, count } = s;
  const { ndof: n, perDof, torques: T, finiteColumns } = f;
  const fw = frictionWidth(n);
  reserveNear(count);
  let top = 0;
  let keep = 0;
  let kept = 0;
  let nan = false;
  for (let i = 0, o = 0, t = 0; i < count; i++, o += 7, t += fw) {
    const df = first[i]! + d[o + 6]! * p1 - d[o + 4]!;
    let x = 0;
    let y = 0;
    for (let k = 0; k < n; k++) {
      const torque = T[t + 2 * n + k]! + T[t + 3 * n + k]! * df;
      const fr = perDof[k]!;
      // torqueBeyondFriction (hand-force.ts), per dof.
      const beyond = torque > fr ? torque - fr : torque < -fr ? torque + fr : 0;
      // Held: adds a signed zero at most, which no square or hypot sees.
      if (beyond === 0 && finiteColumns) continue;
      x += T[t + k]! * beyond;
      y += T[t + n + k]! * beyond;
    }
    const v = x * x + y * y;
    if (v >= keep) {
      if (v > top) ((top = v), (keep = top * NEAR_TOP));
      ((nearSquare[kept] = v), (nearX[kept] = x), (nearY[kept++] = y));
    } else if (!(v < keep)) nan = true;
  }
  nearCount = kept;
  return nan ? NaN : top;
}

/** What the search minimises: the worst hand force, and with friction a small share of the worst
 * hand force friction did not help with, so that among the settings friction holds everywhere
 * (often a whole band of them) the search takes the one nearest a balance without friction:
 * friction wears and varies, and that setting leaves it the most margin. */
function objective(s: FitSamples, p0: number, p1: number): number {
  const w = worstOf(s, p0, p1);
  return s.friction ? w + FRICTION_TIE_BREAK * worstWithoutFriction(s, p0, p1) : w;
}

/** The share of the frictionless worst added to the objective with friction: small enough to
 * move the worst hand force with friction by a thousandth at most, large enough to pick a point
 * inside a band where friction holds everything (common practice, no source). */
const FRICTION_TIE_BREAK = 1e-3;

/** The worst hand force of the affine parts a + b df (no friction): exactly the largest
 * affineHandAt, from one pass that keeps the samples near the running largest square. A NaN
 * sample never counts. */
function worstWithoutFriction(s: FitSamples, p0: number, p1: number): number {
  const { data: d, count } = s;
  const first = firstTermsOf(s, p0);
  reserveNear(count);
  let top = 0;
  let keep = 0;
  let kept = 0;
  for (let i = 0, o = 0; i < count; i++, o += 7) {
    const df = first[i]! + d[o + 6]! * p1 - d[o + 4]!;
    const x = d[o]! + d[o + 2]! * df;
    const y = d[o + 1]! + d[o + 3]! * df;
    const v = x * x + y * y;
    if (v >= keep) {
      if (v > top) ((top = v), (keep = top * NEAR_TOP));
      ((nearSquare[kept] = v), (nearX[kept] = x), (nearY[kept++] = y));
    }
  }
  nearCount = kept;
  if (top > SQUARE_FLOOR && top < Infinity) return largestNearTop(top);
  let w = 0;
  for (let i = 0; i < count; i++) {
    const v = affineHandAt(d, i, p0, p1);
    if (v > w) w = v;
  }
  return w;
}

/** How far a sample's squared hand force on the quadratics can be from the exact arithmetic's
 * square, per unit roundoff (2^-53) and square newton of the magnitudes of its terms: each
 * component rounds by 5 units of its terms at most either way (five roundings; Higham, Accuracy
 * and Stability of Numerical Algorithms, 2nd ed., ch. 3), the squares, their sum and Horner's
 * rule add some 40 more; 256 leaves room, also for the rounding of the cut itself. The last
 * term covers underflow (each operation's absolute error is below 2^-1074 there). */
const QUADRATIC_ROUNDING = 256 * 2 ** -53;
const QUADRATIC_UNDERFLOW = 1e-300;
/** The quadratics are used only where nothing can overflow (terms below this many newtons) and
 * their largest square is far above underflow (this many N^2); elsewhere the exact scan runs. */
const QUADRATIC_TERMS_LIMIT = 1e150;
const QUADRATIC_SQUARE_FLOOR = 1e-200;
const WIDE_NEAR_TOP = 1 - 2 * SQUARE_MARGIN;

/** The samples' squared frictionless hand forces as quadratics in p1 for one p0, for the inner
 * search: |(x0, y0) + (x1, y1) p1|^2 = a + p1 (b + c p1), three numbers and four operations per
 * evaluation instead of seven and ten. They round differently from the exact arithmetic, by at
 * most `slack` N^2 for |p1| <= `p1Bound`, so they only pick the samples that can be the worst, and
 * those are then computed exactly. */
interface SquaresInP1 {
  samples: FitSamples;
  p0: number;
  p1Bound: number;
  abc: Float64Array;
  slack: number;
}

/** The parameters' bounds of one round's searches and the largest sum of the magnitudes of a
 * sample's terms within them (N; |c0 p0| taken as |c0| p0Bound, its rounding well inside the
 * slack's room): computed once per round, not per inner search. */
interface TermBounds {
  p0Bound: number;
  p1Bound: number;
  largestTerms: number;
}

function termBounds(s: FitSamples, p0Bound: number, p1Bound: number): TermBounds {
  const { data: d, count } = s;
  let largestTerms = 0;
  for (let o = 0; o < 7 * count; o += 7) {
    const spread = Math.abs(d[o + 5]!) * p0Bound + Math.abs(d[o + 4]!) + Math.abs(d[o + 6]!) * p1Bound;
    const terms =
      Math.abs(d[o]!) + Math.abs(d[o + 1]!) + (Math.abs(d[o + 2]!) + Math.abs(d[o + 3]!)) * spread;
    if (!(terms < QUADRATIC_TERMS_LIMIT)) largestTerms = Infinity;
    else if (terms > largestTerms) largestTerms = terms;
  }
  return { p0Bound, p1Bound, largestTerms };
}

function squaresInP1(s: FitSamples, p0: number, bounds: TermBounds): SquaresInP1 {
  const { data: d, count } = s;
  const first = firstTermsOf(s, p0);
  const abc = new Float64Array(3 * count);
  for (let i = 0, o = 0; i < count; i++, o += 7) {
    const free = first[i]! - d[o + 4]!;
    const x0 = d[o]! + d[o + 2]! * free;
    const x1 = d[o + 2]! * d[o + 6]!;
    const y0 = d[o + 1]! + d[o + 3]! * free;
    const y1 = d[o + 3]! * d[o + 6]!;
    abc[3 * i] = x0 * x0 + y0 * y0;
    abc[3 * i + 1] = 2 * (x0 * x1 + y0 * y1);
    abc[3 * i + 2] = x1 * x1 + y1 * y1;
  }
  const terms = Math.abs(p0) <= bounds.p0Bound ? bounds.largestTerms : Infinity;
  const slack = QUADRATIC_ROUNDING * terms * terms + QUADRATIC_UNDERFLOW;
  return { samples: s, p0, p1Bound: bounds.p1Bound, abc, slack };
}

/** worstWithoutFriction(samples, p0, p1), the same double: the quadratics pick the samples within
 * twice the slack (and the square margin) of their largest, and worstWithoutFriction's own
 * arithmetic and rule decide among them. */
function worstOnSquares(Q: SquaresInP1, p1: number): number {
  const s = Q.samples;
  const slack2 = 2 * Q.slack;
  if (!(Math.abs(p1) <= Q.p1Bound) || !(slack2 < Infinity)) return worstWithoutFriction(s, Q.p0, p1);
  const abc = Q.abc;
  const count = s.count;
  if (nearIndex.length < count) nearIndex = new Int32Array(2 * count);
  let top = 0;
  let cut = -slack2;
  let kept = 0;
  for (let k = 0, i = 0; i < count; i++, k += 3) {
    const v = abc[k]! + p1 * (abc[k + 1]! + abc[k + 2]! * p1);
    if (v >= cut) {
      if (v > top) ((top = v), (cut = top * WIDE_NEAR_TOP - slack2));
      nearIndex[kept++] = i;
    }
  }
  if (!(top > QUADRATIC_SQUARE_FLOOR && top < Infinity)) return worstWithoutFriction(s, Q.p0, p1);
  return worstOfKept(s, Q.p0, p1, kept);
}

/** worstWithoutFriction over the samples `nearIndex[0..kept)`, which hold every sample within the
 * square margin of the largest: its arithmetic and rule, the same double. */
function worstOfKept(s: FitSamples, p0: number, p1: number, kept: number): number {
  const { data: d, count } = s;
  const first = firstTermsOf(s, p0);
  reserveNear(count);
  let top = 0;
  for (let k = 0; k < kept; k++) {
    const i = nearIndex[k]!;
    const o = 7 * i;
    const df = first[i]! + d[o + 6]! * p1 - d[o + 4]!;
    const x = d[o]! + d[o + 2]! * df;
    const y = d[o + 1]! + d[o + 3]! * df;
    const v = x * x + y * y;
    ((nearSquare[k] = v), (nearX[k] = x), (nearY[k] = y));
    if (v > top) top = v;
  }
  nearCount = kept;
  return top > SQUARE_FLOOR && top < Infinity ? largestNearTop(top) : worstWithoutFriction(s, p0, p1);
}

/** objective(s, squares.p0, p1), the same double, its frictionless worst taken on the quadratics. */
function objectiveOnSquares(s: FitSamples, squares: SquaresInP1, p1: number): number {
  const w = s.friction ? worstOf(s, squares.p0, p1) : 0;
  const withoutFriction = worstOnSquares(squares, p1);
  return s.friction ? w + FRICTION_TIE_BREAK * withoutFriction : withoutFriction;
}

/** The samples `idx`, copied next to each other (the active set, scanned many times). */
function gather(s: FitSamples, idx: ArrayLike<number>): FitSamples {
  const d = s.data;
  const out = new Float64Array(7 * idx.length);
  for (let k = 0; k < idx.length; k++) out.set(d.subarray(7 * idx[k]!, 7 * idx[k]! + 7), 7 * k);
  if (!s.friction) return { count: idx.length, data: out };
  const fw = frictionWidth(s.friction.ndof);
  const torques = new Float64Array(fw * idx.length);
  for (let k = 0; k < idx.length; k++)
    torques.set(s.friction.torques.subarray(fw * idx[k]!, fw * idx[k]! + fw), fw * k);
  return { count: idx.length, data: out, friction: { ...s.friction, torques } };
}

/** The `k` sample indices of the largest hand force, largest first and ties in sample order: the
 * first k of a stable sort, picked by insertion into a short list instead of sorting every sample
 * (a non-finite force takes the sort itself, whose order the comparator then decides). */
function worstFirst(s: FitSamples, p0: number, p1: number, k: number): number[] {
  const count = s.count;
  const v = new Float64Array(count);
  for (let i = 0; i < count; i++) v[i] = handAt(s, i, p0, p1);
  const picked: number[] = [];
  for (let i = 0; i < count; i++) {
    const vi = v[i]!;
    if (!(vi >= 0 && vi < Infinity)) return sortedWorstFirst(v).slice(0, k);
    if (picked.length === k && !(vi > v[picked[k - 1]!]!)) continue;
    // After every picked force at least as large: ties keep sample order.
    let at = picked.length;
    while (at > 0 && v[picked[at - 1]!]! < vi) at--;
    picked.splice(at, 0, i);
    if (picked.length > k) picked.pop();
  }
  return picked;
}

function sortedWorstFirst(v: Float64Array): number[] {
  return Array.from({ length: v.length }, (_, i) => i).sort((i, j) => v[j]! - v[i]!);
}

function golden(f: (x: number) => number, lo: number, hi: number): number {
  const [a, b] = narrowBracket(f, lo, hi, (_width, step) => step < GOLDEN_ITERATIONS);
  // The minimum often sits on the bracket's low end (no initial tension, no spring): golden
  // section only creeps towards an end, so look at it.
  const mid = (a + b) / 2;
  return a === lo && f(lo) <= f(mid) ? lo : mid;
}

/** Least-squares estimate of the parameters (sum of squared hand forces), to bracket the search. */
function leastSquares(d: Float64Array, count: number, twoParameters: boolean): [number, number] {
  let uu = 0,
    uw = 0,
    ww = 0,
    ue = 0,
    we = 0;
  for (let i = 0; i < count; i++) {
    const o = 7 * i;
    const ex = d[o]! - d[o + 2]! * d[o + 4]!;
    const ey = d[o + 1]! - d[o + 3]! * d[o + 4]!;
    const ux = d[o + 2]! * d[o + 5]!,
      uy = d[o + 3]! * d[o + 5]!;
    const wx = d[o + 2]! * d[o + 6]!,
      wy = d[o + 3]! * d[o + 6]!;
    uu += ux * ux + uy * uy;
    uw += ux * wx + uy * wy;
    ww += wx * wx + wy * wy;
    ue += ux * ex + uy * ey;
    we += wx * ex + wy * ey;
  }
  if (!twoParameters || ww === 0) return [uu > 0 ? -ue / uu : 0, 0];
  const det = uu * ww - uw * uw;
  if (Math.abs(det) < 1e-14 * uu * ww) return [uu > 0 ? -ue / uu : 0, 0];
  return [(-ue * ww + we * uw) / det, (-we * uu + ue * uw) / det];
}

/** The spring settings that minimise the worst hand force over the sweep, all load cases and
 * payloads. Undefined when the spring moves no payload. */
export function bestSpringFit(model: ArmModel, sweep: SweepResult, springId: string): SpringFit | undefined {
  const s = model.springs.find((x) => x.id === springId);
  if (!s) return undefined;
  const params = springParameters(s);
  const samples = collectSamples(model, sweep, s);
  if (samples.count === 0) return undefined;
  const d = samples.data;
  const count = samples.count;
  const two = params.names[1] !== undefined;
  const [c0, c1] = params.values;
  const before = worstOf(samples, c0, c1);
  const [e0, e1] = leastSquares(d, count, two);
  const hi0 = 3 * Math.max(Math.abs(e0), Math.abs(c0), 1e-9);
  const span1 = 3 * Math.max(Math.abs(e1), Math.abs(c1), 1e-9);
  // Initial tension cannot be negative; a torsion preload can wind either way.
  const lo1 = springKind(s).fit[1]?.signed ? -span1 : 0;
  const hi1 = span1;

  // Active set: the worst poses now, plus an even spread.
  const active = new Set<number>(worstFirst(samples, c0, c1, ACTIVE_SEED));
  const stride = Math.max(1, Math.floor(count / ACTIVE_SEED));
  for (let i = 0; i < count; i += stride) active.add(i);
  let best: [number, number] = [c0, c1];
  for (let round = 0; round < ACTIVE_ROUNDS; round++) {
    if (pastDeadline()) return undefined; // out of budget or cancelled: no fit offered
    const act = gather(samples, Int32Array.from(active));
    const bounds = termBounds(act, hi0, Math.max(Math.abs(lo1), Math.abs(hi1)));
    const inner = (p0: number): number => {
      if (!two) return 0;
      const squares = squaresInP1(act, p0, bounds);
      return golden((p1) => objectiveOnSquares(act, squares, p1), lo1, hi1);
    };
    const p0 = golden((x) => objective(act, x, inner(x)), 0, hi0);
    best = [p0, inner(p0)];
    const activeWorst = worstOf(act, best[0], best[1]);
    const fullWorst = worstOf(samples, best[0], best[1]);
    if (fullWorst <= activeWorst * (1 + 1e-9) + 1e-12) break;
    for (const i of worstFirst(samples, best[0], best[1], ACTIVE_ADD)) active.add(i);
  }
  let after = worstOf(samples, best[0], best[1]);
  // No better than the settings as written (friction may already hold everything): keep them.
  if (after > before || (samples.friction && after >= before)) {
    best = [c0, c1];
    after = before;
  }
  return {
    springId,
    names: params.names,
    current: [c0, c1],
    best,
    worstHandForceBefore: before,
    worstHandForceAfter: after,
  };
}

export interface IdealRate {
  /** k = m g l / (a b), N/m. */
  rate: number;
  /** The gravity moment amplitude m g l, N*m. */
  gravityMoment: number;
  a: number;
  b: number;
  dofId: string;
}

/** The zero-free-length ideal rate k = m g l / (a b) (Streit and Gilmore 1989), where the simple
 * geometry holds: one end on a body that does not turn, straight above the pivot of a degree of
 * freedom, the other on the turning link (or a parallelogram bar), and the gravity torque at that
 * dof following m g l cos(angle of the hook line). Undefined otherwise. */
export function idealZeroLengthRate(
  model: ArmModel,
  sweep: SweepResult,
  springId: string,
): IdealRate | undefined {
  const s = model.springs.find((x) => x.id === springId);
  if (!s || atJoint(s) || !springKind(s).lineRate) return undefined;
  const ref = sweep.reference;
  if (!ref) return undefined;
  for (const dof of sweep.dofs) {
    const joint = model.joints.find((j) => j.id === dof.jointId);
    if (!joint) continue;
    // The turning side: the dof's child, or the upper bar of the parallelogram it drives.
    const stage = model.parallelograms.find((p) => p.joints.lowerRoot === joint.id);
    const upperRoot = stage ? model.joints.find((j) => j.id === stage.joints.upperRoot) : undefined;
    const pivots = [
      { child: joint.child, parentPoint: joint.parentPoint, childPoint: joint.childPoint },
      ...(upperRoot
        ? [{ child: upperRoot.child, parentPoint: upperRoot.parentPoint, childPoint: upperRoot.childPoint }]
        : []),
    ];
    for (const pv of pivots) {
      const ends = [s.a, s.b];
      const anchor = ends.find((e) => e.body === joint.parent);
      const hook = ends.find((e) => e.body === pv.child);
      if (!anchor || !hook || anchor === hook) continue;
      const parentPose = ref.bodies[joint.parent];
      if (!parentPose) continue;
      // The anchor's body must not turn over the sweep.
      const phis = sweep.poses.map((p) => p.bodies[joint.parent]?.phi ?? 0);
      if (Math.max(...phis) - Math.min(...phis) > 1e-9) continue;
      const av = rotate(
        { x: anchor.point.x - pv.parentPoint.x, y: anchor.point.y - pv.parentPoint.y },
        parentPose.phi,
      );
      const a = Math.hypot(av.x, av.y);
      if (!(a > 0) || Math.abs(Math.atan2(av.x, av.y)) > VERTICAL_TOLERANCE) continue;
      const hv = { x: hook.point.x - pv.childPoint.x, y: hook.point.y - pv.childPoint.y };
      const b = Math.hypot(hv.x, hv.y);
      if (!(b > 0)) continue;
      const hookAngle = Math.atan2(hv.y, hv.x);
      // Gravity torque at the dof alone (springs taken out), over poses with the other dofs
      // nearest their reference.
      const others = sweep.dofs.filter((x) => x !== dof);
      const nearest = new Map(
        others.map((o) => [
          o.id,
          nearestValue(
            sweep.poses.map((p) => p.angles[o.id]!),
            o.reference,
          ),
        ]),
      );
      let sc = 0,
        cc = 0;
      const pts: { t: number; c: number }[] = [];
      for (const pose of sweep.poses) {
        if (others.some((o) => pose.angles[o.id] !== nearest.get(o.id))) continue;
        const st = pose.cases[0];
        const child = pose.bodies[pv.child];
        if (!st || !child) continue;
        let t = st.holdingTorque[dof.id] ?? 0;
        for (const sp of model.springs)
          t -= (springDofValue(pose.springTorquePerUnit, sp.id, dof.id) ?? 0) * (st.springForce[sp.id] ?? 0);
        const c = Math.cos(child.phi + hookAngle);
        pts.push({ t, c });
        sc += t * c;
        cc += c * c;
      }
      if (pts.length < 3 || cc === 0) continue;
      const M = sc / cc;
      if (!(M > 0)) continue;
      const rms = Math.sqrt(pts.reduce((acc, p) => acc + (p.t - M * p.c) ** 2, 0) / pts.length);
      if (rms > COSINE_FIT_TOLERANCE * M) continue;
      return { rate: M / (a * b), gravityMoment: M, a, b, dofId: dof.id };
    }
  }
  return undefined;
}

function nearestValue(values: number[], target: number): number {
  let best = values[0] ?? target;
  for (const v of values) if (Math.abs(v - target) < Math.abs(best - target)) best = v;
  return best;
}

// Linear constraints between the degrees of freedom of a frame (supports, pins, welds, rigid
// offsets), eliminated exactly by master-slave substitution: each constraint sum c_k u_k = 0 makes
// one dof a combination of the others (the transformation method of imposing constraints, e.g.
// Cook, Malkus, Plesha and Witt, Concepts and Applications of Finite Element Analysis, 4th ed.,
// chapter on constraints; section from memory). Exact elimination keeps a rigid
// arm a few mm long from spoiling the conditioning, as a very stiff member would, and closes loops
// (a redundant constraint reduces to nothing and is dropped).

/** A constraint whose coefficients, once expressed in the independent dofs, are all below this
 * share of its largest written coefficient is already implied by the others (a closed loop). */
const REDUNDANT_RATIO = 1e-10;
/** A preferred pivot (the slave's own dof) is taken when its coefficient is at least this share
 * of the largest: it keeps the chosen dof meaningful without risking a tiny pivot. */
const PREFERRED_PIVOT_RATIO = 1e-2;

export type Term = readonly [dof: number, coefficient: number];

/** How each raw dof follows the independent ones, row by row (compressed rows): raw dof d is
 * sum over k in start[d] .. start[d+1]-1 of coef[k] times equation eq[k] (no terms: held). */
export interface DofTransform {
  /** Independent dofs (equations) in raw order. */
  count: number;
  /** The raw dof of each equation. */
  raw: Int32Array;
  start: Int32Array;
  eq: Int32Array;
  coef: Float64Array;
}

/** A linear expression in raw dofs: dof[k] times coef[k], in the order the terms arrived (a sum
 * taken in that order rounds as it always has). Short: a rigid offset or a pin has a few terms. */
interface Expression {
  dof: number[];
  coef: number[];
}

/** The term's index for `dof`, or -1. */
function termOf(e: Expression, dof: number): number {
  const dofs = e.dof;
  for (let k = 0; k < dofs.length; k++) if (dofs[k] === dof) return k;
  return -1;
}

function removeTerm(e: Expression, k: number): void {
  e.dof.splice(k, 1);
  e.coef.splice(k, 1);
}

/** Adds c to the term of `dof` (a new term at the end). */
function accumulate(e: Expression, dof: number, c: number): void {
  const k = termOf(e, dof);
  if (k < 0) (e.dof.push(dof), e.coef.push(0 + c));
  else e.coef[k] = e.coef[k]! + c;
}

export class DofConstraints {
  /** For a dependent dof, its expression in independent raw dofs; undefined when independent. */
  private readonly expression: (Expression | undefined)[] = [];
  /** For an independent dof, the dependent dofs whose expressions use it (no repeats, any order). */
  private readonly users: (number[] | undefined)[] = [];
  private cached?: DofTransform;

  /** Makes room for raw dofs 0 .. count - 1. */
  grow(count: number): void {
    while (this.expression.length < count) this.expression.push(undefined);
    this.cached = undefined;
  }

  isIndependent(dof: number): boolean {
    return this.expression[dof] === undefined;
  }

  /** Holds a dof at zero. */
  hold(dof: number): void {
    this.add([[dof, 1]], [dof]);
  }

  /** Adds sum c_k u_k = 0. `prefer` lists dofs to eliminate first if they can be (the slave's).
   * Returns false when the constraint was already implied by the others. */
  add(terms: readonly Term[], prefer: readonly number[] = []): boolean {
    this.cached = undefined;
    let largest = 0;
    for (const [, c] of terms) largest = Math.max(largest, Math.abs(c));
    const reduced: Expression = { dof: [], coef: [] };
    for (const [d, c] of terms) {
      const e = this.expression[d];
      if (e === undefined) accumulate(reduced, d, c);
      else for (let k = 0; k < e.dof.length; k++) accumulate(reduced, e.dof[k]!, c * e.coef[k]!);
    }
    // drop what the others already imply, keeping the order of the rest
    const kept: Expression = { dof: [], coef: [] };
    let pivot = -1;
    let pivotAbs = 0;
    for (let k = 0; k < reduced.dof.length; k++) {
      const d = reduced.dof[k]!;
      const c = reduced.coef[k]!;
      if (Math.abs(c) <= REDUNDANT_RATIO * largest) continue;
      kept.dof.push(d);
      kept.coef.push(c);
      if (Math.abs(c) > pivotAbs) ((pivot = d), (pivotAbs = Math.abs(c)));
    }
    if (pivot < 0) return false;
    let preferred = -1;
    let preferredAbs = 0;
    for (const d of prefer) {
      const k = termOf(kept, d);
      if (k >= 0 && Math.abs(kept.coef[k]!) > preferredAbs)
        ((preferred = d), (preferredAbs = Math.abs(kept.coef[k]!)));
    }
    if (preferred >= 0 && preferredAbs >= PREFERRED_PIVOT_RATIO * pivotAbs) pivot = preferred;
    const cp = kept.coef[termOf(kept, pivot)]!;
    const expr: Expression = { dof: [], coef: [] };
    for (let k = 0; k < kept.dof.length; k++)
      if (kept.dof[k] !== pivot) (expr.dof.push(kept.dof[k]!), expr.coef.push(-kept.coef[k]! / cp));
    this.eliminate(pivot, expr);
    return true;
  }

  /** Makes `pivot` dependent with the given expression and substitutes it wherever it was used. */
  private eliminate(pivot: number, expr: Expression): void {
    const dependents = this.users[pivot];
    this.users[pivot] = undefined;
    this.expression[pivot] = expr;
    for (const k of expr.dof) this.addUser(k, pivot);
    if (!dependents) return;
    for (const q of dependents) {
      const eq = this.expression[q]!;
      const at = termOf(eq, pivot);
      if (at < 0) continue;
      const weight = eq.coef[at]!;
      removeTerm(eq, at);
      for (let t = 0; t < expr.dof.length; t++) {
        const k = expr.dof[t]!;
        const i = termOf(eq, k);
        const sum = (i < 0 ? 0 : eq.coef[i]!) + weight * expr.coef[t]!;
        if (sum === 0) {
          if (i >= 0) removeTerm(eq, i);
          this.removeUser(k, q);
        } else {
          if (i >= 0) eq.coef[i] = sum;
          else (eq.dof.push(k), eq.coef.push(sum));
          this.addUser(k, q);
        }
      }
    }
  }

  private addUser(dof: number, user: number): void {
    const list = (this.users[dof] ??= []);
    if (!list.includes(user)) list.push(user);
  }

  private removeUser(dof: number, user: number): void {
    const list = this.users[dof];
    const k = list ? list.indexOf(user) : -1;
    if (k >= 0) ((list![k] = list![list!.length - 1]!), list!.pop());
  }

  /** Equation numbers of the independent dofs (raw order, so a frame numbered along the arm
   * keeps a narrow profile) and every raw dof's expression in them. */
  transform(): DofTransform {
    if (this.cached) return this.cached;
    const n = this.expression.length;
    const number = new Int32Array(n).fill(-1);
    let count = 0;
    let total = 0;
    for (let d = 0; d < n; d++) {
      const e = this.expression[d];
      if (e === undefined) ((number[d] = count++), total++);
      else total += e.dof.length;
    }
    const raw = new Int32Array(count);
    for (let d = 0; d < n; d++) if (number[d]! >= 0) raw[number[d]!] = d;
    const start = new Int32Array(n + 1);
    const eq = new Int32Array(total);
    const coef = new Float64Array(total);
    let k = 0;
    for (let d = 0; d < n; d++) {
      start[d] = k;
      const e = this.expression[d];
      if (e === undefined) ((eq[k] = number[d]!), (coef[k] = 1), k++);
      else for (let t = 0; t < e.dof.length; t++) ((eq[k] = number[e.dof[t]!]!), (coef[k] = e.coef[t]!), k++);
    }
    start[n] = k;
    this.cached = { count, raw, start, eq, coef };
    return this.cached;
  }
}

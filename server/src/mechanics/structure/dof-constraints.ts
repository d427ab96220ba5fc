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

export class DofConstraints {
  /** For a dependent dof, its expression in independent raw dofs; undefined when independent. */
  private readonly expression: (Map<number, number> | undefined)[] = [];
  /** For an independent dof, the dependent dofs whose expressions use it. */
  private readonly users = new Map<number, Set<number>>();
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
    const reduced = new Map<number, number>();
    const accumulate = (d: number, c: number) => reduced.set(d, (reduced.get(d) ?? 0) + c);
    for (const [d, c] of terms) {
      const e = this.expression[d];
      if (e === undefined) accumulate(d, c);
      else for (const [k, v] of e) accumulate(k, c * v);
    }
    let pivot = -1;
    let pivotAbs = 0;
    for (const [d, c] of reduced) {
      if (Math.abs(c) <= REDUNDANT_RATIO * largest) reduced.delete(d);
      else if (Math.abs(c) > pivotAbs) ((pivot = d), (pivotAbs = Math.abs(c)));
    }
    if (pivot < 0) return false;
    let preferred = -1;
    let preferredAbs = 0;
    for (const d of prefer) {
      const c = reduced.get(d);
      if (c !== undefined && Math.abs(c) > preferredAbs) ((preferred = d), (preferredAbs = Math.abs(c)));
    }
    if (preferred >= 0 && preferredAbs >= PREFERRED_PIVOT_RATIO * pivotAbs) pivot = preferred;
    const cp = reduced.get(pivot)!;
    const expr = new Map<number, number>();
    for (const [d, c] of reduced) if (d !== pivot) expr.set(d, -c / cp);
    this.eliminate(pivot, expr);
    return true;
  }

  /** Makes `pivot` dependent with the given expression and substitutes it wherever it was used. */
  private eliminate(pivot: number, expr: Map<number, number>): void {
    const dependents = this.users.get(pivot);
    this.users.delete(pivot);
    this.expression[pivot] = expr;
    for (const k of expr.keys()) this.usersOf(k).add(pivot);
    if (!dependents) return;
    for (const q of dependents) {
      const eq = this.expression[q]!;
      const weight = eq.get(pivot);
      if (weight === undefined) continue;
      eq.delete(pivot);
      for (const [k, v] of expr) {
        const sum = (eq.get(k) ?? 0) + weight * v;
        if (sum === 0) {
          eq.delete(k);
          this.users.get(k)?.delete(q);
        } else {
          eq.set(k, sum);
          this.usersOf(k).add(q);
        }
      }
    }
  }

  private usersOf(dof: number): Set<number> {
    let s = this.users.get(dof);
    if (!s) this.users.set(dof, (s = new Set()));
    return s;
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
      else total += e.size;
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
      else for (const [dof, v] of e) ((eq[k] = number[dof]!), (coef[k] = v), k++);
    }
    start[n] = k;
    this.cached = { count, raw, start, eq, coef };
    return this.cached;
  }
}

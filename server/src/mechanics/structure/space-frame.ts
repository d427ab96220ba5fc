// Space frame by the direct stiffness method (McGuire, Gallagher and Ziemian, Matrix Structural
// Analysis, 2nd ed., ch. 4-5): six dofs a node (three translations, three rotations, global axes),
// Bernoulli members with torsion and bending about two axes, axial and rotational springs, and
// exact constraints for supports, welds, pins (a revolute pin releases only the rotation about its
// own axis) and rigid offsets. Loads: node forces and moments and the work-equivalent loads of a
// member's own weight; masses: consistent member masses plus point masses. SI units.
import { DofConstraints, type DofTransform, type Term } from "./dof-constraints";
import { CompressedRows, SkylineMatrix } from "./skyline";
import { graphOfGroups, reverseCuthillMcKee } from "./ordering";
import { lowestModes } from "./subspace";
import {
  localConsistentMass,
  localStiffness,
  localUniformLoad,
  memberAxes,
  toGlobalMatrix,
  toGlobalVector,
  toLocal3,
  toLocalVector,
  type MemberProperties,
  type Vec3,
} from "./space-element";

export type { MemberProperties, Vec3 } from "./space-element";

const NODE_DOFS = 6;

export interface SpaceMember {
  i: number;
  j: number;
  props: MemberProperties;
  /** Rows: local x, y, z in global axes. */
  axes: Float64Array;
  length: number;
  /** Uniform load per length in global axes (own weight), N/m. */
  load: Vec3;
  /** A massless carrier of mass only (a rigid part: its stiffness is in the constraints). */
  massOnly: boolean;
  /** Global stiffness, computed on first use (assembly and every strain energy read it). */
  stiffness?: Float64Array;
}

export interface SpaceDisplacement {
  /** m, global axes */
  translation: Vec3;
  /** rad, global axes (a small rotation vector) */
  rotation: Vec3;
}

/** Member end forces in local axes, as the nodes exert them on the member (the work-equivalent
 * loads taken off): axial N (fx2 > 0 in tension), shears, torque and bending moments. */
export interface SpaceEndForces {
  i: { fx: number; fy: number; fz: number; mx: number; my: number; mz: number };
  j: { fx: number; fy: number; fz: number; mx: number; my: number; mz: number };
}

interface Spring {
  i: number;
  j: number;
  rate: number;
  /** Unit direction: the line of an axial spring, the axis of a rotational one. */
  axis: Vec3;
}

/** What a frame's stiffness gives, computed on first use: its equation numbering and its
 * factorisation (null for a mechanism). Frames of one structure hold the same object. */
interface Solved {
  factor?: { factor: SkylineMatrix; rows: CompressedRows; diagonal: Float64Array } | null;
  transform?: DofTransform;
}

/** The last few numberings computed, by their graph written out flat (the count, then each group's
 * size and equations). Frames of one arm at other poses and headings mostly couple the same
 * equations, and the numbering depends on nothing else: an exact match reuses it. */
const recentOrderings: { graph: Int32Array; order: Int32Array }[] = [];
const RECENT_ORDERINGS = 8;

function flatGraph(count: number, groups: readonly (readonly number[])[]): Int32Array {
  let size = 1;
  for (const g of groups) size += 1 + g.length;
  const flat = new Int32Array(size);
  let k = 0;
  flat[k++] = count;
  for (const g of groups) {
    flat[k++] = g.length;
    for (const e of g) flat[k++] = e;
  }
  return flat;
}

/** reverseCuthillMcKee over the groups' graph, reused when a recent frame had the same graph. */
function orderingOf(count: number, groups: readonly (readonly number[])[]): Int32Array {
  const graph = flatGraph(count, groups);
  for (const known of recentOrderings) if (sameArray(known.graph, graph)) return known.order;
  const order = reverseCuthillMcKee(graphOfGroups(count, groups));
  recentOrderings.unshift({ graph, order });
  if (recentOrderings.length > RECENT_ORDERINGS) recentOrderings.pop();
  return order;
}

export class SpaceFrame {
  readonly nodes: Vec3[];
  readonly members: SpaceMember[];
  private readonly axialSprings: Spring[];
  private readonly rotationalSprings: Spring[];
  private readonly constraints: DofConstraints;
  private readonly loadRaw: number[];
  private readonly massRaw: number[];
  private solved: Solved = {};

  /** An empty frame; or, `from` another, one that shares its nodes, members, springs and
   * constraints (and the factorisation, once either computes it) with copies of its loads and
   * masses: another load case of one structure. Neither may then change its structure. */
  constructor(from?: SpaceFrame) {
    this.nodes = from ? from.nodes : [];
    this.members = from ? from.members : [];
    this.axialSprings = from ? from.axialSprings : [];
    this.rotationalSprings = from ? from.rotationalSprings : [];
    this.constraints = from ? from.constraints : new DofConstraints();
    this.loadRaw = from ? from.loadRaw.slice() : [];
    this.massRaw = from ? from.massRaw.slice() : [];
    if (from) this.solved = from.solved;
  }

  addNode(p: Vec3): number {
    this.changed();
    this.nodes.push({ ...p });
    for (let k = 0; k < NODE_DOFS; k++) {
      this.loadRaw.push(0);
      this.massRaw.push(0);
    }
    this.constraints.grow(this.nodes.length * NODE_DOFS);
    return this.nodes.length - 1;
  }

  get nodeCount(): number {
    return this.nodes.length;
  }

  private changed(): void {
    // a fresh object: a frame that shares the old one keeps it
    this.solved = {};
  }

  /** Ground: no movement at all. */
  fix(node: number): void {
    this.changed();
    for (let k = 0; k < NODE_DOFS; k++) this.constraints.hold(node * NODE_DOFS + k);
  }

  /** Holds one raw dof (0-2 translations x, y, z; 3-5 rotations) at zero. */
  hold(node: number, dof: number): void {
    this.changed();
    this.constraints.hold(node * NODE_DOFS + dof);
  }

  /** Both nodes move together (b follows a). */
  tieTranslations(a: number, b: number): void {
    this.changed();
    for (let k = 0; k < 3; k++) this.equal(a * NODE_DOFS + k, b * NODE_DOFS + k);
  }

  /** Two nodes joined rigidly: translations and rotations equal. */
  weld(a: number, b: number): void {
    this.tieTranslations(a, b);
    for (let k = 3; k < 6; k++) this.equal(a * NODE_DOFS + k, b * NODE_DOFS + k);
  }

  /** A revolute pin between a and b about `axis`: translations equal, and the rotations equal
   * except about the axis (the one released rotation). */
  pin(a: number, b: number, axis: Vec3): void {
    this.tieTranslations(a, b);
    const n = unit(axis);
    for (const e of normalsTo(n)) {
      const terms: Term[] = [];
      const prefer: number[] = [];
      const comps = [e.x, e.y, e.z];
      for (let k = 0; k < 3; k++) {
        if (comps[k] === 0) continue;
        terms.push([b * NODE_DOFS + 3 + k, comps[k]!], [a * NODE_DOFS + 3 + k, -comps[k]!]);
        prefer.push(b * NODE_DOFS + 3 + k);
      }
      this.constraints.add(terms, prefer);
    }
  }

  /** `slave` follows `master` as if joined by a rigid arm: u_s = u_m + theta_m x r, theta_s =
   * theta_m, r from master to slave. */
  rigidOffset(master: number, slave: number): void {
    this.changed();
    const m = master * NODE_DOFS;
    const s = slave * NODE_DOFS;
    const r = sub(this.nodes[slave]!, this.nodes[master]!);
    const rc = [r.x, r.y, r.z];
    // (theta x r)_k = theta_(k+1) r_(k+2) - theta_(k+2) r_(k+1)
    for (let k = 0; k < 3; k++) {
      const k1 = (k + 1) % 3;
      const k2 = (k + 2) % 3;
      const terms: Term[] = [
        [s + k, 1],
        [m + k, -1],
      ];
      if (rc[k2] !== 0) terms.push([m + 3 + k1, -rc[k2]!]);
      if (rc[k1] !== 0) terms.push([m + 3 + k2, rc[k1]!]);
      this.constraints.add(terms, [s + k]);
    }
    for (let k = 3; k < 6; k++) this.equal(m + k, s + k);
  }

  private equal(a: number, b: number): void {
    this.changed();
    this.constraints.add(
      [
        [b, 1],
        [a, -1],
      ],
      [b],
    );
  }

  /** A member from i to j; `across` is the section's local z (the axis of in-plane bending, along
   * the pin axes of the arm's plane): bending about z uses bendingRigidityZ. */
  addMember(i: number, j: number, props: MemberProperties, across: Vec3): number {
    this.changed();
    const { axes, length } = memberAxes(this.nodes[i]!, this.nodes[j]!, across);
    this.members.push({ i, j, props, axes, length, load: { x: 0, y: 0, z: 0 }, massOnly: false });
    return this.members.length - 1;
  }

  /** A part modelled as rigid (its nodes tied by rigidOffset): only its mass and weight, spread
   * along i-j by the consistent mass and the work-equivalent loads. */
  addMassOnlyMember(i: number, j: number, massPerLength: number): number {
    const props: MemberProperties = {
      axialRigidity: 0,
      torsionalRigidity: 0,
      bendingRigidityY: 0,
      bendingRigidityZ: 0,
      massPerLength,
      rotaryInertiaPerLength: 0,
    };
    const { axes, length } = memberAxes(this.nodes[i]!, this.nodes[j]!, { x: 0, y: 0, z: 1 });
    this.members.push({ i, j, props, axes, length, load: { x: 0, y: 0, z: 0 }, massOnly: true });
    return this.members.length - 1;
  }

  /** A uniform load along a member (own weight: mass per length x gravity vector), N/m. */
  addMemberLoad(index: number, perLength: Vec3): void {
    const m = this.members[index]!;
    m.load = add(m.load, perLength);
  }

  addAxialSpring(i: number, j: number, rate: number): void {
    this.changed();
    const d = sub(this.nodes[j]!, this.nodes[i]!);
    const L = norm(d);
    if (!(L > 0) || !(rate > 0)) return;
    this.axialSprings.push({ i, j, rate, axis: scale(d, 1 / L) });
  }

  /** A torsion spring between the rotations of i and j about `axis`. */
  addRotationalSpring(i: number, j: number, rate: number, axis: Vec3): void {
    this.changed();
    if (!(rate > 0)) return;
    this.rotationalSprings.push({ i, j, rate, axis: unit(axis) });
  }

  /** Translational point mass, kg (its own rotary inertia is not modelled). */
  addMass(node: number, mass: number): void {
    for (let k = 0; k < 3; k++)
      this.massRaw[node * NODE_DOFS + k] = this.massRaw[node * NODE_DOFS + k]! + mass;
  }

  addLoad(node: number, force: Vec3, moment: Vec3 = { x: 0, y: 0, z: 0 }): void {
    const v = [force.x, force.y, force.z, moment.x, moment.y, moment.z];
    for (let k = 0; k < 6; k++)
      this.loadRaw[node * NODE_DOFS + k] = this.loadRaw[node * NODE_DOFS + k]! + v[k]!;
  }

  /** Global 12 x 12 stiffness of member `index`. */
  memberStiffness(index: number): Float64Array {
    const m = this.members[index]!;
    return (m.stiffness ??= toGlobalMatrix(localStiffness(m.props, m.length), m.axes));
  }

  private rawDofs(m: { i: number; j: number }): number[] {
    const out: number[] = [];
    for (const node of [m.i, m.j]) for (let k = 0; k < NODE_DOFS; k++) out.push(node * NODE_DOFS + k);
    return out;
  }

  /** Raw dofs of every connection that couples dofs (members, springs, point masses). */
  private connections(): number[][] {
    const out: number[][] = this.members.map((m) => this.rawDofs(m));
    const pair = (sp: Spring, offset: number) => {
      const raw: number[] = [];
      for (const node of [sp.i, sp.j]) for (let k = 0; k < 3; k++) raw.push(node * NODE_DOFS + offset + k);
      out.push(raw);
    };
    for (const sp of this.axialSprings) pair(sp, 0);
    for (const sp of this.rotationalSprings) pair(sp, 3);
    for (let d = 0; d < this.massRaw.length; d++) if (this.massRaw[d]! > 0) out.push([d]);
    return out;
  }

  /** The constraints' transform with its equations numbered along the frame (reverse
   * Cuthill-McKee over the couplings, ordering.ts), so that every skyline row stays short. */
  private transform(): DofTransform {
    if (this.solved.transform) return this.solved.transform;
    const t = this.constraints.transform();
    const groups = this.connections().map((raw) => {
      const eqs: number[] = [];
      for (const d of raw) for (let k = t.start[d]!; k < t.start[d + 1]!; k++) eqs.push(t.eq[k]!);
      return eqs;
    });
    const order = orderingOf(t.count, groups);
    const number = new Int32Array(t.count);
    for (let k = 0; k < t.count; k++) number[order[k]!] = k;
    const raw = new Int32Array(t.count);
    for (let k = 0; k < t.count; k++) raw[k] = t.raw[order[k]!]!;
    const eq = new Int32Array(t.eq.length);
    for (let k = 0; k < eq.length; k++) eq[k] = number[t.eq[k]!]!;
    this.solved.transform = { count: t.count, raw, start: t.start, eq, coef: t.coef };
    return this.solved.transform;
  }

  /** The skyline of the reduced matrices: each equation's row reaches back to the lowest
   * equation any connection couples it with. */
  private profile(t: DofTransform): Int32Array {
    const first = new Int32Array(t.count);
    for (let e = 0; e < t.count; e++) first[e] = e;
    const eqs: number[] = [];
    for (const raw of this.connections()) {
      eqs.length = 0;
      let low = Infinity;
      for (const d of raw)
        for (let k = t.start[d]!; k < t.start[d + 1]!; k++) {
          eqs.push(t.eq[k]!);
          low = Math.min(low, t.eq[k]!);
        }
      for (const e of eqs) if (low < first[e]!) first[e] = low;
    }
    return first;
  }

  /** Adds a global block over raw dofs into the reduced matrix through the transform. */
  private scatter(
    target: SkylineMatrix,
    t: DofTransform,
    raw: readonly number[],
    block: ArrayLike<number>,
  ): void {
    const size = raw.length;
    const { start, eq, coef } = t;
    for (let p = 0; p < size; p++) {
      const dp = raw[p]!;
      if (start[dp] === start[dp + 1]) continue;
      for (let q = 0; q <= p; q++) {
        const v = block[p * size + q]!;
        if (v === 0) continue;
        const dq = raw[q]!;
        for (let a = start[dp]!; a < start[dp + 1]!; a++)
          for (let b = start[dq]!; b < start[dq + 1]!; b++) {
            const ea = eq[a]!;
            const eb = eq[b]!;
            // Only the lower triangle (row >= column) is stored. Off the block's diagonal, the
            // pair (p, q) stands for (q, p) too: it puts w at (ea, eb) and at (eb, ea), one
            // of which is stored (both when ea = eb). On it, (a, b) and (b, a) are both
            // visited, so only the one with ea >= eb is kept.
            if (p === q && ea < eb) continue;
            const w = coef[a]! * v * coef[b]!;
            target.add(ea, eb, p !== q && ea === eb ? 2 * w : w);
          }
      }
    }
  }

  private assembleStiffness(t: DofTransform, first: Int32Array): SkylineMatrix {
    const K = new SkylineMatrix(t.count, first);
    this.members.forEach((m, index) => {
      if (!m.massOnly) this.scatter(K, t, this.rawDofs(m), this.memberStiffness(index));
    });
    const pair = (sp: Spring, offset: number) => {
      const a = [sp.axis.x, sp.axis.y, sp.axis.z];
      const raw: number[] = [];
      for (const node of [sp.i, sp.j]) for (let k = 0; k < 3; k++) raw.push(node * NODE_DOFS + offset + k);
      const block = new Float64Array(36);
      for (let p = 0; p < 6; p++)
        for (let q = 0; q < 6; q++)
          block[p * 6 + q] = (p < 3 === q < 3 ? 1 : -1) * sp.rate * a[p % 3]! * a[q % 3]!;
      this.scatter(K, t, raw, block);
    };
    for (const sp of this.axialSprings) pair(sp, 0);
    for (const sp of this.rotationalSprings) pair(sp, 3);
    return K;
  }

  private assembleMass(t: DofTransform, like: SkylineMatrix): SkylineMatrix {
    const M = SkylineMatrix.like(like);
    for (const m of this.members) {
      if (!(m.props.massPerLength > 0) && !(m.props.rotaryInertiaPerLength > 0)) continue;
      this.scatter(M, t, this.rawDofs(m), toGlobalMatrix(localConsistentMass(m.props, m.length), m.axes));
    }
    for (let d = 0; d < this.massRaw.length; d++) {
      const v = this.massRaw[d]!;
      if (v > 0) this.scatter(M, t, [d], [v]);
    }
    return M;
  }

  /** Node loads plus the members' work-equivalent loads, in raw dofs. */
  private rawLoads(): Float64Array {
    const f = Float64Array.from(this.loadRaw);
    for (const m of this.members) {
      if (m.load.x === 0 && m.load.y === 0 && m.load.z === 0) continue;
      const g = toGlobalVector(localUniformLoad(toLocal3(m.load, m.axes), m.length), m.axes);
      this.rawDofs(m).forEach((d, p) => (f[d] = f[d]! + g[p]!));
    }
    return f;
  }

  private factor():
    { factor: SkylineMatrix; rows: CompressedRows; diagonal: Float64Array; t: DofTransform } | undefined {
    const t = this.transform();
    if (this.solved.factor === undefined) {
      const K = this.assembleStiffness(t, this.profile(t));
      const diagonal = K.diagonal();
      this.solved.factor = K.factor() ? { factor: K, rows: new CompressedRows(K), diagonal } : null;
    }
    return this.solved.factor ? { ...this.solved.factor, t } : undefined;
  }

  /** Takes `other`'s equation numbering and factorisation when the two frames have the same
   * stiffness: the same nodes, members, springs and constraints, compared exactly (loads and
   * masses may differ, as between the load cases of one pose). Identical inputs give an identical
   * factor, so every figure is what this frame's own factorisation would give. Returns whether it
   * took them. */
  shareFactorisationOf(other: SpaceFrame): boolean {
    if (other === this || !sameStiffness(this, other)) return false;
    other.factor();
    this.solved = other.solved;
    return true;
  }

  /** The parts of the stiffness matrix, for sameStiffness. */
  stiffnessInputs(): {
    springs: readonly Spring[];
    rotational: readonly Spring[];
    transform: DofTransform;
  } {
    return {
      springs: this.axialSprings,
      rotational: this.rotationalSprings,
      transform: this.constraints.transform(),
    };
  }

  /** Entries the factored stiffness matrix stores (its skyline), or undefined for a mechanism:
   * what the factorisation's cost grows with. */
  storedEntries(): number | undefined {
    return this.factor()?.factor.data.length;
  }

  /** Raw dof values from equation values. */
  private expand(t: DofTransform, q: Float64Array): Float64Array {
    const u = new Float64Array(this.nodes.length * NODE_DOFS);
    for (let d = 0; d < u.length; d++) {
      let s = 0;
      for (let k = t.start[d]!; k < t.start[d + 1]!; k++) s += t.coef[k]! * q[t.eq[k]!]!;
      u[d] = s;
    }
    return u;
  }

  /** Static solution under the loads; undefined when the frame is a mechanism. */
  solveStatic(): SpaceFrameSolution | undefined {
    const f = this.factor();
    if (!f) return undefined;
    const { rows, t } = f;
    const raw = this.rawLoads();
    const q = new Float64Array(t.count);
    raw.forEach((v, d) => {
      if (v !== 0)
        for (let k = t.start[d]!; k < t.start[d + 1]!; k++) q[t.eq[k]!] = q[t.eq[k]!]! + t.coef[k]! * v;
    });
    if (t.count > 0) rows.solve(q);
    return new SpaceFrameSolution(this, this.expand(t, q));
  }

  /** The `count` lowest natural modes of K phi = omega^2 M phi: omega^2 (ascending) and each
   * mode's raw dof shape. Undefined for a mechanism or a frame without mass. */
  naturalModes(count = 1): { omega2: number[]; shapes: SpaceFrameSolution[] } | undefined {
    const f = this.factor();
    if (!f || f.t.count === 0) return undefined;
    const M = new CompressedRows(this.assembleMass(f.t, f.factor));
    const modes = lowestModes(
      {
        n: f.t.count,
        solve: (b) => f.rows.solve(b),
        multiplyMass: (x, y) => M.multiply(x, y),
        stiffnessDiagonal: f.diagonal,
        massDiagonal: M.diagonal,
        // the free translations along y (down), z (sideways) and x: their first step gives the
        // static shapes under steady acceleration each way, close to the lowest modes
        start: [1, 2, 0].map((axis) => {
          const x = new Float64Array(f.t.count);
          for (let e = 0; e < f.t.count; e++) if (f.t.raw[e]! % NODE_DOFS === axis) x[e] = 1;
          return x;
        }),
      },
      count,
    );
    if (!modes || !(modes.values[0]! > 0)) return undefined;
    return {
      omega2: modes.values,
      shapes: modes.vectors.map((q) => new SpaceFrameSolution(this, this.expand(f.t, q))),
    };
  }

  /** omega^2 of the `count` lowest modes (ascending); undefined for a mechanism or no mass. */
  naturalFrequencies(count = 1): number[] | undefined {
    return this.naturalModes(count)?.omega2;
  }

  // ---- end-force recovery (kept apart from assembly and solution) ----------------------------

  /** What the constraints (supports, pins, welds, rigid offsets) apply to `node` under the raw
   * displacements `u`, global axes, [Fx, Fy, Fz, Mx, My, Mz]: R = K u - f at its six dofs, the
   * members' end forces (k u less their work-equivalent loads) and the springs' forces at the node
   * less the loads put on it. */
  constraintForceAt(node: number, u: Float64Array): Float64Array {
    const r = new Float64Array(NODE_DOFS);
    const o = node * NODE_DOFS;
    for (let k = 0; k < NODE_DOFS; k++) r[k] = -this.loadRaw[o + k]!;
    this.members.forEach((m, index) => {
      if (m.i !== node && m.j !== node) return;
      const at = m.i === node ? 0 : 6;
      if (!m.massOnly) {
        const kg = this.memberStiffness(index);
        for (let p = 0; p < 6; p++) {
          let s = 0;
          for (let q = 0; q < 12; q++) {
            const d = (q < 6 ? m.i : m.j) * NODE_DOFS + (q % 6);
            s += kg[(at + p) * 12 + q]! * u[d]!;
          }
          r[p] = r[p]! + s;
        }
      }
      if (m.load.x !== 0 || m.load.y !== 0 || m.load.z !== 0) {
        const g = toGlobalVector(localUniformLoad(toLocal3(m.load, m.axes), m.length), m.axes);
        for (let p = 0; p < 6; p++) r[p] = r[p]! - g[at + p]!;
      }
    });
    const springAt = (sp: Spring, offset: number) => {
      if (sp.i !== node && sp.j !== node) return;
      const a = [sp.axis.x, sp.axis.y, sp.axis.z];
      let stretch = 0;
      for (let k = 0; k < 3; k++)
        stretch += a[k]! * (u[sp.j * NODE_DOFS + offset + k]! - u[sp.i * NODE_DOFS + offset + k]!);
      // the spring pulls i towards j by rate x stretch: the node pushes back on it by as much
      const sign = sp.i === node ? -1 : 1;
      for (let k = 0; k < 3; k++) r[offset + k] = r[offset + k]! + sign * sp.rate * stretch * a[k]!;
    };
    for (const sp of this.axialSprings) springAt(sp, 0);
    for (const sp of this.rotationalSprings) springAt(sp, 3);
    return r;
  }
}

export class SpaceFrameSolution {
  constructor(
    private readonly frame: SpaceFrame,
    /** Raw dof values, node * 6 + k. */
    readonly raw: Float64Array,
  ) {}

  displacement(node: number): SpaceDisplacement {
    const o = node * NODE_DOFS;
    const u = this.raw;
    return {
      translation: { x: u[o]!, y: u[o + 1]!, z: u[o + 2]! },
      rotation: { x: u[o + 3]!, y: u[o + 4]!, z: u[o + 5]! },
    };
  }

  private memberRaw(index: number): Float64Array {
    const m = this.frame.members[index]!;
    const out = new Float64Array(12);
    for (let k = 0; k < 6; k++) {
      out[k] = this.raw[m.i * NODE_DOFS + k]!;
      out[6 + k] = this.raw[m.j * NODE_DOFS + k]!;
    }
    return out;
  }

  /** End forces of member `index` in its local axes: k u minus the work-equivalent loads. */
  endForces(index: number): SpaceEndForces {
    const m = this.frame.members[index]!;
    const ul = toLocalVector(this.memberRaw(index), m.axes);
    const k = localStiffness(m.props, m.length);
    const fe = localUniformLoad(toLocal3(m.load, m.axes), m.length);
    const f = new Array<number>(12).fill(0);
    for (let p = 0; p < 12; p++) {
      let s = -fe[p]!;
      for (let q = 0; q < 12; q++) s += k[p * 12 + q]! * ul[q]!;
      f[p] = s;
    }
    const end = (o: number) => ({
      fx: f[o]!,
      fy: f[o + 1]!,
      fz: f[o + 2]!,
      mx: f[o + 3]!,
      my: f[o + 4]!,
      mz: f[o + 5]!,
    });
    return { i: end(0), j: end(6) };
  }

  /** What the constraints apply to `node`, global axes [Fx, Fy, Fz, Mx, My, Mz]
   * (SpaceFrame.constraintForceAt). */
  constraintForce(node: number): Float64Array {
    return this.frame.constraintForceAt(node, this.raw);
  }

  /** Strain energy of member `index`, J: 1/2 u^T K u over its twelve end dofs. */
  strainEnergy(index: number): number {
    if (this.frame.members[index]!.massOnly) return 0;
    const k = this.frame.memberStiffness(index);
    const u = this.memberRaw(index);
    let e = 0;
    for (let p = 0; p < 12; p++) for (let q = 0; q < 12; q++) e += u[p]! * k[p * 12 + q]! * u[q]!;
    return e / 2;
  }
}

/** Whether two frames have the same stiffness matrix, entry for entry: every input to it equal. */
function sameStiffness(a: SpaceFrame, b: SpaceFrame): boolean {
  if (a.nodes.length !== b.nodes.length || a.members.length !== b.members.length) return false;
  for (let k = 0; k < a.nodes.length; k++) if (!sameVec(a.nodes[k]!, b.nodes[k]!)) return false;
  for (let k = 0; k < a.members.length; k++) if (!sameMember(a.members[k]!, b.members[k]!)) return false;
  const x = a.stiffnessInputs();
  const y = b.stiffnessInputs();
  return (
    sameSprings(x.springs, y.springs) &&
    sameSprings(x.rotational, y.rotational) &&
    x.transform.count === y.transform.count &&
    sameArray(x.transform.raw, y.transform.raw) &&
    sameArray(x.transform.start, y.transform.start) &&
    sameArray(x.transform.eq, y.transform.eq) &&
    sameArray(x.transform.coef, y.transform.coef)
  );
}

function sameVec(a: Vec3, b: Vec3): boolean {
  return a.x === b.x && a.y === b.y && a.z === b.z;
}

function sameArray(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return false;
  return true;
}

function sameMember(a: SpaceMember, b: SpaceMember): boolean {
  const p = a.props;
  const q = b.props;
  return (
    a.i === b.i &&
    a.j === b.j &&
    a.length === b.length &&
    a.massOnly === b.massOnly &&
    sameArray(a.axes, b.axes) &&
    p.axialRigidity === q.axialRigidity &&
    p.torsionalRigidity === q.torsionalRigidity &&
    p.bendingRigidityY === q.bendingRigidityY &&
    p.bendingRigidityZ === q.bendingRigidityZ
  );
}

function sameSprings(a: readonly Spring[], b: readonly Spring[]): boolean {
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) {
    const s = a[k]!;
    const t = b[k]!;
    if (s.i !== t.i || s.j !== t.j || s.rate !== t.rate || !sameVec(s.axis, t.axis)) return false;
  }
  return true;
}

function sub(a: Vec3, b: Vec3): Vec3 {
  return { x: a.x - b.x, y: a.y - b.y, z: a.z - b.z };
}
function add(a: Vec3, b: Vec3): Vec3 {
  return { x: a.x + b.x, y: a.y + b.y, z: a.z + b.z };
}
function scale(a: Vec3, s: number): Vec3 {
  return { x: a.x * s, y: a.y * s, z: a.z * s };
}
function norm(a: Vec3): number {
  return Math.hypot(a.x, a.y, a.z);
}
function unit(a: Vec3): Vec3 {
  return scale(a, 1 / norm(a));
}

/** Two unit vectors normal to n and to each other. */
function normalsTo(n: Vec3): [Vec3, Vec3] {
  // start from the global axis least aligned with n
  const c = [Math.abs(n.x), Math.abs(n.y), Math.abs(n.z)];
  const k = c[0]! <= c[1]! && c[0]! <= c[2]! ? 0 : c[1]! <= c[2]! ? 1 : 2;
  const t = { x: k === 0 ? 1 : 0, y: k === 1 ? 1 : 0, z: k === 2 ? 1 : 0 };
  const along = t.x * n.x + t.y * n.y + t.z * n.z;
  const e1 = unit(sub(t, scale(n, along)));
  const e2 = {
    x: n.y * e1.z - n.z * e1.y,
    y: n.z * e1.x - n.x * e1.z,
    z: n.x * e1.y - n.y * e1.x,
  };
  return [e1, e2];
}

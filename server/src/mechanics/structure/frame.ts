// Plane-frame model by the direct stiffness method (McGuire, Gallagher and Ziemian, Matrix
// Structural Analysis, 2nd ed., ch. 4-5): 2-node Bernoulli frame elements (axial + bending),
// axial and rotational springs, tied degrees of freedom for pins, lumped masses. SI units.
import { choleskyFactor, choleskySolve, lowestEigenvalue, symmetricEigen } from "./dense";

/** Dofs per node: ux, uy, rotation. */
const NODE_DOFS = 3;

export interface FrameElement {
  i: number;
  j: number;
  /** E A, N */
  axialRigidity: number;
  /** E I, N m^2 */
  flexuralRigidity: number;
}

interface SpringMember {
  i: number;
  j: number;
  rate: number;
}

export interface NodeDisplacement {
  ux: number;
  uy: number;
  rotation: number;
}

/** Element end forces in the element's local axes (x from i to j): axial N (tension +), shear
 * V and moment M at each end, as the nodes exert them on the element. */
export interface ElementEndForces {
  fx1: number;
  fy1: number;
  m1: number;
  fx2: number;
  fy2: number;
  m2: number;
}

/** Masses below this (kg) count as zero and their dofs are condensed out of the eigenproblem:
 * a gram is 1e-3 kg, so 1e-9 kg is far below any real lumped mass. */
const MASSLESS_KG = 1e-9;

export class PlaneFrame {
  readonly x: number[] = [];
  readonly y: number[] = [];
  readonly elements: FrameElement[] = [];
  private readonly axialSprings: SpringMember[] = [];
  private readonly rotationalSprings: SpringMember[] = [];
  /** Union-find over raw dofs (node * 3 + k) for tied translations and locked rotations. */
  private readonly link: number[] = [];
  private readonly fixedRaw: boolean[] = [];
  private readonly massRaw: number[] = [];
  private readonly loadRaw: number[] = [];

  addNode(x: number, y: number): number {
    this.factorCache = undefined;
    const n = this.x.length;
    this.x.push(x);
    this.y.push(y);
    for (let k = 0; k < NODE_DOFS; k++) {
      this.link.push(n * NODE_DOFS + k);
      this.fixedRaw.push(false);
      this.massRaw.push(0);
      this.loadRaw.push(0);
    }
    return n;
  }

  get nodeCount(): number {
    return this.x.length;
  }

  private root(d: number): number {
    while (this.link[d] !== d) {
      this.link[d] = this.link[this.link[d]!]!;
      d = this.link[d]!;
    }
    return d;
  }

  private tie(a: number, b: number): void {
    const ra = this.root(a);
    const rb = this.root(b);
    if (ra !== rb) this.link[rb] = ra;
  }

  /** A pin: both nodes move together but turn independently. */
  tieTranslations(a: number, b: number): void {
    this.factorCache = undefined;
    this.tie(a * NODE_DOFS, b * NODE_DOFS);
    this.tie(a * NODE_DOFS + 1, b * NODE_DOFS + 1);
  }

  /** A locked joint (fixed, or a degree of freedom held by hand or brake): rotations equal too. */
  tieRotations(a: number, b: number): void {
    this.factorCache = undefined;
    this.tie(a * NODE_DOFS + 2, b * NODE_DOFS + 2);
  }

  /** Ground: no movement at all. */
  fix(node: number): void {
    this.factorCache = undefined;
    for (let k = 0; k < NODE_DOFS; k++) this.fixedRaw[node * NODE_DOFS + k] = true;
  }

  addElement(i: number, j: number, axialRigidity: number, flexuralRigidity: number): number {
    this.factorCache = undefined;
    this.elements.push({ i, j, axialRigidity, flexuralRigidity });
    return this.elements.length - 1;
  }

  addAxialSpring(i: number, j: number, rate: number): void {
    this.factorCache = undefined;
    this.axialSprings.push({ i, j, rate });
  }

  addRotationalSpring(i: number, j: number, rate: number): void {
    this.factorCache = undefined;
    this.rotationalSprings.push({ i, j, rate });
  }

  /** Translational mass at a node (rotary inertia is not modelled). */
  addMass(node: number, mass: number): void {
    this.massRaw[node * NODE_DOFS] = this.massRaw[node * NODE_DOFS]! + mass;
    this.massRaw[node * NODE_DOFS + 1] = this.massRaw[node * NODE_DOFS + 1]! + mass;
  }

  addLoad(node: number, fx: number, fy: number, moment = 0): void {
    this.loadRaw[node * NODE_DOFS] = this.loadRaw[node * NODE_DOFS]! + fx;
    this.loadRaw[node * NODE_DOFS + 1] = this.loadRaw[node * NODE_DOFS + 1]! + fy;
    this.loadRaw[node * NODE_DOFS + 2] = this.loadRaw[node * NODE_DOFS + 2]! + moment;
  }

  /** Equation number of every raw dof, -1 where held. */
  private numbering(): { eq: Int32Array; count: number } {
    const total = this.link.length;
    const rootFixed = new Map<number, boolean>();
    for (let d = 0; d < total; d++) if (this.fixedRaw[d]) rootFixed.set(this.root(d), true);
    const rootEq = new Map<number, number>();
    const eq = new Int32Array(total);
    let count = 0;
    for (let d = 0; d < total; d++) {
      const r = this.root(d);
      if (rootFixed.get(r)) {
        eq[d] = -1;
        continue;
      }
      let e = rootEq.get(r);
      if (e === undefined) {
        e = count++;
        rootEq.set(r, e);
      }
      eq[d] = e;
    }
    return { eq, count };
  }

  /** 6 x 6 global stiffness of an element: the local Bernoulli frame matrix (McGuire et al.,
   * eq. 4.34) turned into global axes (eq. 5.9), written out term by term. */
  elementStiffness(e: FrameElement): Float64Array {
    const dx = this.x[e.j]! - this.x[e.i]!;
    const dy = this.y[e.j]! - this.y[e.i]!;
    const L = Math.hypot(dx, dy);
    const c = dx / L;
    const s = dy / L;
    const A = e.axialRigidity / L;
    const B = (12 * e.flexuralRigidity) / L ** 3;
    const C = (6 * e.flexuralRigidity) / L ** 2;
    const D = (4 * e.flexuralRigidity) / L;
    const Dh = (2 * e.flexuralRigidity) / L;
    const k11 = A * c * c + B * s * s;
    const k12 = (A - B) * c * s;
    const k13 = -C * s;
    const k22 = A * s * s + B * c * c;
    const k23 = C * c;
    // prettier-ignore
    return Float64Array.of(
      k11, k12, k13, -k11, -k12, k13,
      k12, k22, k23, -k12, -k22, k23,
      k13, k23, D, -k13, -k23, Dh,
      -k11, -k12, -k13, k11, k12, -k13,
      -k12, -k22, -k23, k12, k22, -k23,
      k13, k23, Dh, -k13, -k23, D,
    );
  }

  private assemble(eq: Int32Array, n: number): Float64Array {
    const K = new Float64Array(n * n);
    const add = (rawA: number, rawB: number, v: number) => {
      const ea = eq[rawA]!;
      const eb = eq[rawB]!;
      if (ea >= 0 && eb >= 0) K[ea * n + eb] = K[ea * n + eb]! + v;
    };
    for (const e of this.elements) {
      const k = this.elementStiffness(e);
      const raw = [e.i * 3, e.i * 3 + 1, e.i * 3 + 2, e.j * 3, e.j * 3 + 1, e.j * 3 + 2];
      for (let p = 0; p < 6; p++) for (let q = 0; q < 6; q++) add(raw[p]!, raw[q]!, k[p * 6 + q]!);
    }
    for (const sp of this.axialSprings) {
      const dx = this.x[sp.j]! - this.x[sp.i]!;
      const dy = this.y[sp.j]! - this.y[sp.i]!;
      const L = Math.hypot(dx, dy);
      if (!(L > 0) || !(sp.rate > 0)) continue;
      const d = [-dx / L, -dy / L, dx / L, dy / L];
      const raw = [sp.i * 3, sp.i * 3 + 1, sp.j * 3, sp.j * 3 + 1];
      for (let p = 0; p < 4; p++) for (let q = 0; q < 4; q++) add(raw[p]!, raw[q]!, sp.rate * d[p]! * d[q]!);
    }
    for (const sp of this.rotationalSprings) {
      const ri = sp.i * 3 + 2;
      const rj = sp.j * 3 + 2;
      add(ri, ri, sp.rate);
      add(rj, rj, sp.rate);
      add(ri, rj, -sp.rate);
      add(rj, ri, -sp.rate);
    }
    return K;
  }

  /** Static solution under the node loads; undefined when the frame is a mechanism. */
  solveStatic(): FrameSolution | undefined {
    const { eq, count: n } = this.numbering();
    const factor = this.stiffnessFactor(eq, n);
    const f = new Float64Array(n);
    for (let d = 0; d < eq.length; d++) if (eq[d]! >= 0) f[eq[d]!] = f[eq[d]!]! + this.loadRaw[d]!;
    if (!factor) return undefined;
    if (n > 0) choleskySolve(factor, n, f);
    return new FrameSolution(this, eq, f);
  }

  /** Cholesky factor of the assembled stiffness, kept so that the static solve and the
   * eigenproblem of one frame factor it once; null for a mechanism. Every change to the
   * stiffness (nodes, elements, springs, ties, supports) drops it. */
  private factorCache?: Float64Array | null;

  private stiffnessFactor(eq: Int32Array, n: number): Float64Array | null {
    if (this.factorCache !== undefined) return this.factorCache;
    const K = this.assemble(eq, n);
    this.factorCache = n === 0 || choleskyFactor(K, n) ? K : null;
    return this.factorCache;
  }

  /** Natural circular frequencies squared (ascending) from K phi = w^2 M phi with the lumped
   * masses; massless dofs are removed by static condensation first. Undefined for a mechanism
   * or a frame without mass. */
  naturalFrequencies(count = 3): number[] | undefined {
    const { eq, count: n } = this.numbering();
    const K = this.assemble(eq, n);
    const mass = new Float64Array(n);
    for (let d = 0; d < eq.length; d++) if (eq[d]! >= 0) mass[eq[d]!] = mass[eq[d]!]! + this.massRaw[d]!;
    if (count === 1) {
      const factor = this.stiffnessFactor(eq, n);
      if (!factor) return undefined;
      const lowest = lowestGeneralizedEigenvalue(factor, mass, n);
      if (lowest !== undefined) return lowest > 0 ? [lowest] : undefined;
    }
    const m: number[] = [];
    const s: number[] = [];
    for (let i = 0; i < n; i++) (mass[i]! > MASSLESS_KG ? m : s).push(i);
    if (m.length === 0) return undefined;
    const nm = m.length;
    const ns = s.length;
    // K* = Kmm - Kms Kss^-1 Ksm
    const kss = new Float64Array(ns * ns);
    for (let a = 0; a < ns; a++) for (let b = 0; b < ns; b++) kss[a * ns + b] = K[s[a]! * n + s[b]!]!;
    if (ns > 0 && !choleskyFactor(kss, ns)) return undefined;
    const condensed = new Float64Array(nm * nm);
    for (let a = 0; a < nm; a++) for (let b = 0; b < nm; b++) condensed[a * nm + b] = K[m[a]! * n + m[b]!]!;
    const col = new Float64Array(ns);
    for (let b = 0; b < nm; b++) {
      for (let a = 0; a < ns; a++) col[a] = K[s[a]! * n + m[b]!]!;
      choleskySolve(kss, ns, col);
      for (let a = 0; a < nm; a++) {
        let sum = 0;
        for (let c = 0; c < ns; c++) sum += K[m[a]! * n + s[c]!]! * col[c]!;
        condensed[a * nm + b] = condensed[a * nm + b]! - sum;
      }
    }
    // Standard symmetric form M^-1/2 K* M^-1/2.
    for (let a = 0; a < nm; a++)
      for (let b = 0; b < nm; b++)
        condensed[a * nm + b] = condensed[a * nm + b]! / Math.sqrt(mass[m[a]!]! * mass[m[b]!]!);
    if (count === 1) {
      const lowest = lowestEigenvalue(condensed, nm);
      return lowest !== undefined && lowest > 0 ? [lowest] : undefined;
    }
    const { values } = symmetricEigen(condensed, nm);
    if (!(values[0]! > 0)) return undefined;
    return Array.from(values.slice(0, count));
  }
}

export class FrameSolution {
  constructor(
    private readonly frame: PlaneFrame,
    private readonly eq: Int32Array,
    private readonly u: Float64Array,
  ) {}

  private value(raw: number): number {
    const e = this.eq[raw]!;
    return e >= 0 ? this.u[e]! : 0;
  }

  displacement(node: number): NodeDisplacement {
    return { ux: this.value(node * 3), uy: this.value(node * 3 + 1), rotation: this.value(node * 3 + 2) };
  }

  /** End forces of element `index` in its local axes. */
  endForces(index: number): ElementEndForces {
    const e = this.frame.elements[index]!;
    const k = this.frame.elementStiffness(e);
    const raw = [e.i * 3, e.i * 3 + 1, e.i * 3 + 2, e.j * 3, e.j * 3 + 1, e.j * 3 + 2];
    const ug = raw.map((r) => this.value(r));
    const fg = new Array<number>(6).fill(0);
    for (let p = 0; p < 6; p++) for (let q = 0; q < 6; q++) fg[p] = fg[p]! + k[p * 6 + q]! * ug[q]!;
    const dx = this.frame.x[e.j]! - this.frame.x[e.i]!;
    const dy = this.frame.y[e.j]! - this.frame.y[e.i]!;
    const L = Math.hypot(dx, dy);
    const c = dx / L;
    const s = dy / L;
    return {
      fx1: c * fg[0]! + s * fg[1]!,
      fy1: -s * fg[0]! + c * fg[1]!,
      m1: fg[2]!,
      fx2: c * fg[3]! + s * fg[4]!,
      fy2: -s * fg[3]! + c * fg[4]!,
      m2: fg[5]!,
    };
  }
}

/** Strain energy of element `index` in a solution, J: 1/2 u^T K u over its six end dofs. */
export function elementStrainEnergy(frame: PlaneFrame, solution: FrameSolution, index: number): number {
  const e = frame.elements[index]!;
  const k = frame.elementStiffness(e);
  const a = solution.displacement(e.i);
  const b = solution.displacement(e.j);
  const u = [a.ux, a.uy, a.rotation, b.ux, b.uy, b.rotation];
  let energy = 0;
  for (let p = 0; p < 6; p++) for (let q = 0; q < 6; q++) energy += u[p]! * k[p * 6 + q]! * u[q]!;
  return energy / 2;
}

/** Inverse iteration stops when the Rayleigh quotient changes by less than this share (its
 * error is the square of the vector's, so eigenvalues come out exact to print). */
const GENERALIZED_ITERATION_TOLERANCE = 1e-12;
/** Well-separated lowest modes settle in tens of steps; past this the caller condenses and uses
 * the dense symmetric solver instead. */
const GENERALIZED_ITERATION_MAX_STEPS = 300;

/** Lowest eigenvalue of K phi = lambda M phi with M diagonal and possibly singular (massless
 * rotations), by inverse iteration z = K^-1 M x with the Rayleigh quotient
 * (z^T M x) / (z^T M z) (Bathe, Finite Element Procedures, 2nd ed., 11.2.1). It needs only one
 * factorisation of K and no static condensation: massless dofs follow statically in every step.
 * `factor` is K's Cholesky factor. Undefined when there is no mass or the iteration does not
 * settle (the caller then uses the condensed dense problem). */
function lowestGeneralizedEigenvalue(
  factor: Float64Array,
  mass: Float64Array,
  n: number,
): number | undefined {
  let totalMass = 0;
  for (let i = 0; i < n; i++) totalMass += mass[i]!;
  if (!(totalMass > 0) || n === 0) return undefined;
  const k = factor;
  const x = new Float64Array(n);
  const z = new Float64Array(n);
  // a start with a share of every mode: uneven weights avoid symmetry with the frame's modes
  for (let i = 0; i < n; i++) x[i] = 1 + 0.37 * Math.sin(1.3 * i + 0.2);
  let previous = Infinity;
  for (let step = 0; step < GENERALIZED_ITERATION_MAX_STEPS; step++) {
    for (let i = 0; i < n; i++) z[i] = mass[i]! * x[i]!;
    choleskySolve(k, n, z); // z = K^-1 M x
    let zmx = 0;
    let zmz = 0;
    for (let i = 0; i < n; i++) {
      zmx += z[i]! * mass[i]! * x[i]!;
      zmz += z[i]! * mass[i]! * z[i]!;
    }
    if (!(zmz > 0)) return undefined;
    const rq = zmx / zmz;
    const scale = 1 / Math.sqrt(zmz);
    for (let i = 0; i < n; i++) x[i] = z[i]! * scale;
    if (Math.abs(rq - previous) <= GENERALIZED_ITERATION_TOLERANCE * Math.abs(rq)) return rq;
    previous = rq;
  }
  return undefined;
}

// The 2-node Bernoulli space frame element (axial, torsion, bending about two principal axes):
// stiffness (McGuire, Gallagher and Ziemian, Matrix Structural Analysis, 2nd ed., eq. 4.34), the
// consistent mass matrix and the work-equivalent loads of a uniform load from the same cubic shape
// functions (Przemieniecki, Theory of Matrix Structural Analysis, 1968, ch. 11 for the mass), and
// the rotation to global axes (McGuire et al., 5.4). Local dofs per node: u, v, w, theta_x,
// theta_y, theta_z; x from node i to j, z the given reference (the section's "across" axis).

export interface Vec3 {
  x: number;
  y: number;
  z: number;
}

export interface MemberProperties {
  /** E A, N */
  axialRigidity: number;
  /** G K (K the torsion constant), N m^2 */
  torsionalRigidity: number;
  /** E I about the local y axis (bending that moves the bar along local z), N m^2 */
  bendingRigidityY: number;
  /** E I about the local z axis (bending that moves the bar along local y), N m^2 */
  bendingRigidityZ: number;
  /** kg/m */
  massPerLength: number;
  /** Rotary inertia per length about the bar's axis, rho (Iy + Iz), kg m */
  rotaryInertiaPerLength: number;
}

/** Local axes of a member as the rows of a 3 x 3 rotation (global to local): x along the member,
 * z the reference made normal to x, y = z cross x. Undefined for a member of no length. */
export function memberAxes(from: Vec3, to: Vec3, reference: Vec3): { axes: Float64Array; length: number } {
  const dx = to.x - from.x;
  const dy = to.y - from.y;
  const dz = to.z - from.z;
  const length = Math.hypot(dx, dy, dz);
  const ex = [dx / length, dy / length, dz / length] as const;
  let r = [reference.x, reference.y, reference.z];
  let along = r[0]! * ex[0] + r[1]! * ex[1] + r[2]! * ex[2];
  let ez = [r[0]! - along * ex[0], r[1]! - along * ex[1], r[2]! - along * ex[2]];
  let nz = Math.hypot(ez[0]!, ez[1]!, ez[2]!);
  if (!(nz > 1e-9)) {
    // reference along the member: any normal will do (a round bar), take the least-aligned axis
    const k = [0, 1, 2].sort((a, b) => Math.abs(ex[a]!) - Math.abs(ex[b]!))[0]!;
    r = [0, 0, 0];
    r[k] = 1;
    along = ex[k]!;
    ez = [r[0]! - along * ex[0], r[1]! - along * ex[1], r[2]! - along * ex[2]];
    nz = Math.hypot(ez[0]!, ez[1]!, ez[2]!);
  }
  ez = ez.map((v) => v / nz);
  const ey = [
    ez[1]! * ex[2] - ez[2]! * ex[1],
    ez[2]! * ex[0] - ez[0]! * ex[2],
    ez[0]! * ex[1] - ez[1]! * ex[0],
  ];
  return { axes: Float64Array.of(...ex, ...ey, ...ez), length };
}

/** Adds a symmetric entry to a 12 x 12 matrix. */
function put(k: Float64Array, a: number, b: number, v: number): void {
  k[a * 12 + b] = k[a * 12 + b]! + v;
  if (a !== b) k[b * 12 + a] = k[b * 12 + a]! + v;
}

/** A beam's 4 x 4 bending block on (t1, r1, t2, r2) with rotation r = dt/dx, times `scale`;
 * `sign` -1 where the local rotation is -dt/dx (bending in x-z: theta_y = -dw/dx). */
function bendingBlock(
  k: Float64Array,
  dofs: readonly number[],
  block: readonly number[],
  sign: number,
): void {
  for (let p = 0; p < 4; p++)
    for (let q = p; q < 4; q++) {
      const flip = p % 2 !== q % 2 ? sign : 1;
      put(k, dofs[p]!, dofs[q]!, flip * block[p * 4 + q]!);
    }
}

const IN_PLANE_BENDING = [1, 5, 7, 11] as const; // v1, theta_z1, v2, theta_z2
const ACROSS_BENDING = [2, 4, 8, 10] as const; // w1, theta_y1, w2, theta_y2

/** Local stiffness (McGuire et al., 2nd ed., eq. 4.34). */
export function localStiffness(p: MemberProperties, L: number): Float64Array {
  const k = new Float64Array(144);
  const a = p.axialRigidity / L;
  put(k, 0, 0, a);
  put(k, 6, 6, a);
  put(k, 0, 6, -a);
  const t = p.torsionalRigidity / L;
  put(k, 3, 3, t);
  put(k, 9, 9, t);
  put(k, 3, 9, -t);
  const beam = (EI: number) => {
    const c1 = (12 * EI) / L ** 3;
    const c2 = (6 * EI) / L ** 2;
    const c3 = (4 * EI) / L;
    const c4 = (2 * EI) / L;
    // prettier-ignore
    return [
      c1, c2, -c1, c2,
      c2, c3, -c2, c4,
      -c1, -c2, c1, -c2,
      c2, c4, -c2, c3,
    ];
  };
  bendingBlock(k, IN_PLANE_BENDING, beam(p.bendingRigidityZ), 1);
  bendingBlock(k, ACROSS_BENDING, beam(p.bendingRigidityY), -1);
  return k;
}

/** Consistent mass (Przemieniecki 1968, ch. 11; the same cubic shape functions as the stiffness):
 * axial and torsion m L / 6 [2 1; 1 2], bending m L / 420 [156 22L 54 -13L; ...]. Rotary
 * inertia of the section in bending is left out, as in Bernoulli beam theory. */
export function localConsistentMass(p: MemberProperties, L: number): Float64Array {
  const k = new Float64Array(144);
  const m = p.massPerLength * L;
  put(k, 0, 0, m / 3);
  put(k, 6, 6, m / 3);
  put(k, 0, 6, m / 6);
  const j = p.rotaryInertiaPerLength * L;
  put(k, 3, 3, j / 3);
  put(k, 9, 9, j / 3);
  put(k, 3, 9, j / 6);
  const s = m / 420;
  // prettier-ignore
  const block = [
    156 * s, 22 * L * s, 54 * s, -13 * L * s,
    22 * L * s, 4 * L * L * s, 13 * L * s, -3 * L * L * s,
    54 * s, 13 * L * s, 156 * s, -22 * L * s,
    -13 * L * s, -3 * L * L * s, -22 * L * s, 4 * L * L * s,
  ];
  bendingBlock(k, IN_PLANE_BENDING, block, 1);
  bendingBlock(k, ACROSS_BENDING, block, -1);
  return k;
}

/** Work-equivalent nodal loads of a uniform load (qx, qy, qz per length, local axes): half the
 * force to each end and end moments q L^2 / 12 (McGuire et al., 2nd ed., fixed-end forces). */
export function localUniformLoad(q: Vec3, L: number): Float64Array {
  const f = new Float64Array(12);
  f[0] = f[6] = (q.x * L) / 2;
  f[1] = f[7] = (q.y * L) / 2;
  f[5] = (q.y * L * L) / 12;
  f[11] = (-q.y * L * L) / 12;
  f[2] = f[8] = (q.z * L) / 2;
  f[4] = (-q.z * L * L) / 12;
  f[10] = (q.z * L * L) / 12;
  return f;
}

/** Scratch of toGlobalMatrix (one block at a time; nothing keeps it). */
const blockScratch = new Float64Array(9);

/** T^T k T for T = diag(R, R, R, R), R the rows of `axes` (McGuire et al., 2nd ed., eq. 5.9).
 * Most of a member's local entries are zero (two thirds of them): their products are left out of
 * the sums, which with finite axes leaves every sum as it was to the last bit (a sum that starts
 * at +0 never becomes -0, and adding a zero product to it changes nothing). */
export function toGlobalMatrix(local: Float64Array, axes: Float64Array): Float64Array {
  const out = new Float64Array(144);
  const tmp = blockScratch;
  for (let bi = 0; bi < 4; bi++)
    for (let bj = 0; bj < 4; bj++) {
      // tmp = k_block R
      let any = false;
      for (let r = 0; r < 3; r++) {
        const row = (bi * 3 + r) * 12 + bj * 3;
        const k0 = local[row]!;
        const k1 = local[row + 1]!;
        const k2 = local[row + 2]!;
        for (let c = 0; c < 3; c++) {
          let s = 0;
          if (k0 !== 0) s += k0 * axes[c]!;
          if (k1 !== 0) s += k1 * axes[3 + c]!;
          if (k2 !== 0) s += k2 * axes[6 + c]!;
          tmp[r * 3 + c] = s;
          if (s !== 0) any = true;
        }
      }
      // a zero block stays zero (out is zero-filled)
      if (!any) continue;
      // out_block = R^T tmp
      for (let r = 0; r < 3; r++)
        for (let c = 0; c < 3; c++) {
          let s = 0;
          for (let m = 0; m < 3; m++) {
            const t = tmp[m * 3 + c]!;
            if (t !== 0) s += axes[m * 3 + r]! * t;
          }
          out[(bi * 3 + r) * 12 + bj * 3 + c] = s;
        }
    }
  return out;
}

/** T^T f: a local 12-vector in global axes. */
export function toGlobalVector(local: Float64Array, axes: Float64Array): Float64Array {
  const out = new Float64Array(12);
  for (let b = 0; b < 4; b++)
    for (let r = 0; r < 3; r++) {
      let s = 0;
      for (let m = 0; m < 3; m++) s += axes[m * 3 + r]! * local[b * 3 + m]!;
      out[b * 3 + r] = s;
    }
  return out;
}

/** T u: a global 12-vector in local axes. */
export function toLocalVector(global: ArrayLike<number>, axes: Float64Array): Float64Array {
  const out = new Float64Array(12);
  for (let b = 0; b < 4; b++)
    for (let r = 0; r < 3; r++) {
      let s = 0;
      for (let m = 0; m < 3; m++) s += axes[r * 3 + m]! * global[b * 3 + m]!;
      out[b * 3 + r] = s;
    }
  return out;
}

/** A global vector in a member's local axes. */
export function toLocal3(v: Vec3, axes: Float64Array): Vec3 {
  return {
    x: axes[0]! * v.x + axes[1]! * v.y + axes[2]! * v.z,
    y: axes[3]! * v.x + axes[4]! * v.y + axes[5]! * v.z,
    z: axes[6]! * v.x + axes[7]! * v.y + axes[8]! * v.z,
  };
}

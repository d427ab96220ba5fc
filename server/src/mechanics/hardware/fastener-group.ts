// Forces on each fastener of a group: shear from a force and a moment in the plane of the joint
// (direct shear shared equally plus the moment over the group), and tension from a moment that
// tips a plate about one edge. Shigley's Mechanical Engineering Design (Budynas and Nisbett,
// 9th-11th ed.), ch. 8: "Shear joints" (the centroid of the group and the primary and secondary
// shear) and the bolted bracket that tips about its heel. SI.
import type { Vec2 } from "../../model/types";

/** Positions of n fasteners in a row along x, `spacing` apart, centred on the origin. */
export function rowOfFasteners(count: number, spacing: number): Vec2[] {
  return Array.from({ length: count }, (_, i) => ({ x: (i - (count - 1) / 2) * spacing, y: 0 }));
}

/** Centroid of a group of equal fasteners (Shigley ch. 8, shear joints, with equal areas). */
export function groupCentroid(positions: readonly Vec2[]): Vec2 {
  let x = 0;
  let y = 0;
  for (const p of positions) {
    x += p.x;
    y += p.y;
  }
  return { x: x / positions.length, y: y / positions.length };
}

export interface GroupShear {
  /** Resultant shear on each fastener, N, in the group's plane. */
  forces: Vec2[];
  /** The largest resultant, N, and which fastener carries it. */
  largest: number;
  index: number;
}

/** Shear on each fastener of a group loaded in its plane by a force V (through the centroid) and a
 * moment M about the centroid (counter-clockwise positive): the primary shear V / n on each, and
 * the secondary shear M r_i / sum r_j^2 at right angles to the radius r_i from the centroid
 * (Shigley ch. 8, shear joints: F'' = M r_A / (r_A^2 + r_B^2 + ...)). A single fastener, or a group
 * whose fasteners all sit at the centroid, cannot carry a moment: largest is Infinity then. */
export function groupShear(positions: readonly Vec2[], shear: Vec2, moment: number): GroupShear {
  const n = positions.length;
  const c = groupCentroid(positions);
  let sumR2 = 0;
  for (const p of positions) sumR2 += (p.x - c.x) ** 2 + (p.y - c.y) ** 2;
  const forces: Vec2[] = [];
  let largest = 0;
  let index = 0;
  for (let i = 0; i < n; i++) {
    const rx = positions[i]!.x - c.x;
    const ry = positions[i]!.y - c.y;
    let fx = shear.x / n;
    let fy = shear.y / n;
    if (moment !== 0) {
      if (sumR2 === 0) return { forces: [], largest: Infinity, index: 0 };
      // M r / sum r^2, perpendicular to r: (-ry, rx) turns the radius a quarter counter-clockwise
      fx += (-moment * ry) / sumR2;
      fy += (moment * rx) / sumR2;
    }
    forces.push({ x: fx, y: fy });
    const f = Math.hypot(fx, fy);
    if (f > largest) {
      largest = f;
      index = i;
    }
  }
  return { forces, largest, index };
}

/** Tension in each fastener of a plate pulled off its seat by a direct force P (shared equally)
 * and tipped about a stated pivot edge by a moment M: the plate turns about the edge, each
 * fastener stretches in proportion to its distance c_i from it and carries M c_i / sum c_j^2
 * (Shigley ch. 8, the bracket bolted to a wall that tips about its lower edge). Distances are
 * measured from the pivot edge, all on one side of it (the edge is where the plate bears). */
export function tensionFromMoment(distancesFromPivot: readonly number[], moment: number, pull = 0): number[] {
  const n = distancesFromPivot.length;
  let sumC2 = 0;
  for (const c of distancesFromPivot) sumC2 += c * c;
  return distancesFromPivot.map(
    (c) => pull / n + (moment === 0 ? 0 : sumC2 > 0 ? (Math.abs(moment) * c) / sumC2 : Infinity),
  );
}

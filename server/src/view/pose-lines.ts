// Finds, in a sweep's pose list, the runs along which one degree of freedom moves and the others
// stay put (for plots and the envelope), and the pose nearest a set of slider values.
import type { Pose } from "../mechanics/types";

/** Angles closer than this are the same grid value: the sweep writes each grid value once, so
 * anything far below a step (a step of 2001 over a full turn is 3e-3 rad) is round-off. */
const SAME_ANGLE_RAD = 1e-7;

function keyOfOthers(pose: Pose, dofIds: readonly string[], moving: number): string {
  let key = "";
  for (let i = 0; i < dofIds.length; i++) {
    if (i === moving) continue;
    key += Math.round((pose.angles[dofIds[i]!] ?? 0) / SAME_ANGLE_RAD) + "|";
  }
  return key;
}

/** For each dof, the runs of pose indices with every other dof equal, sorted by that dof's angle
 * (duplicates of the same angle dropped). */
export function linesPerDof(poses: readonly Pose[], dofIds: readonly string[]): number[][][] {
  return dofIds.map((id, d) => {
    const groups = new Map<string, number[]>();
    for (let p = 0; p < poses.length; p++) {
      const key = keyOfOthers(poses[p]!, dofIds, d);
      let g = groups.get(key);
      if (!g) groups.set(key, (g = []));
      g.push(p);
    }
    const runs: number[][] = [];
    for (const g of groups.values()) {
      g.sort((a, b) => (poses[a]!.angles[id] ?? 0) - (poses[b]!.angles[id] ?? 0));
      const run: number[] = [];
      for (const p of g) {
        const last = run[run.length - 1];
        if (
          last !== undefined &&
          Math.abs((poses[last]!.angles[id] ?? 0) - (poses[p]!.angles[id] ?? 0)) < SAME_ANGLE_RAD
        )
          continue;
        run.push(p);
      }
      runs.push(run);
    }
    return runs;
  });
}

/** The pose whose dof values are nearest the targets, each dof weighted by its range so that
 * degrees of freedom with short ranges count as much as long ones. */
export function nearestPose(
  anglesPerPose: readonly (readonly number[])[],
  target: readonly number[],
  spans: readonly number[],
): number {
  let best = 0;
  let bestDistance = Infinity;
  for (let p = 0; p < anglesPerPose.length; p++) {
    const a = anglesPerPose[p]!;
    let distance = 0;
    for (let d = 0; d < target.length; d++) {
      const span = spans[d]! > 0 ? spans[d]! : 1;
      const e = ((a[d] ?? 0) - target[d]!) / span;
      distance += e * e;
    }
    if (distance < bestDistance) {
      bestDistance = distance;
      best = p;
    }
  }
  return best;
}

/** The run (of `lines[d]`) that holds pose `p`, or the first run. */
export function runThrough(lines: readonly (readonly number[])[], p: number): readonly number[] {
  return lines.find((run) => run.includes(p)) ?? lines[0] ?? [];
}

/** The poses to draw when the sweep has more than `max`: every k-th visited value of each dof
 * (both ends kept), with k as small as brings the count under `max`; when even the ends of every
 * dof are too many (a grid of many degrees of freedom at two values each), the last degrees of
 * freedom are held at the value nearest their `reference` angle, one after another, until the
 * rest fit. Returns the poses unchanged when there are few enough. */
export function thinPoses(
  poses: readonly Pose[],
  dofIds: readonly string[],
  max: number,
  reference: readonly number[] = [],
): Pose[] {
  if (poses.length <= max || dofIds.length === 0) return [...poses];
  const dofs = dofIds.length;
  // Each pose's value of each dof as its position among that dof's sorted distinct values.
  const keyOf = (p: Pose, id: string) => Math.round((p.angles[id] ?? 0) / SAME_ANGLE_RAD);
  const values = dofIds.map((id) => [...new Set(poses.map((p) => keyOf(p, id)))].sort((a, b) => a - b));
  const position = new Int32Array(poses.length * dofs);
  dofIds.forEach((id, d) => {
    const at = new Map(values[d]!.map((v, i) => [v, i]));
    poses.forEach((p, i) => (position[i * dofs + d] = at.get(keyOf(p, id))!));
  });
  const nearestReference = values.map((v, d) => {
    const target = (reference[d] ?? 0) / SAME_ANGLE_RAD;
    let best = 0;
    for (let i = 1; i < v.length; i++) if (Math.abs(v[i]! - target) < Math.abs(v[best]! - target)) best = i;
    return best;
  });
  /** Whether pose i stays with every k-th value and the last `held` dofs at their reference. */
  const keeps = (i: number, k: number, held: number): boolean => {
    for (let d = 0; d < dofs; d++) {
      const at = position[i * dofs + d]!;
      if (d >= dofs - held) {
        if (at !== nearestReference[d]) return false;
      } else if (at % k !== 0 && at !== values[d]!.length - 1) return false;
    }
    return true;
  };
  const count = (k: number, held: number) => {
    let n = 0;
    for (let i = 0; i < poses.length; i++) if (keeps(i, k, held)) n++;
    return n;
  };
  const longest = Math.max(2, ...values.map((v) => v.length));
  for (let held = 0; held < dofs; held++) {
    // Fewer poses as k grows (near enough: every k-th value of a run of n is about n / k of them),
    // so the smallest k that fits is found by bisection; k = longest keeps the ends alone.
    if (count(longest, held) > max) continue;
    let lo = 2;
    let hi = longest;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (count(mid, held) <= max) hi = mid;
      else lo = mid + 1;
    }
    return poses.filter((_, i) => keeps(i, lo, held));
  }
  return poses.filter((_, i) => keeps(i, longest, dofs));
}

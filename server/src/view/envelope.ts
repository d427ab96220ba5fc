// The reach envelope: each payload's path along the outer edges of the swept range, and the
// world extent of every pose for the drawing's frame.
import type { ViewModel } from "./view-model";
import { place, posePoints } from "./geometry";

/** Share of the extent added round the drawing so pivots and labels are not cut at the edge. */
const FRAME_MARGIN = 0.08;
/** Paths traced per payload at most: a grid of many degrees of freedom at two values each has
 * every run on its edge (11 dofs: 11,264 of them), and every drawing of the report and the panel
 * repeats them. 200 dashed lines already fill a drawing; the ones kept are those that reach
 * farthest in some direction, then every k-th of the rest. Common practice, no source. */
export const MAX_ENVELOPE_PATHS = 200;
/** Directions in which the path reaching farthest is always kept. */
const EXTREME_DIRECTIONS = 32;
/** The margin is taken of at least this extent, m (a tiny arm is not drawn edge to edge). */
const MIN_FRAME_EXTENT = 0.05;
/** The frame when nothing is drawn, m: [minX, minY, maxX, maxY]. */
export const EMPTY_BOUNDS: readonly [number, number, number, number] = [-0.1, -0.02, 0.4, 0.4];

/** A run lies on the edge of the range when every other dof sits at one end of its values. */
function onEdge(vm: ViewModel, d: number, run: readonly number[]): boolean {
  const pose = vm.poses[run[0]!]!;
  return vm.dofs.every((dof, i) => {
    if (i === d) return true;
    const v = pose.angles[i]!;
    return v === dof.values[0] || v === dof.values[dof.values.length - 1];
  });
}

export function payloadPaths(vm: ViewModel): ViewModel["envelope"] {
  const runs: number[][] = [];
  vm.lines.forEach((perDof, d) => {
    for (const run of perDof) if (run.length >= 2 && onEdge(vm, d, run)) runs.push(run);
  });
  // Each dof swept alone (grid off): its runs are not on an edge; trace them all.
  if (runs.length === 0)
    for (const perDof of vm.lines) for (const run of perDof) if (run.length >= 2) runs.push(run);
  const paths: ViewModel["envelope"] = {};
  for (const payload of vm.payloads) {
    paths[payload.id] = outermost(
      runs.map((run) =>
        run
          .map((p) => place(vm.poses[p]!, payload.body, payload.local))
          .filter((w): w is [number, number] => w !== undefined),
      ),
      MAX_ENVELOPE_PATHS,
    );
  }
  return paths;
}

/** At most `max` of the paths, in their order: the one reaching farthest in each of
 * EXTREME_DIRECTIONS directions, then evenly spaced others. */
function outermost(paths: [number, number][][], max: number): [number, number][][] {
  if (paths.length <= max) return paths;
  const keep = new Set<number>();
  for (let k = 0; k < EXTREME_DIRECTIONS && keep.size < max; k++) {
    const cx = Math.cos((2 * Math.PI * k) / EXTREME_DIRECTIONS);
    const cy = Math.sin((2 * Math.PI * k) / EXTREME_DIRECTIONS);
    let best = -1;
    let reach = -Infinity;
    paths.forEach((path, i) => {
      for (const [x, y] of path)
        if (x * cx + y * cy > reach) {
          reach = x * cx + y * cy;
          best = i;
        }
    });
    if (best >= 0) keep.add(best);
  }
  const step = paths.length / Math.max(1, max - keep.size);
  for (let t = 0; keep.size < max && t < paths.length; t += step) keep.add(Math.floor(t));
  return paths.filter((_, i) => keep.has(i));
}

export function viewBounds(vm: ViewModel): [number, number, number, number] {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  const take = (x: number, y: number) => {
    if (!Number.isFinite(x) || !Number.isFinite(y)) return;
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  };
  for (const pose of vm.poses) for (const [x, y] of posePoints(vm, pose)) take(x, y);
  take(0, vm.surface);
  if (vm.footprint !== undefined) {
    take(-vm.footprint / 2, vm.surface);
    take(vm.footprint / 2, vm.surface);
  }
  if (!Number.isFinite(minX)) return [...EMPTY_BOUNDS];
  const margin = FRAME_MARGIN * Math.max(maxX - minX, maxY - minY, MIN_FRAME_EXTENT);
  return [minX - margin, minY - margin, maxX + margin, maxY + margin];
}

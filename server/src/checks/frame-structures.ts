// The arm's frame structures (mechanics/structure/arm-frame.ts) at the representative poses,
// shared by the checks of one run: the turned pass (turned-loads.ts) and the stiffness check both
// build the frame at those poses and headings, and a structure carries its factorisation once a
// frame of it is solved, so the second check's frames cost neither a build nor a factorisation.
// Only the representative poses are kept (the stiffness check visits no others), which bounds
// what one run holds to a few structures per heading set.
import type { Pose } from "../mechanics/types";
import type { Headings } from "../mechanics/headings";
import { armStructure, type ArmStructure } from "../mechanics/structure/arm-frame";
import type { CheckContext } from "./index";
import { representativePoses } from "./stiffness";

interface Kept {
  representative: Set<Pose>;
  byPose: Map<Pose, Map<string, ArmStructure>>;
}

const kept = new WeakMap<CheckContext, Kept>();

/** A heading set's key: its swivels' headings in id order (0 is the drawing plane, as absent). */
function headingsKey(headings: Headings): string {
  return Object.keys(headings)
    .filter((id) => headings[id] !== 0)
    .sort()
    .map((id) => `${id}=${headings[id]}`)
    .join(",");
}

/** The frame structure of the arm at `pose` and `headings`: this run's own when a check built it
 * at a representative pose already, else a new one (kept when the pose is representative). */
export function structureAt(ctx: CheckContext, pose: Pose, headings: Headings): ArmStructure {
  let k = kept.get(ctx);
  if (!k) kept.set(ctx, (k = { representative: new Set(representativePoses(ctx.sweep)), byPose: new Map() }));
  if (!k.representative.has(pose)) return armStructure(ctx.model, pose, { headings });
  let byHeadings = k.byPose.get(pose);
  if (!byHeadings) k.byPose.set(pose, (byHeadings = new Map()));
  const key = headingsKey(headings);
  let structure = byHeadings.get(key);
  if (!structure) byHeadings.set(key, (structure = armStructure(ctx.model, pose, { headings })));
  return structure;
}

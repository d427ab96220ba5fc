// Swivels (mechanics.md section 10): whether each one's axis stays vertical over the range
// (`geometry.swivel-leans`), and each one's heading range in its readout. The loads and stiffness
// over headings are in the strength, tipping and stiffness checks.
import type { Swivel } from "../model/types";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures } from "./readout";
import { describePose, show } from "./part-words";

/** An axis within this of vertical counts as vertical: a degree moves a stage's weight by under
 * 2 % of its lever sideways (sin 1 deg = 0.017), far inside the other figures' accuracy (common
 * practice, no source). */
export const SWIVEL_LEAN_TOLERANCE_RAD = Math.PI / 180;

/** The angle of the swivel's axis from vertical at a pose: its parent's turn in the plane. */
function leanAt(phi: number): number {
  const a = Math.abs(Math.atan2(Math.sin(phi), Math.cos(phi)));
  return a;
}

function checkOne(ctx: CheckContext, s: Swivel): void {
  const { sweep } = ctx;
  const heading = s.heading;
  addFigures(ctx.readouts, s.id, s.joint ? "swivel" : "base", [
    heading
      ? { label: "heading range", value: heading[0], high: heading[1], dimension: "angle" }
      : { label: "heading range", value: -Math.PI, high: Math.PI, dimension: "angle" },
  ]);
  if (!s.joint) return; // the base's yaw: vertical by definition (the base is the ground)
  let worst: { lean: number; pose: (typeof sweep.poses)[number] } | undefined;
  for (const pose of sweep.poses) {
    const b = pose.bodies[s.parent];
    if (!b) continue;
    const lean = leanAt(b.phi);
    if (!worst || lean > worst.lean) worst = { lean, pose };
  }
  if (!worst || worst.lean <= SWIVEL_LEAN_TOLERANCE_RAD) return;
  ctx.findings.push(
    finding(
      "geometry.swivel-leans",
      s.origin.properties["connects"] ?? s.origin.name ?? s.origin.declaration,
      `swivel ${s.id}'s axis leans up to ${show(worst.lean, "angle")} from vertical (${describePose(sweep, worst.pose)}): it runs along ${s.parent}'s y axis, so turning it would raise or lower what it carries; the checks take the axis as vertical. Put the swivel on a part that stays level (a parallelogram's head, the base)`,
      { data: { subject: s.id, lean: worst.lean } },
    ),
  );
}

export function checkSwivels(ctx: CheckContext): void {
  for (const s of ctx.model.swivels ?? []) checkOne(ctx, s);
}

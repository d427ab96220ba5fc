// Places local body points (m) into the world frame of a view pose (through the plane's one
// body-to-world transform) for the drawing, the envelope and the bounds.
import type { ViewModel, ViewPose } from "./view-model";
import { toWorld } from "../mechanics/plane";

/** World m of a local point (m) on a body in a pose; undefined when the pose lacks the body. */
export function place(
  pose: ViewPose,
  bodyId: string,
  local: readonly [number, number],
): [number, number] | undefined {
  const b = pose.bodies[bodyId];
  if (!b) return undefined;
  const w = toWorld({ x: b[0], y: b[1], phi: b[2] }, { x: local[0], y: local[1] });
  return [w.x, w.y];
}

/** Every world point the drawing of one pose touches, for the bounds. */
export function posePoints(vm: ViewModel, pose: ViewPose): [number, number][] {
  const pts: [number, number][] = [];
  for (const body of vm.bodies) {
    for (const p of body.line) {
      const w = place(pose, body.id, p);
      if (w) pts.push(w);
    }
    for (const br of body.brackets) {
      const w = place(pose, body.id, [br[2], br[3]]);
      if (w) pts.push(w);
    }
  }
  for (const s of Object.values(pose.springs)) pts.push([s[0], s[1]], [s[2], s[3]]);
  for (const p of vm.payloads) {
    const w = place(pose, p.body, p.local);
    if (w) pts.push(w);
  }
  return pts;
}

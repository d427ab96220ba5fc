// What the worker sends the server of an analysis. The sweep's poses are nearly all of a large
// spec's result (96 % of the 60-body chain's 4.3 MB), and the server reads of them only the hand
// forces (the status bar's worst hand force) and their count: the drawing panel's view model is
// built in the worker, hover and inlay hints read the readouts. So each pose keeps its index,
// angles and hand forces, and its other records are left empty; the rest of the analysis goes
// whole. Passing the 60-body chain's result then takes a few milliseconds instead of tens.
import type { Analysis, Pose, SweepResult } from "../../analysis";

function serverPose(pose: Pose): Pose {
  return {
    index: pose.index,
    angles: pose.angles,
    jointAngles: {},
    bodies: {},
    springs: {},
    cases: pose.cases.map((c) => ({
      handForce: c.handForce,
      holdingTorque: {},
      reactions: {},
      lockedTorque: {},
      springForce: {},
    })),
  };
}

export function serverCopy(analysis: Analysis): Analysis {
  if (!analysis.sweep) return analysis;
  const sweep: SweepResult = { ...analysis.sweep, poses: analysis.sweep.poses.map(serverPose) };
  if (analysis.sweep.reference) sweep.reference = serverPose(analysis.sweep.reference);
  return { ...analysis, sweep };
}

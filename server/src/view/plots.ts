// The preview's and the report's plots: for each degree of freedom, the torque a hand must supply
// (gravity, spring, load and net parts) and the hand force at each payload with the allowed band.
import type { ViewModel } from "./view-model";
import type { PlotSpec } from "./draw-plot";
import { runThrough } from "./pose-lines";
import { PALETTE, SERIES_CYCLE } from "./palette";
import { formatFigureWithUnit, inDisplayUnit, unitLabel } from "../units/format";

function along(vm: ViewModel, d: number, poseIndex: number): readonly number[] {
  return runThrough(vm.lines[d] ?? [], poseIndex);
}

/** An angle of the view model as the plots' x axis shows it. */
function angleShown(vm: ViewModel, rad: number): number {
  return inDisplayUnit(rad, "angle", vm.units);
}

/** Where the marker of the current pose sits on dof d's axis. */
function markerAt(vm: ViewModel, d: number, poseIndex: number): number | undefined {
  const a = vm.poses[poseIndex]?.angles[d];
  return a === undefined ? undefined : angleShown(vm, a);
}

/** Holding torque against dof d, over the run through the current pose. */
export function torquePlot(vm: ViewModel, d: number, poseIndex: number): PlotSpec {
  const run = along(vm, d, poseIndex);
  const x = (p: number) => angleShown(vm, vm.poses[p]!.angles[d]!);
  const pick = (key: "gravityTorque" | "springTorque" | "loadTorque" | "netTorque") =>
    run.map((p) => [x(p), inDisplayUnit(vm.poses[p]![key][d]!, "torque", vm.units)] as [number, number]);
  const series: PlotSpec["series"] = [
    { name: "gravity", colour: PALETTE.gravity, dashed: true, points: pick("gravityTorque") },
    { name: "springs", colour: PALETTE.spring, dashed: true, points: pick("springTorque") },
    { name: "net", colour: PALETTE.net, points: pick("netTorque") },
  ];
  const load = pick("loadTorque");
  if (load.some(([, y]) => Number.isFinite(y) && y !== 0))
    series.splice(2, 0, { name: "steady load", colour: PALETTE.load, dashed: true, points: load });
  return {
    id: `torque-${vm.dofs[d]!.id}`,
    title: `Holding torque at ${vm.dofs[d]!.id}`,
    xLabel: `${vm.dofs[d]!.id} angle, ${unitLabel("angle", vm.units)}`,
    yLabel: `torque to hold, ${unitLabel("torque", vm.units)} (CCW +)`,
    series,
    markerX: markerAt(vm, d, poseIndex),
  };
}

/** Hand force at every payload against dof d, signed (positive where the arm sinks), with the
 * `require balance` band either side of zero and, when pivots have friction, the force without
 * it dashed: the gap between the two is what friction holds. With a tune run over the drawing,
 * the other design's hand force too (nominal case), in the overlay's colour. */
export function handForcePlot(vm: ViewModel, d: number, poseIndex: number): PlotSpec {
  const run = along(vm, d, poseIndex);
  const series: PlotSpec["series"] = [];
  const x = (p: number) => angleShown(vm, vm.poses[p]!.angles[d]!);
  let k = 0;
  for (const payload of vm.payloads) {
    const colour = SERIES_CYCLE[k % SERIES_CYCLE.length]!;
    // With a tune run over the drawing, the text's own design is "now".
    const own = vm.tune ? `${payload.id} now` : payload.id;
    vm.loadCases.forEach((lc, c) => {
      const name = vm.loadCases.length > 1 ? `${own} (${lc.label})` : own;
      series.push({
        name,
        colour: c === 0 ? colour : SERIES_CYCLE[(k + c) % SERIES_CYCLE.length]!,
        ...(c > 0 ? { dashed: true } : {}),
        points: run.map(
          (p) =>
            [x(p), inDisplayUnit(vm.poses[p]!.handForce[payload.id]?.[c] ?? NaN, "force", vm.units)] as [
              number,
              number,
            ],
        ),
      });
    });
    if (vm.poses[run[0] ?? 0]?.handForceFree?.[payload.id] !== undefined)
      series.push({
        name: `${payload.id} without friction`,
        colour,
        dashed: true,
        points: run.map(
          (p) =>
            [x(p), inDisplayUnit(vm.poses[p]!.handForceFree?.[payload.id] ?? NaN, "force", vm.units)] as [
              number,
              number,
            ],
        ),
      });
    const other = vm.tune?.otherHandForce;
    if (other && run.some((p) => other[p]?.[payload.id] !== undefined))
      series.push({
        name: `${payload.id} ${vm.tune!.otherLabel}`,
        colour: PALETTE.tuned,
        points: run.map(
          (p) => [x(p), inDisplayUnit(other[p]?.[payload.id] ?? NaN, "force", vm.units)] as [number, number],
        ),
      });
    k += Math.max(vm.loadCases.length, 1);
  }
  const limits = Object.values(vm.balanceLimit);
  const limit = limits.length ? Math.min(...limits) : undefined;
  return {
    id: `hand-${vm.dofs[d]!.id}`,
    title: `Hand force against ${vm.dofs[d]!.id}`,
    xLabel: `${vm.dofs[d]!.id} angle, ${unitLabel("angle", vm.units)}`,
    yLabel: `hand force, ${unitLabel("force", vm.units)} (+ sinks, − rises)`,
    series,
    ...(limit !== undefined
      ? {
          band: {
            from: -inDisplayUnit(limit, "force", vm.units),
            to: inDisplayUnit(limit, "force", vm.units),
            label: `require balance ${formatFigureWithUnit(limit, "force", vm.units)}`,
          },
        }
      : {}),
    markerX: markerAt(vm, d, poseIndex),
  };
}

// The preview's and the report's plots: for each degree of freedom, the torque a hand must supply
// (gravity, spring, load and net parts) and the hand force at each payload with the allowed band.
import type { ViewModel } from "./view-model";
import type { PlotSpec } from "./draw-plot";
import { runThrough } from "./pose-lines";
import { PALETTE, SERIES_CYCLE } from "./palette";
import { fig } from "./text";
import { shownForce, shownTorque } from "./display-units";

function along(vm: ViewModel, d: number, poseIndex: number): readonly number[] {
  return runThrough(vm.lines[d] ?? [], poseIndex);
}

/** Holding torque against dof d, over the run through the current pose. */
export function torquePlot(vm: ViewModel, d: number, poseIndex: number): PlotSpec {
  const run = along(vm, d, poseIndex);
  const torque = shownTorque(vm.units);
  const x = (p: number) => vm.poses[p]!.anglesDeg[d]!;
  const pick = (key: "gravityTorque" | "springTorque" | "loadTorque" | "netTorque") =>
    run.map((p) => [x(p), vm.poses[p]![key][d]! * torque.scale] as [number, number]);
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
    xLabel: `${vm.dofs[d]!.id} angle, deg`,
    yLabel: `torque to hold, ${torque.symbol} (CCW +)`,
    series,
    markerX: vm.poses[poseIndex]?.anglesDeg[d],
  };
}

/** Hand force at every payload against dof d, with the `require balance` band. */
export function handForcePlot(vm: ViewModel, d: number, poseIndex: number): PlotSpec {
  const run = along(vm, d, poseIndex);
  const force = shownForce(vm.units);
  const series: PlotSpec["series"] = [];
  let k = 0;
  for (const payload of vm.payloads) {
    vm.loadCases.forEach((lc, c) => {
      const name = vm.loadCases.length > 1 ? `${payload.id} (${lc.label})` : payload.id;
      series.push({
        name,
        colour: SERIES_CYCLE[k++ % SERIES_CYCLE.length]!,
        ...(c > 0 ? { dashed: true } : {}),
        points: run.map(
          (p) =>
            [vm.poses[p]!.anglesDeg[d]!, (vm.poses[p]!.handForce[payload.id]?.[c] ?? NaN) * force.scale] as [
              number,
              number,
            ],
        ),
      });
    });
  }
  const limits = Object.values(vm.balanceLimitN);
  const limit = limits.length ? Math.min(...limits) * force.scale : undefined;
  return {
    id: `hand-${vm.dofs[d]!.id}`,
    title: `Hand force against ${vm.dofs[d]!.id}`,
    xLabel: `${vm.dofs[d]!.id} angle, deg`,
    yLabel: `hand force, ${force.symbol}`,
    series,
    ...(limit !== undefined
      ? { band: { from: 0, to: limit, label: `require balance ${fig(limit)} ${force.symbol}` } }
      : {}),
    markerX: vm.poses[poseIndex]?.anglesDeg[d],
  };
}

// Builds the arm view model (view-model.ts) from an analysis: model + sweep + findings + readouts.
// Pure: no IO; the preview request and `poise report` both call it.
import { handForceVector, signedHandForce } from "../mechanics/hand-force";
import type { ArmModel, Body, Vec2 } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import type { Finding } from "../findings/finding";
import type { Readouts } from "../checks/readout";
import type { Span } from "../syntax/span";
import { LineIndex } from "../syntax/span";
import { sectionProperties } from "../model/section";
import { distance, nearestOnSegment } from "../mechanics/plane";
import type {
  PartStatus,
  ViewBody,
  ViewFinding,
  ViewModel,
  ViewPart,
  ViewPose,
  ViewSwivel,
  ViewRange,
  SafetyRow,
} from "./view-model";
import { linesPerDof, nearestPose, thinPoses } from "./pose-lines";
import { EMPTY_BOUNDS, payloadPaths, viewBounds } from "./envelope";
import { buildResults } from "../checks/results";
import { atJoint } from "../model/spring-kinds";
import { carriedBodies } from "../model/build-swivels";
import { sumOverSprings } from "../mechanics/spring-table";

/** What the view needs of an analysis (an `Analysis` fits). */
export interface ViewInput {
  text: string;
  model?: ArmModel;
  sweep?: SweepResult;
  findings: readonly Finding[];
  readouts: Readouts;
}

/** How the torque plots' parts were found, for their caption. */
export const TORQUE_METHOD =
  "Gravity, spring and steady-load parts straight from the solver's statics at each pose: each is " +
  "the torque that holds against those forces alone (their virtual work along the degree of " +
  "freedom), and together they make the net torque.";

const DEG = 180 / Math.PI;
/** The panel is sent at most this many poses (about 1.5 MB of JSON); a denser sweep is thinned to
 * every k-th value of each dof, ends kept. A slider step that fine is finer than a hand can set. */
export const MAX_VIEW_POSES = 2500;
/** Attachment points nearer the centre line than this need no bracket drawn, m. */
const BRACKET_MIN_M = 0.0005;

// The view model is SI, rounded far below anything a drawing or a table shows, which keeps the
// JSON sent to the panel small (a grid of a thousand poses stays a few hundred kilobytes).

/** Forces and torques to 1e-4 N or N*m. */
function r4(x: number): number {
  return Number.isFinite(x) ? Math.round(x * 1e4) / 1e4 : x;
}

/** Lengths on a body to 1e-7 m (a ten-thousandth of a millimetre). */
function localLength(m: number): number {
  return Number.isFinite(m) ? Math.round(m * 1e7) / 1e7 : m;
}

/** Pose coordinates to 1e-5 m (0.01 mm): below a pixel at any zoom of the panel. */
function position(m: number): number {
  return Number.isFinite(m) ? Math.round(m * 1e5) / 1e5 : m;
}

/** Angles to a ten-thousandth of a degree, rad. */
function angle(rad: number): number {
  return Number.isFinite(rad) ? Math.round(rad * DEG * 1e4) / 1e4 / DEG : rad;
}

function toRange(index: LineIndex, s: Span): ViewRange {
  return { start: index.position(s.start), end: index.position(s.end) };
}

function collectParts(model: ArmModel, index: LineIndex): ViewPart[] {
  const parts: ViewPart[] = [];
  const seen = new Set<string>();
  const add = (
    id: string,
    kind: ViewPart["kind"],
    origin: { declaration: Span; name?: Span; generatedBy?: string },
  ) => {
    // Bodies and joints a parallelogram generated belong to it (the parallelogram itself may carry
    // its own id as `generatedBy`).
    if ((origin.generatedBy && origin.generatedBy !== id) || seen.has(id)) return;
    seen.add(id);
    parts.push({
      id,
      kind,
      range: toRange(index, origin.name ?? origin.declaration),
      status: "ok",
      codes: [],
    });
  };
  // Parallelograms before joints: a stage's root joint shares its id.
  for (const p of model.parallelograms) add(p.id, "parallelogram", p.origin);
  for (const b of model.bodies) if (b.kind === "base" || b.kind === "link") add(b.id, b.kind, b.origin);
  for (const j of model.joints) add(j.id, "joint", j.origin);
  for (const s of model.springs) add(s.id, "spring", s.origin);
  for (const p of model.payloads) add(p.id, "payload", p.origin);
  return parts;
}

const RANK: Record<PartStatus, number> = { ok: 0, warning: 1, error: 2 };

/** The part a body, joint or readout id belongs to (generated ids belong to their parallelogram). */
function partOfFactory(model: ArmModel, known: Set<string>): (id: string) => string {
  const generated = new Map<string, string>();
  for (const b of model.bodies) if (b.origin.generatedBy) generated.set(b.id, b.origin.generatedBy);
  for (const j of model.joints) if (j.origin.generatedBy) generated.set(j.id, j.origin.generatedBy);
  return (id) => generated.get(id) ?? (known.has(id) ? id : id.split(".")[0]!);
}

function attachmentsOf(model: ArmModel, bodyId: string): Vec2[] {
  const pts: Vec2[] = [];
  for (const j of model.joints) {
    if (j.parent === bodyId) pts.push(j.parentPoint);
    if (j.child === bodyId) pts.push(j.childPoint);
  }
  for (const s of model.springs) {
    if (atJoint(s)) continue;
    if (s.a.body === bodyId) pts.push(s.a.point);
    if (s.b.body === bodyId) pts.push(s.b.point);
  }
  for (const p of model.payloads) if (p.body === bodyId) pts.push(p.point);
  return pts;
}

/** The centre line of a body in local m: a link's start to end, a head's two far pivots, the
 * base's post from the bench up to its highest attachment. */
function centreLine(model: ArmModel, body: Body, attachments: Vec2[]): Vec2[] {
  if (body.kind === "link" || body.kind === "bar")
    return [
      { x: 0, y: 0 },
      { x: body.length, y: 0 },
    ];
  if (body.kind === "head") {
    const stage = model.parallelograms.find((p) => p.bodies.head === body.id);
    return [
      { x: 0, y: 0 },
      { x: 0, y: stage ? stage.spacing : 0 },
    ];
  }
  if (attachments.length === 0) return [];
  const first = attachments[0]!;
  const top = Math.max(...attachments.filter((p) => p.x === first.x).map((p) => p.y));
  return [
    { x: first.x, y: model.base?.surface ?? 0 },
    { x: first.x, y: top },
  ];
}

function depthOf(model: ArmModel, body: Body): number | undefined {
  if (body.section) return sectionProperties(body.section).depth;
  if (body.kind === "head") {
    const stage = model.parallelograms.find((p) => p.bodies.head === body.id);
    const bar = stage ? model.bodies.find((b) => b.id === stage.bodies.lower) : undefined;
    if (bar?.section) return sectionProperties(bar.section).depth;
  }
  return undefined;
}

function viewBody(model: ArmModel, body: Body, partOf: (id: string) => string): ViewBody {
  const attachments = attachmentsOf(model, body.id);
  const line = centreLine(model, body, attachments);
  const brackets: ViewBody["brackets"] = [];
  for (const p of attachments) {
    let near: Vec2 | undefined;
    for (let i = 0; i + 1 < line.length; i++) near = nearestOnSegment(p, line[i]!, line[i + 1]!);
    if (near && distance(near, p) > BRACKET_MIN_M)
      brackets.push([localLength(near.x), localLength(near.y), localLength(p.x), localLength(p.y)]);
  }
  const depth = depthOf(model, body);
  return {
    id: body.id,
    partId: partOf(body.id),
    kind: body.kind,
    line: line.map((p) => [localLength(p.x), localLength(p.y)]),
    brackets,
    ...(depth !== undefined ? { depth: localLength(depth) } : {}),
  };
}

/** The springs' part of a pose's holding torque at a dof: the sum of each spring's part. */
function springsPart(pose: Pose, dofId: string): number {
  if (!pose.springTorque) return NaN;
  return sumOverSprings(pose.springTorque, dofId);
}

/** The reference pose itself, drawn when the sweep's steps miss the written angles (a grid), so
 * that "drawn at the reference pose" is exact; undefined when a swept pose is at it. */
function exactReference(model: ArmModel, sweep: SweepResult): ViewPose | undefined {
  const ref = sweep.reference;
  if (!ref) return undefined;
  const atReference = (pose: SweepResult["poses"][number]) =>
    sweep.dofs.every(
      (d) =>
        Math.abs((pose.angles[d.id] ?? d.reference) - (ref.angles[d.id] ?? d.reference)) < AT_REFERENCE_RAD,
    );
  if (sweep.poses.some(atReference)) return undefined;
  return viewPoses(model, { ...sweep, poses: [ref] })[0];
}

/** Angles closer than this are the reference angle itself (round-off of the sweep's steps). */
const AT_REFERENCE_RAD = 1e-9;

/** The hand force the pose solver found (beyond what the pivots' friction holds), signed:
 * positive where the arm sinks (the hand lifts), negative where it rises. */
function signedBeyondFriction(c: SweepResult["poses"][number]["cases"][number], payloadId: string): number {
  const vector = c.handForceVector?.[payloadId];
  return vector ? signedHandForce(vector) : (c.handForce[payloadId] ?? NaN);
}

/** The same hand force as if no pivot had friction: from the whole holding torques. */
function signedWithoutFriction(
  pose: SweepResult["poses"][number],
  c: SweepResult["poses"][number]["cases"][number],
  payloadId: string,
  dofIds: readonly string[],
): number {
  const columns = pose.payloadJacobian?.[payloadId];
  if (!columns) return NaN;
  const jacobian = dofIds.flatMap((id) => [columns[id]?.x ?? 0, columns[id]?.y ?? 0]);
  const torque = dofIds.map((id) => c.holdingTorque[id] ?? 0);
  return signedHandForce(handForceVector(jacobian, torque, dofIds.length));
}

function viewPoses(model: ArmModel, sweep: SweepResult): ViewPose[] {
  const dofIds = sweep.dofs.map((d) => d.id);
  // Friction at a degree of freedom's joint: the plots then show the hand force without it too.
  const hasFriction = model.joints.some((j) => (j.friction ?? 0) > 0);
  return sweep.poses.map((pose) => {
    const bodies: ViewPose["bodies"] = {};
    for (const [id, b] of Object.entries(pose.bodies))
      bodies[id] = [position(b.x), position(b.y), angle(b.phi)];
    const springs: ViewPose["springs"] = {};
    for (const [id, s] of Object.entries(pose.springs))
      springs[id] = [position(s.a.x), position(s.a.y), position(s.b.x), position(s.b.y)];
    const handForce: ViewPose["handForce"] = {};
    for (const payload of model.payloads)
      handForce[payload.id] = pose.cases.map((c) => r4(signedBeyondFriction(c, payload.id)));
    const nominal = pose.cases[0];
    const handForceFree: ViewPose["handForceFree"] = {};
    if (nominal && hasFriction)
      for (const payload of model.payloads)
        handForceFree[payload.id] = r4(signedWithoutFriction(pose, nominal, payload.id, dofIds));
    return {
      angles: sweep.dofs.map((d) => angle(pose.angles[d.id] ?? d.reference)),
      bodies,
      springs,
      netTorque: sweep.dofs.map((d) => r4(nominal?.holdingTorque[d.id] ?? NaN)),
      gravityTorque: sweep.dofs.map((d) => r4(nominal?.gravityTorque?.[d.id] ?? NaN)),
      springTorque: sweep.dofs.map((d) => r4(springsPart(pose, d.id))),
      loadTorque: sweep.dofs.map((d) => r4(nominal?.loadTorque?.[d.id] ?? NaN)),
      handForce,
      ...(hasFriction ? { handForceFree } : {}),
      springForce: Object.fromEntries(Object.entries(nominal?.springForce ?? {}).map(([k, v]) => [k, r4(v)])),
    };
  });
}

function safetyRows(model: ArmModel, readouts: Readouts, partOf: (id: string) => string): SafetyRow[] {
  const rows: SafetyRow[] = [];
  for (const r of Object.values(readouts)) {
    if (!r.worstSafety) continue;
    rows.push({
      partId: partOf(r.id),
      id: r.id,
      kind: r.kind,
      value: r.worstSafety.value,
      what: r.worstSafety.what,
      ...(r.worstSafety.where ? { where: r.worstSafety.where } : {}),
      // the base's tipping safety answers to `require tipping`, every other part to `require safety`
      required: r.worstSafety.what.startsWith("tipping") ? model.require.tipping : model.require.safety,
    });
  }
  return rows.sort((a, b) => a.value - b.value);
}

export interface ViewOptions {
  /** Unit system of the figures and labels (default SI). */
  units?: "si" | "us";
  /** Most poses to carry (default MAX_VIEW_POSES; the report, which sends no JSON, takes all). */
  maxPoses?: number;
}

/** The swivels for the top view, deepest first, the base's yaw last; undefined when no swivel
 * turns a stage above the base (a base's yaw alone turns the arm as a whole: the side view says
 * it all). */
function viewSwivels(model: ArmModel): ViewSwivel[] | undefined {
  const all = model.swivels ?? [];
  if (!all.some((s) => s.joint)) return undefined;
  const carried = new Map(all.map((s) => [s.id, carriedBodies(model.joints, s).bodies]));
  const depth = (id: string) =>
    all.filter((o) => o.id !== id && carried.get(o.id)!.has(all.find((s) => s.id === id)!.parent)).length;
  return [...all]
    .sort((a, b) => depth(b.id) - depth(a.id))
    .map((s) => ({
      id: s.id,
      parent: s.parent,
      local: [localLength(s.point.x), localLength(s.point.y)] as [number, number],
      carried: [...carried.get(s.id)!],
      heading: [angle(s.heading?.[0] ?? -Math.PI), angle(s.heading?.[1] ?? Math.PI)] as [number, number],
    }));
}

export function buildViewModel(input: ViewInput, options: ViewOptions = {}): ViewModel {
  const index = new LineIndex(input.text);
  const model = input.model;
  const vm: ViewModel = {
    version: 2,
    title: model?.title ?? "Untitled arm",
    units: options.units ?? "si",
    surface: localLength(model?.base?.surface ?? 0),
    bounds: [...EMPTY_BOUNDS],
    parts: [],
    bodies: [],
    pivots: [],
    springs: [],
    payloads: [],
    dofs: [],
    loadCases: [],
    poses: [],
    referencePose: 0,
    lines: [],
    envelope: {},
    balanceLimit: {},
    requiredSafety: model?.require.safety ?? 0,
    safety: [],
    findings: [],
    torqueMethod: TORQUE_METHOD,
  };
  if (model) vm.parts = collectParts(model, index);
  const partIds = new Set(vm.parts.map((p) => p.id));
  const byId = new Map(vm.parts.map((p) => [p.id, p]));
  const partOfSubject = model ? partOfFactory(model, partIds) : (id: string) => id;
  for (const f of input.findings) {
    // The part a finding is about is its subject (a generated body or joint: its parallelogram).
    const subject = f.data.subject;
    const partId =
      subject !== undefined && byId.has(partOfSubject(subject)) ? partOfSubject(subject) : undefined;
    vm.findings.push({
      code: f.code,
      severity: f.severity,
      message: f.message,
      range: toRange(index, f.span),
      ...(partId ? { partId } : {}),
    });
    const part = partId ? byId.get(partId) : undefined;
    if (!part || (f.severity !== "error" && f.severity !== "warning")) continue;
    if (RANK[f.severity] > RANK[part.status]) part.status = f.severity;
    if (!part.codes.includes(f.code)) part.codes.push(f.code);
  }
  if (!model) {
    vm.emptyReason = "The text does not describe an arm yet: see the findings below.";
    return vm;
  }
  const partOf = partOfFactory(model, partIds);
  if (model.base?.footprint) vm.footprint = localLength(model.base.footprint.width);
  vm.bodies = model.bodies.map((b) => viewBody(model, b, partOf));
  vm.pivots = model.joints.map((j) => ({
    jointId: j.id,
    partId: partOf(j.id),
    body: j.child,
    local: [localLength(j.childPoint.x), localLength(j.childPoint.y)] as [number, number],
    mode: j.mode,
    ...(j.pin ? { pin: localLength(j.pin.diameter) } : {}),
  }));
  vm.springs = model.springs.map((s) => ({
    id: s.id,
    kind: s.kind,
    ...(atJoint(s) ? { jointId: s.joint } : {}),
    ...(s.kind === "gas" ? { cylinder: localLength(Math.max(0, s.extendedLength - s.stroke)) } : {}),
  }));
  vm.payloads = model.payloads.map((p) => ({
    id: p.id,
    body: p.body,
    local: [localLength(p.point.x), localLength(p.point.y)] as [number, number],
    mass: p.mass,
  }));
  for (const p of model.payloads)
    vm.balanceLimit[p.id] = model.require.balance.byPayload[p.id] ?? model.require.balance.default;
  vm.safety = safetyRows(model, input.readouts, partOf);
  if (input.sweep) vm.results = buildResults(input);

  const sweep = input.sweep;
  const solved =
    sweep && sweep.poses.length === 0 && sweep.reference ? { ...sweep, poses: [sweep.reference] } : sweep;
  const kept = solved
    ? thinPoses(
        solved.poses,
        solved.dofs.map((d) => d.id),
        options.maxPoses ?? MAX_VIEW_POSES,
        solved.dofs.map((d) => d.reference),
      )
    : [];
  const thinned = solved && kept.length < solved.poses.length ? { ...solved, poses: kept } : solved;
  if (solved && thinned && thinned.poses.length < solved.poses.length)
    vm.thinned = { shown: thinned.poses.length, solved: solved.poses.length };
  const poses = thinned;
  if (!poses || poses.poses.length === 0) {
    vm.emptyReason = "The arm has no solved pose yet: fix the errors listed below.";
    return vm;
  }
  const dofIds = poses.dofs.map((d) => d.id);
  vm.lines = linesPerDof(poses.poses, dofIds);
  vm.loadCases = poses.loadCases.map((c) => ({ id: c.id, label: c.label }));
  vm.poses = viewPoses(model, poses);
  vm.dofs = poses.dofs.map((d, i) => ({
    id: d.id,
    range: [angle(d.range[0]), angle(d.range[1])] as [number, number],
    reference: angle(d.reference),
    values: [...new Set(vm.poses.map((p) => p.angles[i]!))].sort((a, b) => a - b),
  }));
  vm.reference = exactReference(model, poses);
  vm.referencePose = nearestPose(
    vm.poses.map((p) => p.angles),
    vm.dofs.map((d) => d.reference),
    vm.dofs.map((d) => d.range[1] - d.range[0]),
  );
  vm.envelope = payloadPaths(vm);
  const turning = viewSwivels(model);
  if (turning) {
    vm.swivels = turning;
    if (model.base?.footprint) vm.footprintDepth = localLength(model.base.footprint.depth);
  }
  vm.bounds = viewBounds(vm);
  return vm;
}

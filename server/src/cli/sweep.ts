// `poise sweep FILE [--json|--csv]`: the pose table behind the checks, in the fixed units of
// docs/cli.md: angles deg, lengths and positions mm, forces N, torques N*m (stresses MPa), which the
// JSON names under `units` and each CSV column in brackets after its path.
import { analyse, type Pose, type SweepResult } from "../analysis";
import { optimiseFor } from "./optimiser";
import { CLI_BUDGET_MS } from "../limits";
import { readSpec, type Output } from "./io";

const RAD_TO_DEG = 180 / Math.PI;
const M_TO_MM = 1000;
/** Decimals kept in the table (0.0001 mm, deg, N, N*m): well past the model's accuracy, and
 * solver round-off such as 1e-17 mm reads as 0. Common practice, no source. */
const DECIMALS = 1e4;

function round(v: number): number | null {
  if (!Number.isFinite(v)) return null;
  const r = Math.round(v * DECIMALS) / DECIMALS;
  return Object.is(r, -0) ? 0 : r;
}

function mapValues<T, U>(record: Record<string, T>, f: (v: T, key: string) => U): Record<string, U> {
  const out: Record<string, U> = {};
  for (const [k, v] of Object.entries(record)) out[k] = f(v, k);
  return out;
}

export interface SweepTablePose {
  angles: Record<string, number | null>;
  bodies: Record<string, { x: number | null; y: number | null; angle: number | null }>;
  holding_torque: Record<string, number | null>;
  hand_force: Record<string, number | null>;
  reactions: Record<string, [number | null, number | null]>;
  springs: Record<string, { length: number | null; force: number | null }>;
}

export interface SweepTable {
  /** The fixed units of docs/cli.md, named (a key added to its shape): a torsion spring's `force` is
   * its torque, in the torque unit. */
  units: { angle: "deg"; length: "mm"; force: "N"; torque: "N*m" };
  dofs: string[];
  poses: SweepTablePose[];
}

const UNITS: SweepTable["units"] = { angle: "deg", length: "mm", force: "N", torque: "N*m" };

/** One pose in docs/cli.md's shape, for the nominal load case (the first). Torsion springs have no
 * length (null) and give their torque, N*m, as `force`. */
function tablePose(pose: Pose): SweepTablePose {
  const statics = pose.cases[0];
  return {
    angles: mapValues(pose.angles, (a) => round(a * RAD_TO_DEG)),
    bodies: mapValues(pose.bodies, (b) => ({
      x: round(b.x * M_TO_MM),
      y: round(b.y * M_TO_MM),
      angle: round(b.phi * RAD_TO_DEG),
    })),
    holding_torque: mapValues(statics?.holdingTorque ?? {}, round),
    hand_force: mapValues(statics?.handForce ?? {}, round),
    reactions: mapValues(
      statics?.reactions ?? {},
      (r) => [round(r.x), round(r.y)] as [number | null, number | null],
    ),
    springs: mapValues(pose.springs, (s, id) => ({
      length: round(s.length * M_TO_MM),
      force: round(statics?.springForce[id] ?? NaN),
    })),
  };
}

export function sweepTable(sweep: SweepResult): SweepTable {
  return { units: UNITS, dofs: sweep.dofs.map((d) => d.id), poses: sweep.poses.map(tablePose) };
}

function csvCell(v: number | null | undefined): string {
  return v === null || v === undefined ? "" : String(v);
}

function csvName(s: string): string {
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Columns named after the JSON paths, with `/` between the parts, and their unit in brackets:
 * `angles/reach [deg]`, `bodies/reach.lower/x [mm]`, `reactions/reach/x [N]`,
 * `springs/lift/force [N]`. */
export function sweepCsv(table: SweepTable): string {
  const u = table.units;
  const first = table.poses[0];
  if (!first) return `${table.dofs.map((d) => csvName(`angles/${d} [${u.angle}]`)).join(",")}\n`;
  const columns: { name: string; get: (p: SweepTablePose) => number | null | undefined }[] = [];
  for (const d of Object.keys(first.angles))
    columns.push({ name: `angles/${d} [${u.angle}]`, get: (p) => p.angles[d] });
  for (const b of Object.keys(first.bodies))
    for (const c of ["x", "y", "angle"] as const)
      columns.push({
        name: `bodies/${b}/${c} [${c === "angle" ? u.angle : u.length}]`,
        get: (p) => p.bodies[b]?.[c],
      });
  for (const d of Object.keys(first.holding_torque))
    columns.push({ name: `holding_torque/${d} [${u.torque}]`, get: (p) => p.holding_torque[d] });
  for (const h of Object.keys(first.hand_force))
    columns.push({ name: `hand_force/${h} [${u.force}]`, get: (p) => p.hand_force[h] });
  for (const j of Object.keys(first.reactions))
    for (const [i, c] of ["x", "y"].entries())
      columns.push({ name: `reactions/${j}/${c} [${u.force}]`, get: (p) => p.reactions[j]?.[i] });
  for (const s of Object.keys(first.springs)) {
    // A torsion spring has no length (null) and gives its torque as its force.
    const atJoint = first.springs[s]?.length === null;
    columns.push({ name: `springs/${s}/length [${u.length}]`, get: (p) => p.springs[s]?.length });
    columns.push({
      name: `springs/${s}/force [${atJoint ? u.torque : u.force}]`,
      get: (p) => p.springs[s]?.force,
    });
  }
  const rows = [columns.map((c) => csvName(c.name)).join(",")];
  for (const p of table.poses) rows.push(columns.map((c) => csvCell(c.get(p))).join(","));
  return `${rows.join("\n")}\n`;
}

export function runSweep(args: string[], out: Output): number {
  let format: "json" | "csv" = "json";
  const files: string[] = [];
  for (const a of args) {
    if (a === "--json") format = "json";
    else if (a === "--csv") format = "csv";
    else if (a.startsWith("-")) {
      out.err(`poise sweep: unknown option ${a} (poise sweep FILE [--json|--csv])\n`);
      return 2;
    } else files.push(a);
  }
  if (files.length !== 1) {
    out.err(`poise sweep: name exactly one .poise file (poise sweep FILE [--json|--csv])\n`);
    return 2;
  }
  const file = files[0]!;
  const text = readSpec(file, out, "sweep");
  if (text === undefined) return 2;
  optimiseFor(text);
  const analysis = analyse(text, { budgetMs: CLI_BUDGET_MS });
  const errors = analysis.findings.filter((f) => f.severity === "error");
  if (!analysis.sweep) {
    out.err(
      `poise sweep: ${file} cannot be swept: ${
        errors.length
          ? errors
              .map((e) => e.message)
              .slice(0, 3)
              .join("; ")
          : "no model"
      } (run poise check ${file})\n`,
    );
    return errors.length > 0 ? 1 : 2;
  }
  const table = sweepTable(analysis.sweep);
  out.out(format === "csv" ? sweepCsv(table) : `${JSON.stringify(table, null, 2)}\n`);
  if (errors.length > 0)
    out.err(
      `poise sweep: ${file} has ${errors.length} error${errors.length === 1 ? "" : "s"} (run poise check ${file})\n`,
    );
  return errors.length > 0 ? 1 : 0;
}

// `poise sweep` as docs/cli.md fixes it: the pose table in JSON (default) or CSV, in fixed units
// (angles deg, lengths mm, forces N, torques N*m), parallelogram bodies as `reach.lower` etc.
import { beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { ensureBuilt, poise } from "./run-cli";

beforeAll(() => ensureBuilt());

function pointOf(text: string, pattern: RegExp): { x: number; y: number } {
  const m = pattern.exec(text)!;
  return { x: Number(m[1]), y: Number(m[2]) };
}

interface SweepJson {
  dofs: string[];
  poses: {
    angles: Record<string, number>;
    bodies: Record<string, { x: number; y: number; angle: number }>;
    holding_torque: Record<string, number>;
    hand_force: Record<string, number>;
    reactions: Record<string, [number, number]>;
    springs: Record<string, { length: number; force: number }>;
  }[];
}

describe("poise sweep", () => {
  it("gives the camera arm's poses in docs/cli.md's JSON shape and units", () => {
    const r = poise("sweep", "samples/camera-arm.poise");
    const table = JSON.parse(r.stdout) as SweepJson;
    expect(table.dofs).toEqual(["reach"]);
    // The fixed units docs/cli.md gives, named in the output.
    expect((table as unknown as { units: unknown }).units).toEqual({
      angle: "deg",
      length: "mm",
      force: "N",
      torque: "N*m",
    });
    // The sample's `steps N` over its one degree of freedom, both ends of its `range` included,
    // in degrees.
    const text = readFileSync("samples/camera-arm.poise", "utf8");
    const steps = Number(/steps (\d+)/.exec(text)![1]);
    const [, low, high] = /range (-?[\d.]+) deg \.\. (-?[\d.]+) deg/.exec(text)!.map(Number);
    expect(table.poses).toHaveLength(steps);
    const first = table.poses[0]!;
    const last = table.poses[table.poses.length - 1]!;
    expect(first.angles.reach).toBeCloseTo(low!, 6);
    expect(last.angles.reach).toBeCloseTo(high!, 6);
    expect(Object.keys(first.bodies)).toEqual(
      expect.arrayContaining(["bench_clamp", "reach.lower", "reach.upper", "reach.head"]),
    );
    // The lower bar starts at the base's `point pivot (x, y)`, in mm; its angle is the stage's
    // angle, in degrees.
    const pivot = pointOf(text, /point pivot \(([-\d.]+) mm, ([-\d.]+) mm\)/);
    expect(first.bodies["reach.lower"]!.x).toBeCloseTo(pivot.x, 3);
    expect(first.bodies["reach.lower"]!.y).toBeCloseTo(pivot.y, 3);
    expect(first.bodies["reach.lower"]!.angle).toBeCloseTo(low!, 3);
    // The head of a parallelogram keeps the root's orientation (docs/language.md).
    for (const p of table.poses) expect(p.bodies["reach.head"]!.angle).toBeCloseTo(0, 3);
    expect(Object.keys(first.holding_torque)).toEqual(["reach"]);
    expect(Object.keys(first.hand_force)).toEqual(["camera"]);
    expect(first.reactions.reach).toHaveLength(2);
    expect(Object.keys(first.springs)).toEqual(["lift"]);
    expect(first.springs.lift!.length).toBeGreaterThan(0);
    expect([0, 1]).toContain(r.status);
  });

  it("spring lengths are hook-to-hook distances in mm", () => {
    const text = readFileSync("samples/camera-arm.poise", "utf8");
    const table = JSON.parse(poise("sweep", "samples/camera-arm.poise", "--json").stdout) as SweepJson;
    // Hooks: `bench_clamp.anchor`, a world point of the base, and `reach.lower(u, v)`, a point in
    // the lower bar's frame, which starts at the pivot and turns with the stage's angle.
    const pivot = pointOf(text, /point pivot \(([-\d.]+) mm, ([-\d.]+) mm\)/);
    const anchor = pointOf(text, /point anchor \(([-\d.]+) mm, ([-\d.]+) mm\)/);
    const local = pointOf(text, /reach\.lower\(([-\d.]+) mm, ([-\d.]+) mm\)/);
    for (const p of table.poses) {
      const a = (p.angles.reach! * Math.PI) / 180;
      const hook = {
        x: pivot.x + local.x * Math.cos(a) - local.y * Math.sin(a),
        y: pivot.y + local.x * Math.sin(a) + local.y * Math.cos(a),
      };
      expect(p.springs.lift!.length).toBeCloseTo(Math.hypot(hook.x - anchor.x, hook.y - anchor.y), 2);
    }
  });

  it("gives the same table as CSV, one column per JSON path with its unit", () => {
    const json = JSON.parse(poise("sweep", "samples/camera-arm.poise").stdout) as SweepJson;
    const csv = poise("sweep", "samples/camera-arm.poise", "--csv").stdout.trimEnd().split("\n");
    const header = csv[0]!.split(",");
    expect(header).toEqual(
      expect.arrayContaining([
        "angles/reach [deg]",
        "bodies/reach.lower/x [mm]",
        "bodies/reach.head/angle [deg]",
        "holding_torque/reach [N*m]",
        "hand_force/camera [N]",
        "reactions/reach/x [N]",
        "reactions/reach/y [N]",
        "springs/lift/length [mm]",
        "springs/lift/force [N]",
      ]),
    );
    expect(csv).toHaveLength(json.poses.length + 1);
    const row = csv[1]!.split(",");
    expect(Number(row[header.indexOf("angles/reach [deg]")])).toBe(json.poses[0]!.angles.reach);
    expect(Number(row[header.indexOf("springs/lift/length [mm]")])).toBe(json.poses[0]!.springs.lift!.length);
  });

  it("names a two-stage arm's dofs after its parallelograms", () => {
    const table = JSON.parse(poise("sweep", "samples/engraver-arm.poise").stdout) as SweepJson;
    expect(table.dofs).toEqual(expect.arrayContaining(["inner", "outer"]));
    expect(Object.keys(table.poses[0]!.bodies)).toEqual(
      expect.arrayContaining(["inner.lower", "outer.head"]),
    );
  });

  it("exits 2 on bad arguments and unreadable files", () => {
    expect(poise("sweep").status).toBe(2);
    expect(poise("sweep", "samples/camera-arm.poise", "--xml").status).toBe(2);
    expect(poise("sweep", "samples/nothing.poise").status).toBe(2);
    expect(poise("sweep", "samples/camera-arm.poise", "samples/engraver-arm.poise").status).toBe(2);
  });
});

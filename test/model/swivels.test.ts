// Swivels in the model: a locked joint in the drawing plane plus the swivel's own record (heading
// range, bearings, friction), the base's yaw as a swivel at the base, and the set of bodies each
// swivel carries.
import { describe, expect, test } from "vitest";
import { parse } from "../../server/src/syntax/parser";
import { buildModel } from "../../server/src/model/build";
import { carriedBodies } from "../../server/src/model/build-swivels";

const build = (text: string) => buildModel(parse(text), text);
const DEG = Math.PI / 180;
const MM = 1e-3;

const ARM = `arm "two stages" {
  base bench {
    yaw
    bearings 40 mm
    thrust
    point top (0 mm, 300 mm)
  }
  parallelogram reach {
    on bench.top
    length 300 mm
    spacing 40 mm
    angle 20 deg
    fixed
    bars rect 20 mm x 6 mm aluminium_6061_t6
  }
  link hub {
    length 40 mm
    section rect 20 mm x 20 mm
    material aluminium_6061_t6
  }
  swivel barrel {
    connects reach.head to hub.start
    heading -120 deg .. 120 deg
    bearings 30 mm
    friction 0.2 N*m
  }
  link outer {
    length 200 mm
    section rect 16 mm x 6 mm
    material aluminium_6061_t6
  }
  joint elbow {
    connects hub.end to outer.start
    range -30 deg .. 30 deg
  }
  payload lamp {
    mass 300 g
    at outer.end
  }
}`;

describe("swivel", () => {
  test("stands as a locked joint in the plane and keeps its heading, bearings and friction", () => {
    const { model, findings } = build(ARM);
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    const j = model!.joints.find((x) => x.id === "barrel")!;
    expect(j).toMatchObject({
      parent: "reach.head",
      child: "hub",
      mode: "fixed",
      angle: 0,
      swivel: "barrel",
    });
    const s = model!.swivels!.find((x) => x.id === "barrel")!;
    expect(s.heading![0]).toBeCloseTo(-120 * DEG, 12);
    expect(s.heading![1]).toBeCloseTo(120 * DEG, 12);
    expect(s.bearings!.spacing).toBeCloseTo(30 * MM, 12);
    expect(s.friction).toBeCloseTo(0.2, 12);
    expect(s.child).toBe("hub");
  });

  test("the base's yaw is a swivel at the base's origin, with the base's bearings", () => {
    const { model } = build(ARM);
    const yaw = model!.swivels![0]!;
    expect(yaw).toMatchObject({ id: "bench", parent: "bench", point: { x: 0, y: 0 } });
    expect(yaw.joint).toBeUndefined();
    expect(yaw.bearings!.spacing).toBeCloseTo(40 * MM, 12);
    expect(yaw.thrust).toEqual({});
  });

  test("names its bearings when they are declared", () => {
    const text = ARM.replace("bearings 30 mm\n", "bearings 30 mm ring\n    thrust ring\n").replace(
      "  payload lamp {",
      "  bearing ring { static_rating 2 kN }\n  payload lamp {",
    );
    const { model, findings } = build(text);
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    const s = model!.swivels!.find((x) => x.id === "barrel")!;
    expect(s.bearings).toMatchObject({ bearing: "ring" });
    expect(s.thrust).toEqual({ bearing: "ring" });
  });

  test("a heading range of a full turn or more is all the way round", () => {
    const { model } = build(ARM.replace("heading -120 deg .. 120 deg", "heading -180 deg .. 180 deg"));
    expect(model!.swivels!.find((x) => x.id === "barrel")!.heading).toBeUndefined();
  });

  test("carries everything beyond it, and nothing on the parent's side", () => {
    const { model } = build(ARM);
    const s = model!.swivels!.find((x) => x.id === "barrel")!;
    const { bodies, loops } = carriedBodies(model!.joints, s);
    expect([...bodies].sort()).toEqual(["hub", "outer"]);
    expect(loops).toBe(false);
    const yaw = carriedBodies(model!.joints, model!.swivels![0]!);
    expect(yaw.bodies.has("bench")).toBe(false);
    expect(yaw.bodies.has("reach.lower")).toBe(true);
  });
});

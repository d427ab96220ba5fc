// The model builder on bearings and fastenings: each kind with its values in SI, defaults (ISO
// coarse pitch, the formed thread in a print, the default screw class), the uses, and what it
// refuses.
import { describe, expect, test } from "vitest";
import { parse } from "../../server/src/syntax/parser";
import { buildModel } from "../../server/src/model/build";

const build = (text: string) => buildModel(parse(text), text);
const MM = 1e-3;

const ARM = (extra: string) => `arm "hardware" {
  base bench {
    point top (0 mm, 300 mm)
    point anchor (0 mm, 380 mm)
    fastening bench_screws
  }
  link boom {
    length 300 mm
    section rect 20 mm x 8 mm
    material pla
    point lug (100 mm, 12 mm)
  }
  joint shoulder {
    connects bench.top to boom.start
    range -30 deg .. 30 deg
    bearing ring
  }
  spring lift {
    extension
    between bench.anchor and boom.lug
    rate 0.5 N/mm
    free_length 60 mm
    anchor_fastening lug_screws
    hook_fastening lug_screws
  }
  payload lamp {
    mass 400 g
    at boom.end
    fastening clamp
  }
  bearing ring { balls 12 x 6 mm chrome_steel; pitch 50 mm; races pla }
  fastening lug_screws { screws 2 x 3 mm; into pla; engagement 6 mm; spacing 12 mm }
  fastening bench_screws { screws 2 x 4 mm steel_8_8; into aluminium_6061_t6; engagement 10 mm; spacing 40 mm }
  fastening clamp { adhesive epoxy; area 300 mm^2 }
${extra}
}`;

describe("bearings and fastenings", () => {
  test("each kind in SI, with its uses", () => {
    const { model, findings } = build(ARM(""));
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    const ring = model!.bearings["ring"]!;
    expect(ring).toMatchObject({
      kind: "balls",
      count: 12,
      ballMaterial: "chrome_steel",
      raceMaterial: "pla",
    });
    if (ring.kind !== "balls") throw new Error("balls");
    expect(ring.ballDiameter).toBeCloseTo(6 * MM, 12);
    expect(ring.pitchDiameter).toBeCloseTo(50 * MM, 12);
    const lug = model!.fastenings["lug_screws"]!;
    if (lug.kind !== "screws") throw new Error("screws");
    // ISO 261 coarse pitch of M3: 0.5 mm; a screw in a print forms its own thread; class 4.8 default
    expect(lug.pitch).toBeCloseTo(0.5 * MM, 12);
    expect(lug.thread).toBe("formed");
    expect(lug.screwMaterial).toBe("steel_4_8");
    expect(lug.spacing).toBeCloseTo(12 * MM, 12);
    const bench = model!.fastenings["bench_screws"]!;
    if (bench.kind !== "screws") throw new Error("screws");
    expect(bench.screwMaterial).toBe("steel_8_8");
    expect(bench.thread).toBe("tapped");
    expect(model!.fastenings["clamp"]).toMatchObject({ kind: "glue", adhesive: "epoxy" });
    expect(model!.joints[0]!.bearing).toBe("ring");
    expect(model!.springs[0]!.fastenings).toEqual({ a: "lug_screws", b: "lug_screws" });
    expect(model!.payloads[0]!.fastening).toBe("clamp");
    expect(model!.base!.fastening).toBe("bench_screws");
  });

  test("plain and rated bearings, bolts", () => {
    const { model, findings } = build(
      ARM(`  bearing sleeve { bore 8 mm; length 12 mm; material petg }
  bearing bought { static_rating 1.37 kN; dynamic_rating 3.3 kN }
  fastening plates { bolts 2 x 5 mm steel_8_8; spacing 20 mm; shear double }`),
    );
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    expect(model!.bearings["sleeve"]).toMatchObject({ kind: "plain", material: "petg" });
    expect(model!.bearings["bought"]).toMatchObject({
      kind: "rated",
      staticRating: 1370,
      dynamicRating: 3300,
    });
    const plates = model!.fastenings["plates"]!;
    expect(plates).toMatchObject({ kind: "bolts", count: 2, shearPlanes: 2, material: "steel_8_8" });
    if (plates.kind !== "bolts") throw new Error("bolts");
    expect(plates.pitch).toBeCloseTo(0.8 * MM, 12);
  });

  const codesOf = (extra: string) =>
    build(ARM(extra))
      .findings.filter((f) => f.severity === "error")
      .map((f) => `${f.code}: ${f.message}`);

  test("what it refuses", () => {
    expect(codesOf(`  bearing crowded { balls 12 x 6 mm chrome_steel; pitch 20 mm; races pla }`)).toEqual([
      expect.stringMatching(
        /^value\.impossible: 12 balls of 6 mm do not fit on a pitch circle of 20 mm \(at most \d+\)/,
      ),
    ]);
    expect(codesOf(`  bearing two { balls 2 x 6 mm chrome_steel; pitch 50 mm; races pla }`)).toEqual([
      "value.impossible: a ball bearing needs at least 3 balls",
    ]);
    expect(
      codesOf(`  bearing both { balls 8 x 6 mm chrome_steel; pitch 50 mm; races pla; bore 8 mm }`),
    ).toEqual([
      expect.stringMatching(/^property\.conflict: bearing both is a ball bearing/),
      expect.stringMatching(/^property\.unknown: `bore` does not apply to a ball bearing/),
    ]);
    expect(codesOf(`  bearing none { pitch 50 mm }`)).toEqual([
      expect.stringMatching(/^property\.missing: bearing none needs `balls`, `bore` or `static_rating`/),
    ]);
    expect(
      codesOf(`  fastening odd { screws 2 x 3.3 mm; into pla; engagement 6 mm; spacing 10 mm }`),
    ).toEqual([
      expect.stringMatching(/^property\.missing: fastening odd: 3.30 mm is not an ISO metric coarse size/),
    ]);
    expect(codesOf(`  fastening half { screws 1.5 x 3 mm; into pla; engagement 6 mm }`)).toEqual([
      expect.stringMatching(/^value\.impossible: the number of screws is a whole number/),
    ]);
    expect(codesOf(`  fastening row { screws 3 x 3 mm; into pla; engagement 6 mm }`)).toEqual([
      expect.stringMatching(/^property\.missing: fastening row needs `spacing`/),
    ]);
  });

  test("a fastening holds only a fixed joint; names must be of the right kind", () => {
    const text = ARM("").replace("    bearing ring\n", "    fastening lug_screws\n");
    const errors = build(text).findings.filter((f) => f.severity === "error");
    expect(errors.map((f) => f.code)).toEqual(["property.conflict"]);
    expect(errors[0]!.message).toMatch(
      /joint shoulder turns over its range: a fastening holds only a fixed joint/,
    );
    const wrong = build(ARM("").replace("    bearing ring\n", "    bearing lug_screws\n")).findings.filter(
      (f) => f.severity === "error",
    );
    expect(wrong.map((f) => f.message)).toEqual(["`lug_screws` is a fastening, not a bearing"]);
  });
});

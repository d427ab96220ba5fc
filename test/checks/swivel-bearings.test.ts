// Bearings of swivels and of the base's yaw (issue 12 with issue 11; mechanics.md section 11): the
// loads through the swivel from statics computed here, the radial pair's couple M / D plus half
// the shear, the thrust bearing's axial load, and their safety by ISO 76 and by Stribeck and Hertz.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";

const g = 9.80665;
const m = 1; // kg at the arm's end
const l = 0.3; // m
const D = 0.04; // m between the radial bearings
const FX = 5; // N, the payload's working force along the arm
const C0 = 1370; // N, the radial bearings' static rating (a maker's figure for a 608, from memory)

function turning(extra = "") {
  return `# Invented: a lamp arm turning on a knuckle at the top of a post, on bought bearings.
arm "Knuckle on bearings" {
  base bench {
    point top (0 mm, 300 mm)
  }
  link arm1 {
    length ${l * 1000} mm
    mass 0 g
  }
  swivel knuckle {
    connects bench.top to arm1.start
    heading -90 deg .. 90 deg
    bearings ${D * 1000} mm pair_608
    thrust ring
  }
  payload lamp {
    mass ${m * 1000} g
    at arm1.end
    force (${FX} N, 0 N)
  }
  bearing pair_608 { static_rating ${C0} N }
  bearing ring { balls 12 x 6 mm chrome_steel; pitch 50 mm; races petg }
  ${extra}
  require { balance 100 N }
}
`;
}

describe("a swivel's bearings", () => {
  const a = analyse(turning());
  // Statics of the carried arm: the swivel holds its weight m g (axial), the working force FX
  // (shear) and the moment of the weight about the swivel's point, m g l (the force acts at the
  // point's height, so it adds none).
  const axial = m * g;
  const M = m * g * l;

  it("the radial pair: the moment as a couple M / D plus half the shear; ISO 76 safety C0 / P0", () => {
    const radial = M / D + FX / 2;
    const fig = a.readouts["knuckle"]!.figures.find(
      (f) => f.label === "radial load on the more loaded of its two bearings",
    )!;
    expect(fig.value).toBeCloseTo(radial, 6);
    const onBearing = a.readouts["pair_608"]!.figures.find(
      (f) => f.label === "at knuckle (radial bearing): radial load",
    )!;
    expect(onBearing.value).toBeCloseTo(radial, 6);
    // ISO 76: P0 = max(0.6 Fr + 0.5 Fa, Fr); the thrust bearing takes Fa, so P0 = Fr; s0 = C0 / P0
    const s0 = C0 / Math.max(0.6 * radial, radial);
    const safety = a.readouts["pair_608"]!.figures.find(
      (f) => f.label === "at knuckle (radial bearing): safety factor",
    )!;
    expect(safety.value).toBeCloseTo(s0, 6);
    expect(fig.result?.key).toBe("bearing_loads");
  });

  it("the thrust ring: each ball carries Fa / Z (Stribeck, centred thrust), pressing by Hertz on a flat race", () => {
    const Z = 12;
    const ball = a.readouts["ring"]!.figures.find(
      (f) => f.label === "at knuckle (thrust bearing): most loaded ball",
    )!;
    expect(ball.value).toBeCloseTo(axial / Z, 9);
    // Hertz, sphere of radius R on a flat (Johnson, Contact Mechanics, ch. 4): a = (3 F R / (4 E*))^(1/3),
    // p0 = 3 F / (2 pi a^2), 1/E* = (1 - v1^2)/E1 + (1 - v2^2)/E2
    const steel = a.model!.materials["chrome_steel"]!;
    const petg = a.model!.materials["petg"]!;
    const Estar = 1 / ((1 - steel.poisson ** 2) / steel.modulus + (1 - petg.poisson ** 2) / petg.modulus);
    const F = axial / Z;
    const R = 0.003;
    const radius = Math.cbrt((3 * F * R) / (4 * Estar));
    const p0 = (3 * F) / (2 * Math.PI * radius ** 2);
    const pressure = a.readouts["ring"]!.figures.find(
      (f) => f.label === "at knuckle (thrust bearing): contact pressure",
    )!;
    expect(pressure.value / p0).toBeCloseTo(1, 6);
  });

  it("a pair too weak for the moment is strength.bearing on the swivel's bearings", () => {
    const weak = analyse(turning().replace(`static_rating ${C0} N`, "static_rating 100 N"));
    const f = weak.findings.find((x) => x.code === "strength.bearing" && x.data.subject === "knuckle")!;
    expect(f).toBeDefined();
    const text = turning().replace(`static_rating ${C0} N`, "static_rating 100 N");
    expect(text.slice(f.span.start, f.span.end)).toMatch(/^bearings/);
    // ISO 76 as above, with C0 = 100 N
    expect(f.code === "strength.bearing" && f.data.safety).toBeCloseTo(100 / (M / D + FX / 2), 6);
  });

  it("poise results: the swivel's bearing_loads and its least safety", async () => {
    const { resultsOf } = await import("../../server/src/cli/results");
    const { json } = resultsOf(turning(), "si");
    const swivels = json["swivels"] as Record<string, { bearing_loads: number; safety: number }>;
    // in N, as the units say
    expect(swivels["knuckle"]!.bearing_loads).toBeCloseTo(M / D + FX / 2, 3);
    // its least safety: the lower of its two bearings'
    const a = analyse(turning());
    const least = Math.min(...["pair_608", "ring"].map((id) => a.readouts[id]!.worstSafety!.value));
    expect(swivels["knuckle"]!.safety / least).toBeCloseTo(1, 5);
  });
});

describe("the base's yaw on its bearings", () => {
  const text = `# Invented: a lamp arm whose whole base turns on a ring, on the bench.
arm "Turning base" {
  base bench {
    yaw
    bearings 60 mm pair_608
    thrust ring
    point top (0 mm, 300 mm)
  }
  link arm1 {
    length ${l * 1000} mm
    mass 0 g
  }
  joint shoulder {
    connects bench.top to arm1.start
    fixed
  }
  payload lamp {
    mass ${m * 1000} g
    at arm1.end
    force (${FX} N, 0 N)
  }
  bearing pair_608 { static_rating ${C0} N }
  bearing ring { balls 12 x 6 mm chrome_steel; pitch 50 mm; races petg }
  require { balance 100 N }
}
`;
  const a = analyse(text);

  it("the arm's loads about the base's origin: weight, working force and their moment", () => {
    // statics: the payload's weight at (l, 0.3 m) and its force FX at 0.3 m above the origin;
    // moment about the origin |x fy - y fx|
    const Mo = Math.abs(l * -(m * g) - 0.3 * FX);
    const radial = Mo / 0.06 + FX / 2;
    const fig = a.readouts["pair_608"]!.figures.find(
      (f) => f.label === "at bench (radial bearing): radial load",
    )!;
    expect(fig.value).toBeCloseTo(radial, 6);
    const thrust = a.readouts["ring"]!.figures.find(
      (f) => f.label === "at bench (thrust bearing): axial load",
    )!;
    expect(thrust.value).toBeCloseTo(m * g, 9);
  });
});

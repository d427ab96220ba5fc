// The aged load case (`aged { after T }`, issue 12): a rubber cord's force and a printed part's
// stiffness after a time under load, and the balance and stiffness checks run on the aged arm.
// Expected figures come from the published laws, computed here: the pivoting link's holding
// torque with a spring of force F (references: Streit and Gilmore 1989; Herder 2001), the
// neo-Hookean cord force (Treloar, 3rd ed.), Roark's cantilever, and the ageing rules' own
// laws with their recalled values (relaxation logarithmic in time, Findley's creep power law).
import { describe, expect, it } from "vitest";
import { analyse, type Analysis } from "../../server/src/analysis";
import { sectionProperties } from "../../server/src/model/section";
import { resultsOf, resultsText } from "../../server/src/cli/results";

const g = 9.80665;
// Julian year of 365.25 days of 86 400 s (IAU; SI Brochure, 9th ed., table 8 for the day)
const YEAR_S = 365.25 * 86400;

// Rubber relaxation at a fixed stretch, F(t) = F(t0) (1 - r log10(t / t0)): r = 0.03 a tenfold of
// time from t0 = 60 s (values from memory, as docs/checks.md states them).
const cordKept = (t: number) => 1 - 0.03 * Math.log10(t / 60);
// Findley's power law (Findley, Lai and Onaran, 1976): strain grows by 1 + a t^n, t in hours, so
// the stiffness kept is 1 / (1 + a t^n); a = 0.1, n = 0.25 (values from memory).
const printKept = (t: number) => 1 / (1 + 0.1 * (t / 3600) ** 0.25);

function figure(a: Analysis, id: string, label: string) {
  return a.readouts[id]?.figures.find((f) => f.label === label);
}

// A massless boom on a pivot 300 mm up, 0.5 kg at l = 300 mm, lifted by a rubber cord from a
// point a = 80 mm above the pivot to b = 100 mm along the boom (a pivoting link).
const m = 0.5;
const l = 0.3;
const a = 0.08;
const b = 0.1;
const L0 = 0.064;
const AREA = 33.6e-6;
function corded(aged: string, limitN: number) {
  return `# Invented: a lamp boom lifted by a rubber cord, checked after a time under load.
arm "Corded boom" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, ${300 + a * 1000} mm)
  }
  link boom {
    length ${l * 1000} mm
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -30 deg .. 30 deg
  }
  spring cord {
    elastic
    between post.anchor and boom(${b * 1000} mm, 0 mm)
    free_length ${L0 * 1000} mm
    area ${AREA * 1e6} mm^2
    material natural_latex
  }
  payload lamp {
    mass ${m * 1000} g
    at boom.end
  }
  ${aged}
  require { balance ${limitN} N at lamp }
  sweep { steps 3 }
}
`;
}

/** Hand force at the lamp at angle theta with the cord's force scaled by `kept`, signed as the
 * readout gives it (positive where the arm sinks): the pivoting link's holding torque
 * m g l cos(theta) - F a b cos(theta) / L (references.md, gravity balancing), F neo-Hookean
 * G A (lambda - lambda^-2) (Treloar), over the lamp's lever l. */
function handForce(theta: number, G: number, kept: number): number {
  const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(theta));
  const lambda = L / L0;
  const F = kept * G * AREA * (lambda - lambda ** -2);
  return (m * g * l * Math.cos(theta) - (F * a * b * Math.cos(theta)) / L) / l;
}

/** The payload's hand force readout (signed, beyond friction: none here). */
const HAND = "hand force range, beyond friction (+ the arm sinks, - it rises)";

const ANGLES = [-30, 0, 30].map((d) => (d * Math.PI) / 180);

describe("aged case: a rubber cord relaxes and the arm sinks", () => {
  const nominal = analyse(corded("", 100));
  const G = nominal.model!.materials["natural_latex"]!.shearModulus;
  const forces = (kept: number) => ANGLES.map((t) => handForce(t, G, kept));
  const greatest = (kept: number) => Math.max(...forces(kept));
  const least = (kept: number) => Math.min(...forces(kept));
  const worst = (kept: number) => Math.max(...forces(kept).map(Math.abs));

  it("reads `after 1 year` as a Julian year and keeps the arm as built unchanged", () => {
    const aged = analyse(corded("aged { after 1 year }", 100));
    // 1 year = 365.25 d (IAU Julian year)
    expect(aged.model!.aged!.after).toBe(YEAR_S);
    // the arm as built: the worst hand force over the three poses, by the formula
    expect(figure(nominal, "lamp", HAND)!.high).toBeCloseTo(greatest(1), 6);
    expect(figure(aged, "lamp", HAND)!.high).toBeCloseTo(greatest(1), 6);
  });

  it("hand force of the aged arm: the cord's force times the relaxation rule", () => {
    const aged = analyse(corded("aged { after 1 year }", 100));
    const fig = figure(aged, "lamp", `${HAND}, aged 1 year`)!;
    // same law, cord force scaled by the relaxation after a year (values from memory)
    expect(fig.high).toBeCloseTo(greatest(cordKept(YEAR_S)), 6);
    expect(fig.value).toBeCloseTo(least(cordKept(YEAR_S)), 6);
    expect(fig.result).toBeUndefined();
    expect(aged.readouts["cord"]!.notes.join(" ")).toMatch(
      /after 1 year: the cord's force is taken 17 % lower/,
    );
  });

  it("an arm balanced as built but not after a year: balance.unbalanced for the aged case, with no quick fix", () => {
    const limit = (worst(1) + worst(cordKept(YEAR_S))) / 2;
    expect(worst(1)).toBeLessThan(limit);
    const text = corded("aged {\n    after 1 year\n  }", Number(limit.toFixed(3)));
    const aged = analyse(text);
    const found = aged.findings.filter((f) => f.code === "balance.unbalanced");
    expect(found).toHaveLength(1);
    const f = found[0]!;
    expect(f.message).toMatch(/^Aged case, after 1 year \(rubber cords' force 17 % lower\): /);
    expect(f.data.agedAfter).toBe(YEAR_S);
    expect(f.code === "balance.unbalanced" && f.data.best).toBeUndefined();
    // the aged case points back at the line that states it
    const after = text.indexOf("after 1 year");
    expect(f.related.some((r) => r.span.start === after)).toBe(true);
    // worst aged hand force in the message, by the formula
    expect(f.code === "balance.unbalanced" && f.data.worstHandForce).toBeCloseTo(worst(cordKept(YEAR_S)), 6);
  });

  it("a quick pass while typing leaves the aged case to the full pass", () => {
    const text = corded("aged { after 1 year }", 100).replace("steps 3", "steps 5");
    const quick = analyse(text, { quickSteps: 3 });
    expect(quick.sweep!.quick).toBe(true);
    expect(figure(quick, "lamp", `${HAND}, aged 1 year`)).toBeUndefined();
    expect(figure(analyse(text), "lamp", `${HAND}, aged 1 year`)).toBeDefined();
  });

  it("a relaxation written in the spec overrides the rule", () => {
    const aged = analyse(corded("aged { after 2 weeks; relaxation 0.25 }", 100));
    expect(figure(aged, "lamp", `${HAND}, aged 2 weeks`)!.high).toBeCloseTo(greatest(0.75), 6);
  });

  it("a finding of the arm as built is not repeated: the aged figures become its related information", () => {
    const aged = analyse(corded("aged { after 1 year }", 0.01));
    const found = aged.findings.filter((f) => f.code === "balance.unbalanced");
    expect(found).toHaveLength(1);
    expect(found[0]!.message).not.toMatch(/Aged case/);
    expect(found[0]!.related.some((r) => /^Aged case, after 1 year/.test(r.message))).toBe(true);
  });
});

describe("aged case in the results record (`poise results`)", () => {
  const G = analyse(corded("", 100)).model!.materials["natural_latex"]!.shearModulus;
  const forces = (kept: number) => ANGLES.map((t) => handForce(t, G, kept));
  const { json, record } = resultsOf(corded("aged { after 1 year }", 100));
  const aged = json["aged"] as {
    after: number;
    payloads: Record<string, { hand_force: [number, number] }>;
    springs: Record<string, { force: [number, number] }>;
  };

  it("states how long, in days (the table unit of time), named in `units`", () => {
    // 1 year = 365.25 d (IAU Julian year)
    expect(aged.after).toBeCloseTo(365.25, 6);
    expect((json["units"] as Record<string, string>)["time"]).toBe("days");
  });

  it("carries the aged payload's hand force beside the arm as built's", () => {
    const builtHand = (json["payloads"] as Record<string, { hand_force: [number, number] }>)["lamp"]!
      .hand_force;
    // the pivoting link's law with the cord force as built and after a year (values from memory)
    expect(builtHand[1]).toBeCloseTo(Math.max(...forces(1)), 4);
    expect(aged.payloads["lamp"]!.hand_force[0]).toBeCloseTo(Math.min(...forces(cordKept(YEAR_S))), 4);
    expect(aged.payloads["lamp"]!.hand_force[1]).toBeCloseTo(Math.max(...forces(cordKept(YEAR_S))), 4);
  });

  it("carries the aged cord's force: the relaxation rule times the force as built at each length", () => {
    const built = (json["springs"] as Record<string, { force: [number, number] }>)["cord"]!.force;
    // F(t) = F(t0) (1 - r log10(t / t0)) at every length (relaxation at a fixed stretch)
    expect(aged.springs["cord"]!.force[0]).toBeCloseTo(built[0] * cordKept(YEAR_S), 3);
    expect(aged.springs["cord"]!.force[1]).toBeCloseTo(built[1] * cordKept(YEAR_S), 3);
  });

  it("prints the aged case after the arm as built in the lines to read", () => {
    const text = resultsText(record, "si");
    expect(text).toMatch(/aged case, after 1 year[^\n]*\n  lamp +hand force/);
    expect(text.indexOf("aged case")).toBeGreaterThan(text.indexOf("springs:"));
  });

  it("a spec without an aged case has no aged section", () => {
    expect(resultsOf(corded("", 100)).json["aged"]).toBeUndefined();
  });
});

// A printed PLA boom held level at its shoulder carrying 1 kg at its end: a cantilever with a tip
// load whose material creeps.
describe("aged case: a printed boom creeps and sags", () => {
  const L = 0.3;
  const section = { shape: "rect" as const, depth: 0.02, width: 0.012 };
  function boom(aged: string, deflectionMm: number) {
    return `# Invented: a printed boom holding a 1 kg lamp, checked after a month under load.
arm "Printed boom" {
  base post {
    mass 20 kg
    footprint 400 mm x 400 mm
    point pivot (0 mm, 300 mm)
  }
  link boom {
    length ${L * 1000} mm
    section rect 20 mm x 12 mm
    material pla
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -1 deg .. 1 deg
    pin 6 mm steel_1018
  }
  payload lamp {
    mass 1 kg
    at boom.end
  }
  ${aged}
  require {
    balance 20 N
    deflection ${deflectionMm} mm
  }
}
`;
  }
  const MONTH_S = YEAR_S / 12;
  const asBuilt = analyse(boom("", 100));
  const E = asBuilt.model!.materials["pla"]!.modulus;
  const I = sectionProperties(section).secondMoment;
  // Roark 8th ed., table 8.1 case 1a: tip deflection W l^3 / (3 E I)
  const roark = (modulus: number) => (m1 * g * L ** 3) / (3 * modulus * I);
  const m1 = 1;

  it("deflection of the aged boom: Roark's cantilever with the creep modulus", () => {
    const aged = analyse(boom("aged { after 1 month }", 100));
    expect(figure(asBuilt, "lamp", "deflection under load")!.value).toBeCloseTo(roark(E), 6);
    // same formula, E times the stiffness Findley's law keeps after a month (values from memory)
    expect(figure(aged, "lamp", "deflection under load, aged 1 month")!.value).toBeCloseTo(
      roark(E * printKept(MONTH_S)),
      6,
    );
    expect(aged.readouts["boom"]!.notes.join(" ")).toMatch(/printed, so its stiffness is taken 34 % lower/);
  });

  it("stiff enough as built, too soft after a month: stiffness.deflection for the aged case", () => {
    const limitMm = ((roark(E) + roark(E * printKept(MONTH_S))) / 2) * 1000;
    const aged = analyse(boom("aged { after 1 month }", Number(limitMm.toFixed(4))));
    const found = aged.findings.filter((f) => f.code === "stiffness.deflection");
    expect(found).toHaveLength(1);
    expect(found[0]!.message).toMatch(/^Aged case, after 1 month \(printed parts 34 % less stiff\): /);
    expect(asBuilt.findings.some((f) => f.code === "stiffness.deflection")).toBe(false);
  });

  it("two findings of the arm as built at the same words each get their own aged figure", () => {
    const text = boom("aged { after 1 month }", 0.001).replace(
      "deflection 0.001 mm",
      "deflection 0.001 mm\n    tilt 0.001 deg",
    );
    const aged = analyse(text);
    for (const [code, word] of [
      ["stiffness.deflection", "deflects"],
      ["stiffness.tilt", "tilts"],
    ] as const) {
      const f = aged.findings.find((x) => x.code === code)!;
      const agedRelated = f.related.filter((r) => /^Aged case/.test(r.message));
      expect(agedRelated.map((r) => r.message.includes(word))).toEqual([true]);
    }
  });

  it("an arm with nothing that ages says so", () => {
    const text = boom("aged { after 1 year }", 0.001).replace("material pla", "material aluminium_6061_t6");
    const aged = analyse(text);
    const f = aged.findings.find((x) => x.code === "stiffness.deflection")!;
    expect(f.message).not.toMatch(/Aged case/);
    expect(f.related.some((r) => /nothing in this arm ages/.test(r.message))).toBe(true);
  });
});

// Unit factors against their exact published definitions and against mathjs, an independent
// general-purpose units library; dimension checks and display formatting.
import { describe, expect, test } from "vitest";
import * as math from "mathjs";
import { checkQuantity, parseUnit, fromSI } from "../../server/src/units/quantity";
import {
  displayUnit,
  formatFigure,
  formatFigureWithUnit,
  formatInOtherSystem,
  formatNumber,
  formatQuantity,
  inDisplayUnit,
  tableUnit,
  toTableUnit,
  unitLabel,
} from "../../server/src/units/format";
import { UNIT_SYMBOLS } from "../../server/src/units/unit-table";
import { DIMENSIONS } from "../../server/src/units/dimension";
import { closestWord, editDistance } from "../../server/src/units/did-you-mean";

const factor = (u: string): number => {
  const p = parseUnit(u);
  if (!p.ok) throw new Error(p.message);
  return p.unit.factor;
};

// Exact definitions: NIST SP 811 (2008), appendix B.8, and the SI Brochure, 9th ed.
const INCH = 0.0254; // m, exact (international yard and pound agreement 1959; NIST SP 811 B.8)
const FOOT = 12 * INCH; // 0.3048 m exact
const POUND = 0.45359237; // kg, exact (NIST SP 811 B.8)
const GN = 9.80665; // m/s^2, standard gravity (3rd CGPM 1901; SI Brochure 9th ed.)

describe("factors against the exact definitions (NIST SP 811 appendix B; SI Brochure 9th ed.)", () => {
  test("length", () => {
    // SI Brochure 9th ed., table 7 (prefixes milli 1e-3, centi 1e-2)
    expect(factor("mm")).toBe(1e-3);
    expect(factor("cm")).toBe(1e-2);
    expect(factor("m")).toBe(1);
    // NIST SP 811 B.8: inch = 2.54 E-02 m exactly; foot = 3.048 E-01 m exactly
    expect(factor("in")).toBe(INCH);
    expect(factor("ft")).toBeCloseTo(FOOT, 15);
  });
  test("mass", () => {
    expect(factor("g")).toBe(1e-3);
    expect(factor("kg")).toBe(1);
    // NIST SP 811 B.8: pound (avoirdupois) = 4.5359237 E-01 kg exactly; ounce = 1/16 lb
    expect(factor("lb")).toBe(POUND);
    expect(factor("oz")).toBeCloseTo(POUND / 16, 15);
  });
  test("force and pressure", () => {
    // NIST SP 811 B.8: pound-force = 4.448222 N (defined as lb x standard gravity)
    expect(factor("lbf")).toBeCloseTo(POUND * GN, 12);
    expect(factor("lbf")).toBeCloseTo(4.4482216152605, 12);
    expect(factor("kN")).toBe(1e3);
    // NIST SP 811 B.8: psi = 6.894757 E+03 Pa (lbf / in^2)
    expect(factor("psi")).toBeCloseTo((POUND * GN) / (INCH * INCH), 8);
    expect(factor("psi") / 6.894757e3).toBeCloseTo(1, 6);
    expect(factor("ksi")).toBeCloseTo((1000 * POUND * GN) / (INCH * INCH), 5);
    expect(factor("MPa")).toBe(1e6);
    expect(factor("GPa")).toBe(1e9);
  });
  test("angle: 1 deg = pi/180 rad (SI Brochure 9th ed., table 8)", () => {
    expect(factor("deg")).toBe(Math.PI / 180);
    expect(factor("rad")).toBe(1);
  });
  test("derived values quoted in docs/formulas.md (NIST SP 811)", () => {
    // 1 lbf/in = 175.1268 N/m; 1 lbf in = 0.1129848 N m; 1 kpsi = 6.894757 MPa
    expect(factor("lbf/in")).toBeCloseTo(175.1268, 3);
    expect(factor("lbf*in")).toBeCloseTo(0.1129848, 7);
    expect(factor("ksi") / 1e6).toBeCloseTo(6.894757, 6);
  });
});

describe("every unit of docs/language.md against mathjs", () => {
  // mathjs has no ksi or Mpsi: those are compared through psi.
  const units = [
    "mm",
    "cm",
    "m",
    "in",
    "ft",
    "g",
    "kg",
    "lb",
    "oz",
    "N",
    "kN",
    "lbf",
    "N*m",
    "N*mm",
    "lbf*in",
    "lbf*ft",
    "N/mm",
    "N/m",
    "lbf/in",
    "N*m/rad",
    "N*mm/deg",
    "lbf*in/deg",
    "deg",
    "rad",
    "Pa",
    "kPa",
    "MPa",
    "GPa",
    "psi",
    "g/cm^3",
    "kg/m^3",
    "lb/in^3",
    "m/s^2",
    "Hz",
    "mm^2",
    "cm^2",
    "m^2",
    "in^2",
  ];
  for (const u of units) {
    test(u, () => {
      const ours = factor(u);
      const theirs = math.unit(1, u).toSI().toNumber();
      // mathjs rounds some constants (its psi differs from the exact value by about 1e-10).
      expect(ours / theirs).toBeCloseTo(1, 9);
    });
  }
  test("ksi and Mpsi through psi", () => {
    expect(factor("ksi") / (1e3 * math.unit(1, "psi").toSI().toNumber())).toBeCloseTo(1, 9);
    expect(factor("Mpsi") / (1e6 * math.unit(1, "psi").toSI().toNumber())).toBeCloseTo(1, 9);
  });
});

describe("dimensions", () => {
  test("each language unit has the dimension its table says", () => {
    const dimOf = (u: string) => {
      const p = parseUnit(u);
      if (!p.ok) throw new Error(p.message);
      return p.unit.dimension;
    };
    expect(dimOf("N/mm")).toEqual(DIMENSIONS.stiffness);
    expect(dimOf("lbf*in/deg")).toEqual(DIMENSIONS.angular_stiffness);
    expect(dimOf("N*m")).toEqual(DIMENSIONS.torque);
    expect(dimOf("g/cm^3")).toEqual(DIMENSIONS.density);
    expect(dimOf("m/s^2")).toEqual(DIMENSIONS.acceleration);
    expect(dimOf("mm^2")).toEqual(DIMENSIONS.area);
    expect(dimOf("psi")).toEqual(DIMENSIONS.pressure);
    expect(dimOf("Hz")).toEqual(DIMENSIONS.frequency);
  });
  test("every symbol in the table parses", () => {
    for (const s of UNIT_SYMBOLS.keys()) expect(parseUnit(s).ok).toBe(true);
  });
});

describe("checking a quantity against a property", () => {
  test("wrong dimension says what was expected and what was got", () => {
    const r = checkQuantity("mass", 30, "30", "mm", ["mass"]);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problem).toBe("unit.wrong-dimension");
      expect(r.message).toBe("mass expects a mass, got a length: 30 mm");
    }
  });
  test("a missing unit suggests the usual one", () => {
    const r = checkQuantity("length", 250, "250", undefined, ["length"]);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problem).toBe("unit.missing");
      expect(r.suggestion).toBe("250 mm");
    }
  });
  test("an unknown unit gets a did-you-mean", () => {
    const r = checkQuantity("mass", 30, "30", "gr", ["mass"]);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problem).toBe("unit.unknown");
      expect(r.message).toContain("did you mean g?");
    }
    const c = checkQuantity("rate", 3, "3", "N/mn", ["stiffness"]);
    expect(!c.ok && c.message).toContain("did you mean mm?");
  });
  test("plain numbers take no unit; a second `/` is refused", () => {
    expect(checkQuantity("coils", 20, "20", undefined, ["dimensionless"])).toMatchObject({
      ok: true,
      valueSI: 20,
    });
    expect(checkQuantity("coils", 20, "20", "mm", ["dimensionless"]).ok).toBe(false);
    expect(parseUnit("N/m/s").ok).toBe(false);
  });
  test("one of several dimensions (torsion preload: angle or torque)", () => {
    const r = checkQuantity("preload", 90, "90", "deg", ["angle", "torque"]);
    expect(r).toMatchObject({ ok: true, dimension: "angle" });
    if (r.ok) expect(r.valueSI).toBeCloseTo(Math.PI / 2, 15);
  });
  test("fromSI inverts the factor", () => {
    // 175.1268 N/m = 1 lbf/in (NIST SP 811 derived)
    expect(fromSI(175.12683524647636, "lbf/in")).toBeCloseTo(1, 12);
  });
});

describe("display", () => {
  test("the worked examples of the conventions", () => {
    expect(formatQuantity(12.4, "torque", "si")).toBe("12.4 N*m");
    // 12.4 N*m / (0.45359237 x 9.80665 x 0.0254 N*m per lbf*in) = 109.75 lbf*in
    const lbfIn = 0.45359237 * 9.80665 * 0.0254;
    expect(formatQuantity(12.4, "torque", "us")).toBe(`${Number((12.4 / lbfIn).toPrecision(4))} lbf*in`);
    expect(formatQuantity(12.4, "torque", "us")).toBe("109.7 lbf*in");
  });
  test("units by size and system", () => {
    expect(formatQuantity(0.35, "length", "si")).toBe("350 mm");
    expect(formatQuantity(0.6, "mass", "si")).toBe("600 g");
    expect(formatQuantity(3.5, "mass", "si")).toBe("3.5 kg");
    expect(formatQuantity(0.0254, "length", "us")).toBe("1 in");
    expect(formatQuantity(0.45359237 / 2, "mass", "us")).toBe("8 oz");
    expect(formatQuantity(300, "stiffness", "si")).toBe("0.3 N/mm");
    expect(formatQuantity(276e6, "pressure", "si")).toBe("276 MPa");
    expect(formatQuantity(276e6, "pressure", "us")).toBe(
      `${Number((276e6 / (1000 * 6894.757293168361)).toPrecision(4))} ksi`,
    );
    expect(formatQuantity(Math.PI / 6, "angle", "si")).toBe("30 deg");
    expect(formatQuantity(2.5, "dimensionless", "si")).toBe("2.5");
  });
  test("tables keep one unit per dimension whatever the size; reading switches", () => {
    // 0.25 kg: 250 g to read, 0.25 kg in a table column headed kg.
    expect(displayUnit("mass", "si", 0.25).symbol).toBe("g");
    expect(tableUnit("mass", "si")).toBe("kg");
    expect(toTableUnit(0.25, "mass", "si")).toBe(0.25);
    // 0.25 kg = 0.25 / 0.45359237 lb = 8.818 oz to read; lb in a table (NIST SP 811 appendix B).
    expect(displayUnit("mass", "us", 0.25).symbol).toBe("oz");
    expect(toTableUnit(0.25, "mass", "us")).toBeCloseTo(0.25 / 0.45359237, 12);
    // 200 GPa reads in GPa; a table of stresses stays in MPa.
    expect(displayUnit("pressure", "si", 200e9).symbol).toBe("GPa");
    expect(toTableUnit(200e9, "pressure", "si")).toBeCloseTo(200e3, 6);
    // Every other dimension reads in its table unit.
    for (const system of ["si", "us"] as const)
      for (const d of Object.keys(DIMENSIONS) as (keyof typeof DIMENSIONS)[])
        if (d !== "mass" && d !== "pressure")
          expect(displayUnit(d, system, 1).symbol).toBe(tableUnit(d, system));
  });
  test("figures for tables and drawings, units set for reading", () => {
    // 12.4 N*m to three digits; in lbf*in, 12.4 / (0.45359237 x 9.80665 x 0.0254) = 109.75.
    expect(formatFigureWithUnit(12.4, "torque", "si")).toBe("12.4 N·m");
    expect(formatFigure(12.4, "torque", "us")).toBe("110");
    expect(inDisplayUnit(Math.PI / 6, "angle", "si")).toBeCloseTo(30, 12);
    expect(unitLabel("area", "si")).toBe("mm²");
    expect(formatFigure(NaN, "force", "si")).toBe("–");
  });
  test("the other system for hovers", () => {
    expect(formatInOtherSystem(0.0254, "length", "mm")).toBe("1 in");
    expect(formatInOtherSystem(0.0254, "length", "in")).toBe("25.4 mm");
    expect(formatInOtherSystem(Math.PI, "angle", "deg")).toBeUndefined();
  });
  test("numbers", () => {
    expect(formatNumber(0)).toBe("0");
    expect(formatNumber(12345.6)).toBe("12346");
    expect(formatNumber(0.000123456)).toBe("0.0001235");
    expect(formatNumber(1.23456e-9)).toBe("1.235e-9");
    expect(formatNumber(-40)).toBe("-40");
  });
});

describe("did you mean", () => {
  test("edit distance (Levenshtein, with transpositions)", () => {
    expect(editDistance("kitten", "sitting")).toBe(3);
    expect(editDistance("plaa", "pla")).toBe(1);
    expect(editDistance("ab", "ba")).toBe(1);
  });
  test("closest word", () => {
    expect(closestWord("plaa", ["pla", "petg", "abs"])).toBe("pla");
    expect(closestWord("zzzzzz", ["pla", "petg"])).toBeUndefined();
    expect(closestWord("MM", ["mm", "m"])).toBe("mm");
  });
});

describe("display round trip", () => {
  // What formatQuantity shows reads back (through the same unit table) to the value within the
  // four significant figures it keeps.
  const dims = [
    "length",
    "area",
    "mass",
    "force",
    "torque",
    "stiffness",
    "angular_stiffness",
    "angle",
    "pressure",
    "density",
    "acceleration",
    "frequency",
  ] as const;
  for (const dim of dims) {
    for (const system of ["si", "us"] as const) {
      test(`${dim} in ${system}`, () => {
        for (const v of [1e-3, 0.0427, 0.5, 1, 3.3, 276e6, 7850]) {
          const shown = formatQuantity(v, dim, system);
          const [num, unit] = shown.split(" ");
          const parsed = parseUnit(unit!);
          expect(parsed.ok, shown).toBe(true);
          if (!parsed.ok) continue;
          const back = Number(num) * parsed.unit.factor;
          // 4 significant figures round to within 5e-4 relative; large values are whole numbers.
          expect(Math.abs(back - v) / v, shown).toBeLessThan(5e-4);
        }
      });
    }
  }
});

describe("suggestions for half-typed words", () => {
  test("suggests the one candidate a half-typed word begins, and nothing for short or shared prefixes", () => {
    expect(closestWord("extens", ["extension", "elastic", "rate"])).toBe("extension");
    // `e` and `ex` are too short to stand for a word; `free` begins two candidates.
    expect(closestWord("ex", ["extension", "elastic"])).toBeUndefined();
    expect(closestWord("free", ["free_length", "free_angle"])).toBeUndefined();
  });
});

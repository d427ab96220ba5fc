// The built-in materials against the values docs/materials.md quotes from their sources.
import { describe, expect, test } from "vitest";
import { builtinMaterials, LAYER_STRENGTH_FRACTION } from "../../server/src/model/materials";

const m = builtinMaterials();
const GPa = 1e9,
  MPa = 1e6,
  gcc = 1000;

describe("built-in materials", () => {
  test("every material of docs/language.md is there, with a source", () => {
    for (const id of [
      "pla",
      "petg",
      "abs",
      "nylon",
      "pa12",
      "aluminium_6061_t6",
      "steel_1018",
      "stainless_304",
      "music_wire",
      "hard_drawn_wire",
      "natural_latex",
    ]) {
      expect(m[id], id).toBeDefined();
      expect(m[id]!.source!.length).toBeGreaterThan(20);
      expect(m[id]!.builtin).toBe(true);
    }
  });
  test("metals", () => {
    // AISI 1018 cold drawn: yield 370 MPa (Shigley table A-20); E 207 GPa (Shigley table A-5)
    expect(m.steel_1018!.strength).toBe(370 * MPa);
    expect(m.steel_1018!.modulus).toBe(207 * GPa);
    // 6061-T6 typical: yield 276 MPa, E 68.9 GPa, 2.70 g/cm^3 (ASM Handbook vol. 2, from memory)
    expect(m.aluminium_6061_t6!.strength).toBe(276 * MPa);
    expect(m.aluminium_6061_t6!.modulus).toBeCloseTo(68.9 * GPa, 0);
    expect(m.aluminium_6061_t6!.density).toBeCloseTo(2.7 * gcc, 9);
    // 304 annealed: yield >= 205 MPa (ASTM A240 minimum, from memory)
    expect(m.stainless_304!.strength).toBe(205 * MPa);
  });
  test("spring wire moduli (Shigley table 10-5)", () => {
    expect(m.music_wire!.modulus).toBe(200 * GPa);
    expect(m.music_wire!.shearModulus).toBeCloseTo(81.7 * GPa, 0);
    // Hard-drawn A227: E 28.7 Mpsi, G 11.6 Mpsi; 1 psi = lbf / in^2 (NIST SP 811)
    const psi = (0.45359237 * 9.80665) / 0.0254 ** 2;
    expect(m.hard_drawn_wire!.modulus / (28.7e6 * psi)).toBeCloseTo(1, 12);
    expect(m.hard_drawn_wire!.shearModulus / (11.6e6 * psi)).toBeCloseTo(1, 12);
  });
  test("printed plastics (Tymrak et al. 2014; Ozen et al. 2021; from memory)", () => {
    expect(m.pla!.density).toBeCloseTo(1.24 * gcc, 9);
    expect(m.pla!.modulus).toBeCloseTo(3.37 * GPa, 0);
    expect(m.pla!.strength).toBeCloseTo(56.6 * MPa, 0);
    expect(m.abs!.strength).toBeCloseTo(28.5 * MPa, 0);
    // PETG tensile 40-50 MPa: the low end is taken
    expect(m.petg!.strength).toBe(40 * MPa);
  });
  test("printed materials carry a layer strength of 0.5 x in-plane (Ahn et al. 2002, conservative default)", () => {
    expect(LAYER_STRENGTH_FRACTION).toBe(0.5);
    for (const mat of Object.values(m)) {
      if (mat.printed) expect(mat.layerStrength).toBeCloseTo(0.5 * mat.strength, 6);
      else expect(mat.layerStrength).toBeUndefined();
    }
    expect(m.pla!.printed && m.petg!.printed && m.abs!.printed && m.nylon!.printed && m.pa12!.printed).toBe(
      true,
    );
  });
  test("natural latex: small-strain E = 3 G (Treloar, 3rd ed.)", () => {
    expect(m.natural_latex!.shearModulus).toBeCloseTo(0.4 * MPa, 6);
    expect(m.natural_latex!.modulus).toBeCloseTo(3 * m.natural_latex!.shearModulus, 6);
  });
  test("shear modulus from E and Poisson where not given: G = E / (2 (1 + nu))", () => {
    expect(m.steel_1018!.shearModulus).toBeCloseTo(
      m.steel_1018!.modulus / (2 * (1 + m.steel_1018!.poisson)),
      0,
    );
  });
  test("each call gives fresh copies", () => {
    const a = builtinMaterials();
    a.pla!.density = 1;
    expect(builtinMaterials().pla!.density).toBeCloseTo(1240, 9);
  });
  test("bearing balls: ISO 76 contact stress for bearing steel; the ring-crack rule for glass", () => {
    // ISO 76: a ball bearing's static rating C0 is the load giving 4200 MPa at the centre of the
    // most loaded contact
    expect(m.chrome_steel!.contactStrength).toBe(4200 * MPa);
    // Johnson, Contact Mechanics, sections 3.4 and 4.2: the surface tension at the contact's edge is
    // (1 - 2 nu) p0 / 3; the allowable p0 brings it to the tensile strength
    const glass = m.soda_lime_glass!;
    expect(((1 - 2 * glass.poisson) * glass.contactStrength!) / 3).toBeCloseTo(glass.strength, 0);
    for (const id of ["stainless_440c", "acetal", "nylon_66", "ptfe"]) expect(m[id], id).toBeDefined();
  });
  test("bolt property classes (ISO 898-1, ISO 3506-1; from memory)", () => {
    // ISO 898-1, class 8.8 up to 16 mm: proof 580, yield 640, tensile 800 MPa
    expect(m.steel_8_8!.proofStrength).toBe(580 * MPa);
    expect(m.steel_8_8!.strength).toBe(640 * MPa);
    expect(m.steel_8_8!.ultimateStrength).toBe(800 * MPa);
    // the class number is the tensile strength / 100 MPa and the fraction the yield ratio:
    // 4.6 -> 400 MPa and 0.6 x 400; 10.9 -> 1000 (1040 minimum) and 0.9 x 1000 (940 minimum)
    expect(m.steel_4_6!.ultimateStrength).toBe(400 * MPa);
    expect(m.steel_4_6!.strength).toBe(0.6 * 400 * MPa);
    expect(m.steel_10_9!.strength).toBeGreaterThanOrEqual(0.9 * 1000 * MPa);
    expect(m.steel_12_9!.strength).toBeGreaterThanOrEqual(0.9 * 1200 * MPa);
    // ISO 3506-1: A2-70 tensile 700, 0.2 % yield 450 MPa
    expect(m.stainless_a2_70!.ultimateStrength).toBe(700 * MPa);
    expect(m.stainless_a2_70!.strength).toBe(450 * MPa);
    for (const mat of Object.values(m))
      if (mat.proofStrength !== undefined) {
        expect(mat.proofStrength).toBeLessThanOrEqual(mat.strength);
        expect(mat.strength).toBeLessThan(mat.ultimateStrength!);
      }
  });
  test("adhesives: strength is the lap shear, with the peel caution", () => {
    for (const id of [
      "epoxy",
      "cyanoacrylate",
      "structural_acrylic",
      "polyurethane_glue",
      "wood_glue",
      "hot_melt",
      "silicone_sealant",
    ]) {
      expect(m[id]!.source).toMatch(/peel/);
      expect(m[id]!.strength).toBeLessThanOrEqual(30 * MPa);
    }
    // makers' typical two-part epoxy on abraded metal: 15-30 MPa, low end (from memory)
    expect(m.epoxy!.strength).toBe(15 * MPa);
  });
});

// The built-in material library: typical values, each with its published source (docs/materials.md
// lists them all). SI: kg/m^3, Pa. Values marked "from memory" were not checked against the source
// here. Strength ranges take the low end (a check should not be optimistic), modulus ranges the middle.
import type { Material } from "./types";
import { gradeTensileStrength, wireGrade } from "./spring-wire";
import { HARDWARE_ENTRIES } from "./hardware-materials";

/** Printed parts loaded across their layers keep about 40-80 % of the in-plane strength; 0.5 is a
 * conservative default (Ahn et al., Rapid Prototyping J. 8(4), 2002; reviews Gordelier et al. 2019,
 * Cuan-Urquizo et al. 2019; the percentages from memory). */
export const LAYER_STRENGTH_FRACTION = 0.5;

/** Poisson's ratio when a declared material gives none (common value for metals and many plastics,
 * no source; language reference documents it). */
export const DEFAULT_POISSON = 0.3;

const GPa = 1e9;
const MPa = 1e6;
const gPerCm3 = 1000;
/** 1 psi in Pa, exact from lbf and in (NIST SP 811 B.8). */
const PSI = (0.45359237 * 9.80665) / (0.0254 * 0.0254);

/** One library material as written here; toMaterial fills in the derived values. */
export interface Entry {
  id: string;
  density: number;
  modulus: number;
  poisson: number;
  shearModulus?: number;
  strength: number;
  printed: boolean;
  contactStrength?: number;
  proofStrength?: number;
  ultimateStrength?: number;
  source: string;
}

/** A spring wire's library strength: S_ut = A / d^m at d = 1 mm (spring-wire.ts); the checks use
 * the wire's own size. */
function wireStrengthAt1mm(id: string): number {
  return gradeTensileStrength(wireGrade(id)!, 0.001).strength;
}

/** A spring wire's entry from Shigley table 10-5 (E, G in Mpsi) and table 10-4 (strength). */
function wireEntry(id: string, eMpsi: number, gMpsi: number, density: number, source: string): Entry {
  return {
    id,
    density,
    modulus: eMpsi * 1e6 * PSI,
    poisson: eMpsi / (2 * gMpsi) - 1,
    shearModulus: gMpsi * 1e6 * PSI,
    strength: wireStrengthAt1mm(id),
    printed: false,
    source,
  };
}

const BASIC_ENTRIES: Entry[] = [
  {
    id: "pla",
    density: 1.24 * gPerCm3,
    modulus: 3.37 * GPa,
    poisson: 0.36,
    strength: 56.6 * MPa,
    printed: true,
    source:
      "Printed PLA, in plane: density, E and mean tensile strength from Tymrak, Kreiger and Pearce, Materials & Design 58, 2014 (from memory); Poisson's ratio from memory.",
  },
  {
    id: "petg",
    density: 1.27 * gPerCm3,
    modulus: 2.0 * GPa,
    poisson: 0.38,
    strength: 40 * MPa,
    printed: true,
    source:
      "Printed PETG, in plane: E 1.9-2.1 GPa (middle taken), tensile 40-50 MPa (low end taken), Ozen et al., Materials 14:2556, 2021 (from memory); Poisson's ratio from memory.",
  },
  {
    id: "abs",
    density: 1.04 * gPerCm3,
    modulus: 1.81 * GPa,
    poisson: 0.35,
    strength: 28.5 * MPa,
    printed: true,
    source:
      "Printed ABS, in plane: Tymrak, Kreiger and Pearce, Materials & Design 58, 2014 (from memory); Poisson's ratio from memory.",
  },
  {
    id: "nylon",
    density: 1.13 * gPerCm3,
    modulus: 2.0 * GPa,
    poisson: 0.39,
    strength: 50 * MPa,
    printed: true,
    source:
      "Printed PA6, dry: E 1.5-2.5 GPa (middle), tensile 50-70 MPa (low end), 30-50 % lower when moist; Lay et al., Compos. B 176, 2019 (from memory); Poisson's ratio from memory.",
  },
  {
    id: "pa12",
    density: 1.01 * gPerCm3,
    modulus: 1.5 * GPa,
    poisson: 0.4,
    strength: 35 * MPa,
    printed: true,
    source: "Printed PA12: E 1.2-1.8 GPa (middle), tensile 35-50 MPa (low end); from memory.",
  },
  {
    id: "aluminium_6061_t6",
    density: 2.7 * gPerCm3,
    modulus: 68.9 * GPa,
    poisson: 0.33,
    strength: 276 * MPa,
    printed: false,
    source:
      "Aluminium 6061-T6, typical: yield 276 MPa (ultimate 310), E 68.9 GPa, ASM Handbook vol. 2 (from memory).",
  },
  {
    id: "steel_1018",
    density: 7.87 * gPerCm3,
    modulus: 207 * GPa,
    poisson: 0.292,
    strength: 370 * MPa,
    printed: false,
    source:
      "AISI 1018 cold drawn: yield 370 MPa (ultimate 440), Shigley table A-20; E 207 GPa and Poisson's ratio 0.292, Shigley table A-5.",
  },
  {
    id: "stainless_304",
    density: 8.0 * gPerCm3,
    modulus: 193 * GPa,
    poisson: 0.29,
    strength: 205 * MPa,
    printed: false,
    source:
      "Stainless 304 annealed: yield >= 205 MPa (ultimate >= 515), ASTM A240 minimums (from memory); E 193 GPa; Poisson's ratio from memory.",
  },
  {
    id: "music_wire",
    density: 7.85 * gPerCm3,
    modulus: 200.0 * GPa,
    poisson: 200.0 / (2 * 81.7) - 1,
    shearModulus: 81.7 * GPa,
    strength: wireStrengthAt1mm("music_wire"),
    printed: false,
    source:
      "Music wire ASTM A228: E 200.0 GPa and G 81.7 GPa for 0.033-0.063 in wire, Shigley table 10-5; strength is S_ut = A / d^m at d = 1 mm, A = 2211 MPa mm^m, m = 0.145, Shigley table 10-4 (the checks use the wire's own size); density from memory.",
  },
  wireEntry(
    "hard_drawn_wire",
    28.7,
    11.6,
    7.85 * gPerCm3,
    "Hard-drawn wire ASTM A227: E 28.7 Mpsi and G 11.6 Mpsi for 0.033-0.063 in wire, Shigley table 10-5; strength is S_ut = A / d^m at d = 1 mm, A = 1783 MPa mm^m, m = 0.190, Shigley table 10-4 (from memory; the checks use the wire's own size); density from memory.",
  ),
  wireEntry(
    "oil_tempered_wire",
    28.5,
    11.2,
    7.85 * gPerCm3,
    "Oil-tempered wire ASTM A229: E 28.5 Mpsi, G 11.2 Mpsi, Shigley table 10-5; strength is S_ut = A / d^m at d = 1 mm, A = 1855 MPa mm^m, m = 0.187, Shigley table 10-4 (from memory; the checks use the wire's own size); density from memory.",
  ),
  wireEntry(
    "chrome_vanadium_wire",
    29.5,
    11.2,
    7.85 * gPerCm3,
    "Chrome-vanadium wire ASTM A232: E 29.5 Mpsi, G 11.2 Mpsi, Shigley table 10-5; strength is S_ut = A / d^m at d = 1 mm, A = 2005 MPa mm^m, m = 0.168, Shigley table 10-4 (from memory; the checks use the wire's own size); density from memory.",
  ),
  wireEntry(
    "chrome_silicon_wire",
    29.5,
    11.2,
    7.85 * gPerCm3,
    "Chrome-silicon wire ASTM A401: E 29.5 Mpsi, G 11.2 Mpsi, Shigley table 10-5; strength is S_ut = A / d^m, A = 1974 MPa mm^m, m = 0.108, Shigley table 10-4 for 1.6-9.5 mm wire, shown at d = 1 mm (from memory; the checks use the wire's own size); density from memory.",
  ),
  wireEntry(
    "stainless_302_wire",
    28.0,
    10.0,
    7.92 * gPerCm3,
    "Stainless 302 wire ASTM A313: E 28.0 Mpsi, G 10.0 Mpsi, Shigley table 10-5; strength is S_ut = A / d^m at d = 1 mm with A and m by size (0.3-2.5 mm: 1867, 0.146; 2.5-5 mm: 2065, 0.263; 5-10 mm: 2911, 0.478), Shigley table 10-4 (from memory; the checks use the wire's own size); density from memory.",
  ),
  wireEntry(
    "phosphor_bronze_wire",
    15.0,
    6.0,
    8.86 * gPerCm3,
    "Phosphor-bronze wire ASTM B159: E 15.0 Mpsi, G 6.0 Mpsi, Shigley table 10-5; strength is S_ut = A / d^m at d = 1 mm with A and m by size (0.1-0.6 mm: 1000, 0; 0.6-2 mm: 913, 0.028; 2-7.5 mm: 932, 0.064), Shigley table 10-4 (from memory; the checks use the wire's own size); density from memory.",
  ),
  {
    id: "natural_latex",
    density: 0.93 * gPerCm3,
    modulus: 3 * 0.4 * MPa,
    poisson: 0.5,
    shearModulus: 0.4 * MPa,
    strength: 20 * MPa,
    printed: false,
    source:
      "Natural latex rubber: shear modulus 0.40 MPa (typical 0.3-0.6 MPa) for the neo-Hookean law, small-strain E = 3 G, Treloar, The Physics of Rubber Elasticity, 3rd ed., 1975 (values from memory); density and tensile strength from memory. Rubber creeps and relaxes.",
  },
];

const ENTRIES: Entry[] = [...BASIC_ENTRIES, ...HARDWARE_ENTRIES];

function toMaterial(e: Entry): Material {
  return {
    id: e.id,
    density: e.density,
    modulus: e.modulus,
    poisson: e.poisson,
    shearModulus: e.shearModulus ?? e.modulus / (2 * (1 + e.poisson)),
    strength: e.strength,
    ...(e.printed ? { layerStrength: LAYER_STRENGTH_FRACTION * e.strength } : {}),
    printed: e.printed,
    ...(e.contactStrength !== undefined ? { contactStrength: e.contactStrength } : {}),
    ...(e.proofStrength !== undefined ? { proofStrength: e.proofStrength } : {}),
    ...(e.ultimateStrength !== undefined ? { ultimateStrength: e.ultimateStrength } : {}),
    builtin: true,
    source: e.source,
  };
}

/** Fresh copies each call, so a model can never alter the library. */
export function builtinMaterials(): Record<string, Material> {
  return Object.fromEntries(ENTRIES.map((e) => [e.id, toMaterial(e)]));
}

export const BUILTIN_MATERIAL_IDS: readonly string[] = ENTRIES.map((e) => e.id);

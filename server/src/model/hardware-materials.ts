// Built-in materials for the hardware that joins and carries an arm: bearing balls, bolt and screw
// property classes, adhesives. Same form and rules as materials.ts (which merges them into the
// library); docs/materials.md lists every value with its source. SI: kg/m^3, Pa.
import type { Entry } from "./materials";

const GPa = 1e9;
const MPa = 1e6;
const gPerCm3 = 1000;

/** Peak Hertz pressure at the centre of the most loaded ball contact that ISO 76 takes as a ball
 * bearing's basic static load rating C0 (4200 MPa; 4600 MPa for self-aligning ball bearings). */
export const ISO76_BALL_CONTACT_STRESS = 4200 * MPa;

/** A brittle ball first cracks where the surface tension is largest, at the edge of the contact:
 * sigma_r = (1 - 2 nu) p0 / 3 under the Hertz pressure (Johnson, Contact Mechanics, 1985, sections
 * 3.4 and 4.2; the ring crack). The allowable peak pressure brings that stress to the tensile
 * strength. */
function brittleContactStrength(tensileStrength: number, poisson: number): number {
  return (3 * tensileStrength) / (1 - 2 * poisson);
}

const SODA_LIME_TENSILE = 50 * MPa;
const SODA_LIME_POISSON = 0.22;

function boltClass(
  id: string,
  proofMpa: number,
  yieldMpa: number,
  ultimateMpa: number,
  stainless: boolean,
  source: string,
): Entry {
  return {
    id,
    density: (stainless ? 7.9 : 7.85) * gPerCm3,
    modulus: (stainless ? 193 : 207) * GPa,
    poisson: stainless ? 0.29 : 0.292,
    strength: yieldMpa * MPa,
    proofStrength: proofMpa * MPa,
    ultimateStrength: ultimateMpa * MPa,
    printed: false,
    source,
  };
}

const ISO898 = "ISO 898-1 minimum values (from memory; Shigley table 8-11 lists the same classes)";
const ISO3506 =
  "ISO 3506-1 minimum values (from memory); no proof load in that standard, so the proof strength is taken at the 0.2 % yield";
const STEEL_E = "E 207 GPa and Poisson 0.292 as carbon steel (Shigley table A-5); density from memory";
const STAINLESS_E = "E 193 GPa (as stainless 304); Poisson and density from memory";

/** Adhesives: `strength` is the lap-shear strength (single-lap test, ISO 4587 / ASTM D1002 kind),
 * the low end of makers' typical figures (from memory). Density and modulus matter to nothing
 * but complete the entry (from memory). */
function adhesive(
  id: string,
  lapShearMpa: number,
  density: number,
  modulusGpa: number,
  source: string,
): Entry {
  return {
    id,
    density: density * gPerCm3,
    modulus: modulusGpa * GPa,
    poisson: 0.4,
    strength: lapShearMpa * MPa,
    printed: false,
    source: `${source} Lap-shear figures are averages over a short overlap; a joint loaded in peel or cleavage fails at a small fraction of them.`,
  };
}

export const HARDWARE_ENTRIES: Entry[] = [
  // Balls and races
  {
    id: "chrome_steel",
    density: 7.81 * gPerCm3,
    modulus: 208 * GPa,
    poisson: 0.3,
    strength: 2000 * MPa,
    contactStrength: ISO76_BALL_CONTACT_STRESS,
    printed: false,
    source:
      "Through-hardened bearing steel AISI 52100 / 100Cr6 (bearing balls and races): E 208 GPa, Poisson 0.3, density 7.81 g/cm^3 (Harris, Rolling Bearing Analysis; from memory), yield about 2000 MPa (from memory); allowable contact pressure 4200 MPa, the stress ISO 76 takes as a ball bearing's static rating.",
  },
  {
    id: "stainless_440c",
    density: 7.8 * gPerCm3,
    modulus: 200 * GPa,
    poisson: 0.28,
    strength: 1900 * MPa,
    printed: false,
    source:
      "Hardened stainless AISI 440C (stainless bearing balls), hardened and tempered at about 315 C: yield about 1900 MPa, E 200 GPa (ASM Handbook vol. 1; from memory); Poisson and density from memory. Contact allowable by the first-yield rule.",
  },
  {
    id: "soda_lime_glass",
    density: 2.5 * gPerCm3,
    modulus: 72 * GPa,
    poisson: SODA_LIME_POISSON,
    strength: SODA_LIME_TENSILE,
    contactStrength: brittleContactStrength(SODA_LIME_TENSILE, SODA_LIME_POISSON),
    printed: false,
    source:
      "Soda-lime glass (glass balls): E 72 GPa, Poisson 0.22, density 2.50 g/cm^3, tensile strength of an as-made surface about 50 MPa (from memory; glass strength depends on its flaws). Contact allowable 3 S_t / (1 - 2 nu), where the ring crack at the contact's edge starts (Johnson, Contact Mechanics, section 4.2).",
  },
  {
    id: "acetal",
    density: 1.42 * gPerCm3,
    modulus: 3.1 * GPa,
    poisson: 0.35,
    strength: 65 * MPa,
    printed: false,
    source:
      "Acetal (POM homopolymer), moulded (plastic bearing balls): E 3.1 GPa, yield 65-70 MPa (low end), density 1.42 g/cm^3, makers' data sheets (from memory); Poisson from memory.",
  },
  {
    id: "nylon_66",
    density: 1.14 * gPerCm3,
    modulus: 2.0 * GPa,
    poisson: 0.39,
    strength: 50 * MPa,
    printed: false,
    source:
      "Nylon 6/6, moulded, conditioned to room humidity (plastic bearing balls): E about 2 GPa and yield about 50 MPa moist (3 GPa and 80 MPa dry), density 1.14 g/cm^3 (from memory).",
  },
  {
    id: "ptfe",
    density: 2.17 * gPerCm3,
    modulus: 0.5 * GPa,
    poisson: 0.46,
    strength: 10 * MPa,
    printed: false,
    source:
      "PTFE, moulded (plastic balls, sliding bushings): E about 0.5 GPa, yield about 10 MPa, density 2.17 g/cm^3 (from memory); PTFE creeps under steady load.",
  },
  // Bolt and screw property classes: strength is the minimum yield (lower yield or 0.2 % proof stress)
  boltClass(
    "steel_4_6",
    225,
    240,
    400,
    false,
    `Steel bolt class 4.6: proof 225, yield 240, tensile 400 MPa, ${ISO898}; ${STEEL_E}.`,
  ),
  boltClass(
    "steel_4_8",
    310,
    340,
    420,
    false,
    `Steel bolt class 4.8: proof 310, yield 340, tensile 420 MPa, ${ISO898}; ${STEEL_E}.`,
  ),
  boltClass(
    "steel_5_8",
    380,
    420,
    520,
    false,
    `Steel bolt class 5.8: proof 380, yield 420, tensile 520 MPa, ${ISO898}; ${STEEL_E}.`,
  ),
  boltClass(
    "steel_8_8",
    580,
    640,
    800,
    false,
    `Steel bolt class 8.8, d <= 16 mm: proof 580, yield 640, tensile 800 MPa, ${ISO898} (Shigley's row is for M16-M36: 600, 660, 830); ${STEEL_E}.`,
  ),
  boltClass(
    "steel_10_9",
    830,
    940,
    1040,
    false,
    `Steel bolt class 10.9: proof 830, yield 940, tensile 1040 MPa, ${ISO898}; ${STEEL_E}.`,
  ),
  boltClass(
    "steel_12_9",
    970,
    1100,
    1220,
    false,
    `Steel bolt class 12.9: proof 970, yield 1100, tensile 1220 MPa, ${ISO898}; ${STEEL_E}.`,
  ),
  boltClass(
    "stainless_a2_70",
    450,
    450,
    700,
    true,
    `Stainless bolt A2-70 (and A4-70): yield 450, tensile 700 MPa, ${ISO3506}; ${STAINLESS_E}.`,
  ),
  boltClass(
    "stainless_a4_80",
    600,
    600,
    800,
    true,
    `Stainless bolt A4-80 (and A2-80): yield 600, tensile 800 MPa, ${ISO3506}; ${STAINLESS_E}.`,
  ),
  // Adhesives: strength is the lap-shear strength
  adhesive(
    "epoxy",
    15,
    1.15,
    2.5,
    "Two-part structural epoxy, cured at room temperature: lap shear 15-30 MPa on abraded aluminium or steel (low end taken; makers' data sheets, from memory).",
  ),
  adhesive(
    "cyanoacrylate",
    15,
    1.06,
    1.5,
    "Cyanoacrylate (instant glue): lap shear 15-25 MPa on steel, often less on plastics where the surface gives first (low end taken; makers' data sheets, from memory).",
  ),
  adhesive(
    "structural_acrylic",
    15,
    1.05,
    1.0,
    "Two-part methacrylate structural adhesive: lap shear 15-25 MPa on metals and many plastics (low end taken; makers' data sheets, from memory).",
  ),
  adhesive(
    "polyurethane_glue",
    6,
    1.2,
    0.3,
    "Polyurethane adhesive: lap shear 6-12 MPa (low end taken; makers' data sheets, from memory).",
  ),
  adhesive(
    "wood_glue",
    6,
    1.1,
    0.5,
    "PVA wood glue on hardwood: lap shear taken at 6 MPa, well under the block-shear figures makers quote, where the wood itself tears (from memory).",
  ),
  adhesive(
    "hot_melt",
    1,
    0.95,
    0.05,
    "Hot-melt glue (EVA): lap shear 1-3 MPa, softening above about 50 C (low end taken; from memory).",
  ),
  adhesive(
    "silicone_sealant",
    1,
    1.1,
    0.002,
    "One-part silicone sealant (RTV): lap shear 1-2 MPa (low end taken; makers' data sheets, from memory).",
  ),
];

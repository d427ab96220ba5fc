// Spring wire strength by size, S_ut = A / d^m (Shigley's Mechanical Engineering Design, Budynas
// and Nisbett, 9th-11th ed., eq. 10-14 and table 10-4), and the share of S_ut each part of a spring
// may carry under a static load (tables 10-6 and 10-7, section 10-12). The built-in wire materials
// of materials.ts take their strength from here; a declared material uses its own `strength`.

/** Which allowables a wire takes: Shigley groups spring wires by how they are made. */
export type WireFamily =
  /** patented and cold-drawn carbon steel: music wire, hard-drawn wire */
  | "cold_drawn_carbon"
  /** hardened and tempered carbon and low-alloy steel: oil-tempered, chrome-vanadium, chrome-silicon */
  | "hardened_tempered"
  /** austenitic stainless steel and non-ferrous alloys */
  | "stainless_nonferrous";

/** One row of table 10-4: A in MPa mm^m for wire from dMinMm to dMaxMm. */
export interface WireSizeRange {
  dMinMm: number;
  dMaxMm: number;
  aMpaMm: number;
  m: number;
}

export interface WireGrade {
  /** Built-in material id. */
  id: string;
  /** Standard the wire is made to. */
  standard: string;
  family: WireFamily;
  /** Rows by increasing size; several rows where the table splits a wire by size. */
  ranges: readonly WireSizeRange[];
}

/** Shigley table 10-4 (SI columns; values from memory, each A checked against the table's inch
 * column: A_SI = A_kpsi x 6.894757 x 25.4^m agrees to 0.1 %). */
export const WIRE_GRADES: readonly WireGrade[] = [
  {
    id: "music_wire",
    standard: "ASTM A228",
    family: "cold_drawn_carbon",
    ranges: [{ dMinMm: 0.1, dMaxMm: 6.5, aMpaMm: 2211, m: 0.145 }],
  },
  {
    id: "oil_tempered_wire",
    standard: "ASTM A229",
    family: "hardened_tempered",
    ranges: [{ dMinMm: 0.5, dMaxMm: 12.7, aMpaMm: 1855, m: 0.187 }],
  },
  {
    id: "hard_drawn_wire",
    standard: "ASTM A227",
    family: "cold_drawn_carbon",
    ranges: [{ dMinMm: 0.7, dMaxMm: 12.7, aMpaMm: 1783, m: 0.19 }],
  },
  {
    id: "chrome_vanadium_wire",
    standard: "ASTM A232",
    family: "hardened_tempered",
    ranges: [{ dMinMm: 0.8, dMaxMm: 11.1, aMpaMm: 2005, m: 0.168 }],
  },
  {
    id: "chrome_silicon_wire",
    standard: "ASTM A401",
    family: "hardened_tempered",
    ranges: [{ dMinMm: 1.6, dMaxMm: 9.5, aMpaMm: 1974, m: 0.108 }],
  },
  {
    id: "stainless_302_wire",
    standard: "ASTM A313",
    family: "stainless_nonferrous",
    ranges: [
      { dMinMm: 0.3, dMaxMm: 2.5, aMpaMm: 1867, m: 0.146 },
      { dMinMm: 2.5, dMaxMm: 5, aMpaMm: 2065, m: 0.263 },
      { dMinMm: 5, dMaxMm: 10, aMpaMm: 2911, m: 0.478 },
    ],
  },
  {
    id: "phosphor_bronze_wire",
    standard: "ASTM B159",
    family: "stainless_nonferrous",
    ranges: [
      { dMinMm: 0.1, dMaxMm: 0.6, aMpaMm: 1000, m: 0 },
      { dMinMm: 0.6, dMaxMm: 2, aMpaMm: 913, m: 0.028 },
      { dMinMm: 2, dMaxMm: 7.5, aMpaMm: 932, m: 0.064 },
    ],
  },
];

export function wireGrade(id: string): WireGrade | undefined {
  return WIRE_GRADES.find((g) => g.id === id);
}

/** S_ut = A / d^m, Pa, with A in MPa mm^m and d in m (Shigley eq. 10-14). */
export function wireTensileStrengthFromTable(aMpaMm: number, m: number, wireDiameter: number): number {
  return (aMpaMm / (wireDiameter * 1000) ** m) * 1e6;
}

export interface WireStrength {
  /** Minimum tensile strength S_ut of wire this size, Pa. */
  strength: number;
  /** False when the size lies outside every row of the table: the nearest row is extrapolated. */
  inTable: boolean;
}

/** S_ut of `grade` wire of diameter `wireDiameter` (m), from the row that holds the size (the
 * smaller-size row at a shared boundary, the nearer row outside the table). */
export function gradeTensileStrength(grade: WireGrade, wireDiameter: number): WireStrength {
  const dMm = wireDiameter * 1000;
  const rows = grade.ranges;
  const inside = rows.find((r) => dMm >= r.dMinMm && dMm <= r.dMaxMm);
  const row = inside ?? (dMm < rows[0]!.dMinMm ? rows[0]! : rows[rows.length - 1]!);
  return { strength: wireTensileStrengthFromTable(row.aMpaMm, row.m, wireDiameter), inTable: !!inside };
}

/** Shares of S_ut for static loads (Shigley 9th-11th ed.; from memory):
 * - extension spring body and hook in torsion, hook in bending: table 10-7 (carbon and low-alloy
 *   steels 45, 40 and 75 %; austenitic stainless and non-ferrous 35, 30 and 55 %; the body's
 *   45-50 % taken at its low end);
 * - torsion spring wire in bending, S_y = 0.78 S_ut for music wire and cold-drawn carbon steel,
 *   0.87 for hardened and tempered carbon and low-alloy steel, 0.61 for austenitic stainless and
 *   non-ferrous (section 10-12, static strength). */
export interface WireAllowables {
  extensionBodyTorsion: number;
  extensionHookTorsion: number;
  extensionHookBending: number;
  torsionSpringBending: number;
}

const STEEL_EXTENSION = { extensionBodyTorsion: 0.45, extensionHookTorsion: 0.4, extensionHookBending: 0.75 };

export const WIRE_ALLOWABLES: Readonly<Record<WireFamily, WireAllowables>> = {
  cold_drawn_carbon: { ...STEEL_EXTENSION, torsionSpringBending: 0.78 },
  hardened_tempered: { ...STEEL_EXTENSION, torsionSpringBending: 0.87 },
  stainless_nonferrous: {
    extensionBodyTorsion: 0.35,
    extensionHookTorsion: 0.3,
    extensionHookBending: 0.55,
    torsionSpringBending: 0.61,
  },
};

/** A declared wire material is taken as a carbon spring steel (the common case; its `strength` is
 * the S_ut the user gives). */
export const DECLARED_WIRE_FAMILY: WireFamily = "cold_drawn_carbon";

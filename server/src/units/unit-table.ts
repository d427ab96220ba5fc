// The unit symbols the language knows, each with its exact factor to SI and its dimension vector.
// Factors are exact definitions: NIST SP 811 (2008), appendix B; SI Brochure, 9th ed. (2019).
import type { DimensionVector } from "./dimension";

export type UnitSystem = "si" | "us";

export interface UnitSymbol {
  symbol: string;
  /** Multiply a value in this unit by `factor` to get SI (m, kg, s, rad). */
  factor: number;
  dimension: DimensionVector;
  /** Which system a user who writes this unit works in (for "the value in the other system"). */
  system: UnitSystem | "both";
}

const dim = (mass: number, length: number, time: number, angle: number): DimensionVector => ({
  mass,
  length,
  time,
  angle,
});

const LENGTH = dim(0, 1, 0, 0);
const MASS = dim(1, 0, 0, 0);
const TIME = dim(0, 0, 1, 0);
const ANGLE = dim(0, 0, 0, 1);
const FORCE = dim(1, 1, -2, 0);
const PRESSURE = dim(1, -1, -2, 0);
const FREQUENCY = dim(0, 0, -1, 0);

/** 1 in = 0.0254 m exactly (international yard and pound agreement 1959; NIST SP 811, B.8). */
export const INCH_M = 0.0254;
/** 1 ft = 0.3048 m exactly (NIST SP 811, B.8). */
export const FOOT_M = 0.3048;
/** 1 lb (avoirdupois) = 0.45359237 kg exactly (NIST SP 811, B.8). */
export const POUND_KG = 0.45359237;
/** Standard acceleration of gravity, m/s^2 (3rd CGPM 1901; SI Brochure, 9th ed.). */
export const STANDARD_GRAVITY = 9.80665;
/** 1 lbf = 1 lb x standard gravity (NIST SP 811, B.8: 4.448222 N). */
export const POUND_FORCE_N = POUND_KG * STANDARD_GRAVITY;
/** 1 psi = 1 lbf/in^2 (NIST SP 811, B.8: 6.894757 kPa). */
export const PSI_PA = POUND_FORCE_N / (INCH_M * INCH_M);
/** 1 d = 86 400 s (SI Brochure, 9th ed., table 8). */
export const DAY_S = 86400;
/** The Julian year, 365.25 d exactly (IAU). */
export const JULIAN_YEAR_S = 365.25 * DAY_S;
/** 1 deg = pi/180 rad (SI Brochure, 9th ed., table 8). */
export const DEGREE_RAD = Math.PI / 180;

const TABLE: UnitSymbol[] = [
  { symbol: "mm", factor: 1e-3, dimension: LENGTH, system: "si" },
  { symbol: "cm", factor: 1e-2, dimension: LENGTH, system: "si" },
  { symbol: "m", factor: 1, dimension: LENGTH, system: "si" },
  { symbol: "in", factor: INCH_M, dimension: LENGTH, system: "us" },
  { symbol: "ft", factor: FOOT_M, dimension: LENGTH, system: "us" },
  { symbol: "g", factor: 1e-3, dimension: MASS, system: "si" },
  { symbol: "kg", factor: 1, dimension: MASS, system: "si" },
  { symbol: "lb", factor: POUND_KG, dimension: MASS, system: "us" },
  // 1 oz = 1/16 lb (NIST SP 811, B.8).
  { symbol: "oz", factor: POUND_KG / 16, dimension: MASS, system: "us" },
  { symbol: "s", factor: 1, dimension: TIME, system: "both" },
  { symbol: "N", factor: 1, dimension: FORCE, system: "si" },
  { symbol: "kN", factor: 1e3, dimension: FORCE, system: "si" },
  { symbol: "lbf", factor: POUND_FORCE_N, dimension: FORCE, system: "us" },
  { symbol: "deg", factor: DEGREE_RAD, dimension: ANGLE, system: "both" },
  { symbol: "rad", factor: 1, dimension: ANGLE, system: "both" },
  { symbol: "Pa", factor: 1, dimension: PRESSURE, system: "si" },
  { symbol: "kPa", factor: 1e3, dimension: PRESSURE, system: "si" },
  { symbol: "MPa", factor: 1e6, dimension: PRESSURE, system: "si" },
  { symbol: "GPa", factor: 1e9, dimension: PRESSURE, system: "si" },
  { symbol: "psi", factor: PSI_PA, dimension: PRESSURE, system: "us" },
  { symbol: "ksi", factor: 1e3 * PSI_PA, dimension: PRESSURE, system: "us" },
  // Spring wire moduli are tabulated in Mpsi (Shigley, table 10-5).
  { symbol: "Mpsi", factor: 1e6 * PSI_PA, dimension: PRESSURE, system: "us" },
  { symbol: "Hz", factor: 1, dimension: FREQUENCY, system: "both" },
  // How long a load is held (the aged case), singular and plural. Hour and day: SI Brochure, 9th
  // ed., table 8 (1 h = 3600 s, 1 d = 86 400 s); a week is 7 days; a year is the Julian year of
  // 365.25 days (IAU); a month a twelfth of it (common practice, no source).
  ...timeUnits("hour", 3600),
  ...timeUnits("day", DAY_S),
  ...timeUnits("week", 7 * DAY_S),
  ...timeUnits("month", JULIAN_YEAR_S / 12),
  ...timeUnits("year", JULIAN_YEAR_S),
];

function timeUnits(word: string, seconds: number): UnitSymbol[] {
  return [word, `${word}s`].map((symbol) => ({ symbol, factor: seconds, dimension: TIME, system: "both" }));
}

export const UNIT_SYMBOLS: ReadonlyMap<string, UnitSymbol> = new Map(TABLE.map((u) => [u.symbol, u]));

/** Whether a single word is a unit symbol the language knows (compounds are parsed by units/). */
export function isUnitSymbol(word: string): boolean {
  return UNIT_SYMBOLS.has(word);
}

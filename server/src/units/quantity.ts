// Reads a unit as written (`N/mm`, `lbf*in/deg`, `g/cm^3`) into an SI factor and a dimension, and
// checks a quantity against the dimension a property expects.
import { DIMENSIONS, DIMENSION_WITH_ARTICLE, type DimensionName, type DimensionVector } from "./dimension";
import { UNIT_SYMBOLS, type UnitSystem } from "./unit-table";
import { closestWord } from "./did-you-mean";

export interface ParsedUnit {
  /** value in this unit x factor = value in SI */
  factor: number;
  dimension: DimensionVector;
  /** "us" if any part is a US customary unit, else "si". */
  system: UnitSystem;
}

export type UnitParse = { ok: true; unit: ParsedUnit } | { ok: false; message: string; suggestion?: string };

const FACTOR_PATTERN = /^([A-Za-z_][A-Za-z0-9_]*)(?:\^([-+]?\d+))?$/;

/**
 * `a*b/c*d` reads as (a b) / (c d): every factor after the `/` is in the denominator, the usual
 * engineering reading of `N*m/rad` or `lbf*in/deg`. A second `/` is refused as ambiguous (NIST
 * SP 811, 6.1.6, advises against more than one solidus).
 */
export function parseUnit(text: string): UnitParse {
  const halves = text.split("/");
  if (halves.length > 2)
    return {
      ok: false,
      message: `unit \`${text}\` has more than one \`/\`: put the whole denominator after one \`/\`, e.g. N/m*s`,
    };
  let factor = 1;
  const dim = { mass: 0, length: 0, time: 0, angle: 0 };
  let system: UnitSystem = "si";
  for (const [h, half] of halves.entries()) {
    const sign = h === 0 ? 1 : -1;
    for (const part of half.split("*")) {
      const m = FACTOR_PATTERN.exec(part);
      if (!m) return { ok: false, message: `cannot read the unit \`${text}\`` };
      const symbol = m[1]!;
      const power = sign * (m[2] !== undefined ? Number(m[2]) : 1);
      const u = UNIT_SYMBOLS.get(symbol);
      if (!u) {
        const best = closestWord(symbol, UNIT_SYMBOLS.keys());
        const whole = text === symbol ? `\`${symbol}\`` : `\`${symbol}\` in \`${text}\``;
        return best
          ? {
              ok: false,
              message: `unknown unit ${whole}; did you mean ${best}?`,
              suggestion: text === symbol ? best : text.replace(symbol, best),
            }
          : { ok: false, message: `unknown unit ${whole}` };
      }
      factor *= u.factor ** power;
      dim.mass += u.dimension.mass * power;
      dim.length += u.dimension.length * power;
      dim.time += u.dimension.time * power;
      dim.angle += u.dimension.angle * power;
      if (u.system === "us") system = "us";
    }
  }
  return { ok: true, unit: { factor, dimension: dim, system } };
}

export function sameDimension(a: DimensionVector, b: DimensionVector): boolean {
  return a.mass === b.mass && a.length === b.length && a.time === b.time && a.angle === b.angle;
}

/** The dimension's name, if it is one of the language's. */
export function dimensionNameOf(v: DimensionVector): DimensionName | undefined {
  return (Object.keys(DIMENSIONS) as DimensionName[]).find((name) => sameDimension(DIMENSIONS[name], v));
}

/** The unit a designer usually writes for each dimension (for "missing unit, e.g. 250 mm"). */
export const USUAL_UNIT: Readonly<Record<DimensionName, string>> = {
  length: "mm",
  area: "mm^2",
  mass: "g",
  force: "N",
  torque: "N*m",
  stiffness: "N/mm",
  angular_stiffness: "N*mm/deg",
  angle: "deg",
  pressure: "MPa",
  density: "g/cm^3",
  acceleration: "m/s^2",
  frequency: "Hz",
  time: "days",
  dimensionless: "",
};

/** The unit offered for a number written without one in a spec written in US customary units. */
export const USUAL_UNIT_US: Readonly<Record<DimensionName, string>> = {
  length: "in",
  area: "in^2",
  mass: "lb",
  force: "lbf",
  torque: "lbf*in",
  stiffness: "lbf/in",
  angular_stiffness: "lbf*in/deg",
  angle: "deg",
  pressure: "psi",
  density: "lb/in^3",
  acceleration: "ft/s^2",
  frequency: "Hz",
  time: "days",
  dimensionless: "",
};

/** The usual unit of a dimension in a system. */
export function usualUnit(dimension: DimensionName, system: UnitSystem = "si"): string {
  return (system === "us" ? USUAL_UNIT_US : USUAL_UNIT)[dimension];
}

/** A pound written for a pound-force, or the other way round (`2 lb` as a force): the unit with
 * the other one, when that has a dimension the property takes. */
function poundSwap(unitText: string, expected: readonly DimensionName[]): string | undefined {
  const swapped = /\blbf\b/.test(unitText)
    ? unitText.replace(/\blbf\b/g, "lb")
    : unitText.replace(/\blb\b/g, "lbf");
  if (swapped === unitText) return undefined;
  const parsed = parseUnit(swapped);
  return parsed.ok && expected.some((d) => sameDimension(DIMENSIONS[d], parsed.unit.dimension))
    ? swapped
    : undefined;
}

export type QuantityCheck =
  | { ok: true; valueSI: number; dimension: DimensionName; system: UnitSystem | undefined }
  | {
      ok: false;
      problem: "unit.missing" | "unit.unknown" | "unit.wrong-dimension";
      message: string;
      onUnit: boolean;
      suggestion?: string;
    };

function expectation(key: string, expected: readonly DimensionName[]): string {
  return `${key} expects ${expected.map((d) => DIMENSION_WITH_ARTICLE[d]).join(" or ")}`;
}

/**
 * Checks a number and its unit as written against the dimensions a property accepts and converts
 * to SI. `key` names the property for the message ("mass expects a mass, got a length: 30 mm").
 * `system` is the one the spec is written in: a missing unit is offered in it.
 */
export function checkQuantity(
  key: string,
  value: number,
  numberText: string,
  unitText: string | undefined,
  expected: readonly DimensionName[],
  system: UnitSystem = "si",
): QuantityCheck {
  if (unitText === undefined) {
    if (expected.includes("dimensionless"))
      return { ok: true, valueSI: value, dimension: "dimensionless", system: undefined };
    const usual = usualUnit(expected[0]!, system);
    return {
      ok: false,
      problem: "unit.missing",
      message: `missing unit: ${expectation(key, expected)}, e.g. ${numberText} ${usual}`,
      onUnit: false,
      suggestion: `${numberText} ${usual}`,
    };
  }
  const parsed = parseUnit(unitText);
  if (!parsed.ok)
    return {
      ok: false,
      problem: "unit.unknown",
      message: parsed.message,
      onUnit: true,
      ...(parsed.suggestion ? { suggestion: parsed.suggestion } : {}),
    };
  const got = dimensionNameOf(parsed.unit.dimension);
  const match = expected.find((d) => sameDimension(DIMENSIONS[d], parsed.unit.dimension));
  if (!match) {
    const gotText = got ? DIMENSION_WITH_ARTICLE[got] : `a quantity in ${unitText}`;
    const swap = poundSwap(unitText, expected);
    return {
      ok: false,
      problem: "unit.wrong-dimension",
      message: `${expectation(key, expected)}, got ${gotText}: ${numberText} ${unitText}${swap ? ` (${swap.includes("lbf") ? "a pound-force is written lbf" : "a pound of mass is written lb"}: ${numberText} ${swap})` : ""}`,
      onUnit: true,
      ...(swap ? { suggestion: swap } : {}),
    };
  }
  return { ok: true, valueSI: value * parsed.unit.factor, dimension: match, system: parsed.unit.system };
}

/** A value in SI expressed in the unit written as `unitText` (e.g. for a quick fix that writes a
 * computed rate in the user's own unit); undefined if the unit cannot be read. */
export function fromSI(valueSI: number, unitText: string): number | undefined {
  const parsed = parseUnit(unitText);
  return parsed.ok ? valueSI / parsed.unit.factor : undefined;
}

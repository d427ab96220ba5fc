// Formats an SI value for display in the user's unit system, and gives the same value in the
// other system (hover: "the value in the other unit system"). The one table of display units:
// messages, hovers, inlay hints, the status bar, the preview and the report all show figures
// through it.
import type { DimensionName } from "./dimension";
import { parseUnit } from "./quantity";
import type { UnitSystem } from "./unit-table";

export interface DisplayUnit {
  symbol: string;
  /** SI value / factor = displayed value */
  factor: number;
}

/** The units of one dimension: `unit` in tables and machine-readable output (one unit for a
 * whole column, whatever the size); for reading, a smaller unit below a size or a larger one from
 * a size (sizes in SI). */
interface UnitChoice {
  unit: string;
  small?: { unit: string; belowSI: number };
  large?: { unit: string; fromSI: number };
}

const factors = new Map<string, number>();
/** SI value of one of `symbol` (1 for a unit that cannot be read, and for no unit). */
function factorOf(symbol: string): number {
  let f = factors.get(symbol);
  if (f === undefined) {
    const parsed = parseUnit(symbol);
    f = parsed.ok ? parsed.unit.factor : 1;
    factors.set(symbol, f);
  }
  return f;
}

/** The one table of the units figures are shown in, per system and dimension. SI as `poise
 * sweep` fixes them (mm, N, N*m, deg), US customary in the units a US drawing uses; masses
 * under a kilogram (a pound) read in g (oz), moduli from 10 GPa (1 ksi) in GPa (ksi). */
const UNITS: Readonly<Record<UnitSystem, Readonly<Record<DimensionName, UnitChoice>>>> = {
  si: {
    length: { unit: "mm" },
    area: { unit: "mm^2" },
    mass: { unit: "kg", small: { unit: "g", belowSI: 1 } },
    force: { unit: "N" },
    torque: { unit: "N*m" },
    stiffness: { unit: "N/mm" },
    angular_stiffness: { unit: "N*mm/deg" },
    angle: { unit: "deg" },
    // moduli read in GPa, stresses in MPa
    pressure: { unit: "MPa", large: { unit: "GPa", fromSI: 1e10 } },
    density: { unit: "g/cm^3" },
    acceleration: { unit: "m/s^2" },
    frequency: { unit: "Hz" },
    time: { unit: "days", large: { unit: "years", fromSI: factorOf("years") } },
    dimensionless: { unit: "" },
  },
  us: {
    length: { unit: "in" },
    area: { unit: "in^2" },
    mass: { unit: "lb", small: { unit: "oz", belowSI: factorOf("lb") } },
    force: { unit: "lbf" },
    torque: { unit: "lbf*in" },
    stiffness: { unit: "lbf/in" },
    angular_stiffness: { unit: "lbf*in/deg" },
    angle: { unit: "deg" },
    pressure: { unit: "psi", large: { unit: "ksi", fromSI: factorOf("ksi") } },
    density: { unit: "lb/in^3" },
    acceleration: { unit: "ft/s^2" },
    frequency: { unit: "Hz" },
    time: { unit: "days", large: { unit: "years", fromSI: factorOf("years") } },
    dimensionless: { unit: "" },
  },
};

/** The unit a value is shown in for reading; mass and pressure switch unit with size. */
export function displayUnit(dimension: DimensionName, system: UnitSystem, valueSI = 0): DisplayUnit {
  const choice = UNITS[system][dimension];
  const big = Math.abs(valueSI);
  const symbol =
    choice.small && !(big >= choice.small.belowSI)
      ? choice.small.unit
      : choice.large && big >= choice.large.fromSI
        ? choice.large.unit
        : choice.unit;
  return { symbol, factor: symbol ? factorOf(symbol) : 1 };
}

/** The unit of a dimension in tables and machine-readable output (`poise results`): the same
 * whatever the size, so a column of figures reads with one header. */
export function tableUnit(dimension: DimensionName, system: UnitSystem): string {
  return UNITS[system][dimension].unit;
}

/** An SI value in the table unit of its dimension. */
export function toTableUnit(valueSI: number, dimension: DimensionName, system: UnitSystem): number {
  const unit = tableUnit(dimension, system);
  return unit ? valueSI / factorOf(unit) : valueSI;
}

/** Significant figures shown: enough to compare designs, few enough to read at a glance
 * (common practice, no source). */
const SIGNIFICANT_FIGURES = 4;
/** From this magnitude on, whole numbers: 4 significant figures would round away digits people
 * read (12345 mm, not 1.235e+4). */
const LARGE_NUMBER = 1e4;

export function formatNumber(v: number): string {
  if (!Number.isFinite(v)) return Number.isNaN(v) ? "NaN" : v > 0 ? "infinity" : "-infinity";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= LARGE_NUMBER) return String(Math.round(v));
  return String(Number(v.toPrecision(SIGNIFICANT_FIGURES)));
}

/** e.g. formatQuantity(12.4, "torque", "si") → "12.4 N*m"; (12.4, "torque", "us") → "109.7 lbf*in". */
export function formatQuantity(valueSI: number, dimension: DimensionName, system: UnitSystem): string {
  const u = displayUnit(dimension, system, valueSI);
  const n = formatNumber(valueSI / u.factor);
  return u.symbol ? `${n} ${u.symbol}` : n;
}

/** Below this many display units a computed result shows as 0: a head turning by 2e-13 deg or
 * a residual hand force of 2e-6 N is round-off, not a figure to read (common practice, no
 * source). Values the user wrote go through formatQuantity and keep every digit. */
const RESULT_ZERO = 5e-5;

/** A computed result (readout figure, message number) for display. */
export function formatResult(valueSI: number, dimension: DimensionName, system: UnitSystem): string {
  const u = displayUnit(dimension, system, valueSI);
  const shown = valueSI / u.factor;
  const n = formatNumber(u.symbol && Math.abs(shown) < RESULT_ZERO ? 0 : shown);
  return u.symbol ? `${n} ${u.symbol}` : n;
}

export function otherSystem(system: UnitSystem): UnitSystem {
  return system === "si" ? "us" : "si";
}

/** Which system a unit as written belongs to ("us" if any part is US customary); units both
 * systems share (deg, Hz) count as SI. Undefined if the unit cannot be read. */
export function unitSystemOf(unitText: string): UnitSystem | undefined {
  const parsed = parseUnit(unitText);
  return parsed.ok ? parsed.unit.system : undefined;
}

/** The value as it reads in the other unit system than the one it was written in, for hovers;
 * undefined where both systems show the same (angles, frequencies, plain numbers). */
export function formatInOtherSystem(
  valueSI: number,
  dimension: DimensionName,
  writtenUnit: string,
): string | undefined {
  if (dimension === "angle" || dimension === "frequency" || dimension === "dimensionless") return undefined;
  const written = unitSystemOf(writtenUnit) ?? "si";
  return formatQuantity(valueSI, dimension, otherSystem(written));
}

/** A value in the unit `displayUnit` shows it in (the number a plot or table places). */
export function inDisplayUnit(valueSI: number, dimension: DimensionName, system: UnitSystem): number {
  return valueSI / displayUnit(dimension, system, valueSI).factor;
}

/** A display unit's symbol set for reading rather than typing: N·m, mm², not N*m, mm^2. */
export function unitLabel(dimension: DimensionName, system: UnitSystem, valueSI = 0): string {
  return displayUnit(dimension, system, valueSI)
    .symbol.replace(/\*/g, "·")
    .replace(/\^2/g, "²")
    .replace(/\^3/g, "³");
}

/** A plain number to about `digits` significant digits, for a table or a label ("–" when there is
 * none); from 10^digits on, whole. */
export function formatDigits(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return "–";
  if (x === 0) return "0";
  const mag = Math.floor(Math.log10(Math.abs(x)));
  const decimals = Math.max(0, Math.min(6, digits - 1 - mag));
  return x.toFixed(decimals);
}

/** A figure for a table, a plot or a drawing: the value in its display unit to about three
 * significant digits, without the unit (tables put it in the heading). */
export function formatFigure(
  valueSI: number,
  dimension: DimensionName,
  system: UnitSystem,
  digits = 3,
): string {
  return formatDigits(inDisplayUnit(valueSI, dimension, system), digits);
}

/** A figure with its unit set for reading, e.g. "12.4 N·m". */
export function formatFigureWithUnit(valueSI: number, dimension: DimensionName, system: UnitSystem): string {
  const label = unitLabel(dimension, system, valueSI);
  const n = formatFigure(valueSI, dimension, system);
  return label ? `${n} ${label}` : n;
}

/** A value in SI display units, as messages show it (mm, deg, N, N*m, N/mm...): the one "format
 * in SI" helper of the mechanics and the checks. */
export function formatSI(valueSI: number, dimension: DimensionName): string {
  return formatResult(valueSI, dimension, "si");
}

/** The system the messages of one analysis are written in (analysis.ts sets it, by default to the
 * one the spec is written in: model/written-units.ts); SI outside an analysis. One analysis runs
 * at a time in a thread and sets it around its own work only. */
let messageSystem: UnitSystem = "si";

/** Runs `work` with messages written in `system`. */
export function inMessageUnits<T>(system: UnitSystem, work: () => T): T {
  const outer = messageSystem;
  messageSystem = system;
  try {
    return work();
  } finally {
    messageSystem = outer;
  }
}

/** The system messages are being written in now. */
export function messageUnits(): UnitSystem {
  return messageSystem;
}

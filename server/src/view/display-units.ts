// Units the view shows its figures in: the view model holds mm, N and N*m; a reader who works in
// US customary units sees in, lbf and lbf*in (conventions: display units per system). Factors from
// the exact definitions in units/unit-table.ts.
import { INCH_M, POUND_FORCE_N, type UnitSystem } from "../units/unit-table";

/** shown value = view value x scale */
export interface Shown {
  symbol: string;
  scale: number;
}

export function shownForce(system: UnitSystem): Shown {
  return system === "us" ? { symbol: "lbf", scale: 1 / POUND_FORCE_N } : { symbol: "N", scale: 1 };
}

export function shownTorque(system: UnitSystem): Shown {
  return system === "us"
    ? { symbol: "lbf·in", scale: 1 / (POUND_FORCE_N * INCH_M) }
    : { symbol: "N·m", scale: 1 };
}

export function shownLength(system: UnitSystem): Shown {
  return system === "us" ? { symbol: "in", scale: 1 / (INCH_M * 1000) } : { symbol: "mm", scale: 1 };
}

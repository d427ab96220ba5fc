// Units of machine-readable output (`poise results`): one unit per dimension and system that does
// not switch with the size of the value, so a column of figures can be read with one header.
import type { DimensionName } from "./dimension";
import { fromSI } from "./quantity";
import type { UnitSystem } from "./unit-table";

/** The unit of each dimension in tables, per system. SI as `poise sweep` fixes them (mm, N, N*m,
 * deg); US customary in the units a US drawing uses (in, lbf, lbf*in, psi). */
export const TABLE_UNITS: Readonly<Record<UnitSystem, Readonly<Record<DimensionName, string>>>> = {
  si: {
    length: "mm",
    area: "mm^2",
    mass: "kg",
    force: "N",
    torque: "N*m",
    stiffness: "N/mm",
    angular_stiffness: "N*mm/deg",
    angle: "deg",
    pressure: "MPa",
    density: "g/cm^3",
    acceleration: "m/s^2",
    frequency: "Hz",
    dimensionless: "",
  },
  us: {
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
    dimensionless: "",
  },
};

/** An SI value in the table unit of its dimension. */
export function toTableUnit(valueSI: number, dimension: DimensionName, system: UnitSystem): number {
  const unit = TABLE_UNITS[system][dimension];
  return unit ? (fromSI(valueSI, unit) ?? NaN) : valueSI;
}

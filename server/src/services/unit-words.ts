// The units a user may type for each dimension, as docs/language.md lists them (what completion
// offers after a number).
import type { DimensionName } from "../units/dimension";

export const UNITS_BY_DIMENSION: Readonly<Record<DimensionName, readonly string[]>> = {
  length: ["mm", "cm", "m", "in", "ft"],
  area: ["mm^2", "cm^2", "m^2", "in^2"],
  mass: ["g", "kg", "lb", "oz"],
  force: ["N", "kN", "lbf"],
  torque: ["N*m", "N*mm", "lbf*in", "lbf*ft"],
  stiffness: ["N/mm", "N/m", "lbf/in"],
  angular_stiffness: ["N*m/rad", "N*mm/deg", "lbf*in/deg"],
  angle: ["deg", "rad"],
  pressure: ["MPa", "GPa", "kPa", "Pa", "psi", "ksi"],
  density: ["g/cm^3", "kg/m^3", "lb/in^3"],
  acceleration: ["m/s^2"],
  frequency: ["Hz"],
  time: ["days", "weeks", "months", "years", "hours"],
  dimensionless: [],
};

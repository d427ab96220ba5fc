// SI wording of numbers in mechanics and balance messages (mm, deg, N, N*m, N/mm), through the
// shared display helper; readout figures stay SI and the editor formats them per unit system.
import { formatResult as formatQuantity } from "../units/format";

export const formatLength = (m: number): string => formatQuantity(m, "length", "si");
export const formatAngle = (rad: number): string => formatQuantity(rad, "angle", "si");
export const formatForce = (n: number): string => formatQuantity(n, "force", "si");
export const formatTorque = (nm: number): string => formatQuantity(nm, "torque", "si");
export const formatRate = (nPerM: number): string => formatQuantity(nPerM, "stiffness", "si");

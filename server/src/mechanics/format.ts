// Wording of numbers in mechanics and balance messages, in the system the messages of this
// analysis are written in (units/format.ts messageUnits: the spec's own, mm, N, N*m or in, lbf,
// lbf*in); readout figures stay SI and the editor formats them per unit system.
import { formatResult as formatQuantity, messageUnits } from "../units/format";

export const formatLength = (m: number): string => formatQuantity(m, "length", messageUnits());
export const formatAngle = (rad: number): string => formatQuantity(rad, "angle", messageUnits());
export const formatForce = (n: number): string => formatQuantity(n, "force", messageUnits());
export const formatTorque = (nm: number): string => formatQuantity(nm, "torque", messageUnits());
export const formatRate = (nPerM: number): string => formatQuantity(nPerM, "stiffness", messageUnits());

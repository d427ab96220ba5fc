// The aged load case (`aged { after T }`): how much force a rubber cord and how much stiffness a
// printed part have lost after a time under a steady load, and the arm model as it is then. The
// rules' values are recalled, not checked against a source here (docs/checks.md, aged case): a
// designer with measurements writes `relaxation` and `creep` instead.
import type { AgedSettings, ArmModel, Material } from "./types";
import { DAY_S, JULIAN_YEAR_S } from "../units/unit-table";

/** Stress relaxation of rubber held at a fixed stretch: the force falls by about the same share
 * for every tenfold of time, F(t) = F(t0) (1 - r log10(t / t0)). From memory: natural rubber
 * at room temperature loses a few per cent a decade of time (physical relaxation; oxidation
 * adds to it over months); r = 0.03, counted from a minute after stretching, when a force law's
 * modulus is usually measured. */
export const CORD_RELAXATION = { perDecade: 0.03, fromS: 60 } as const;

/** Creep of printed plastic under a steady load by Findley's power law (Findley, Lai and Onaran,
 * Creep and Relaxation of Nonlinear Viscoelastic Materials, 1976): strain(t) = strain0 (1 + a t^n),
 * t in hours, so the stiffness kept is 1 / (1 + a t^n). From memory, a rough fit for PLA, PETG
 * and ABS at room temperature under a moderate share of their strength: a = 0.1, n = 0.25
 * (about a third lost after a month, half after a year); nylon, and any print in a warm room,
 * creeps more. */
export const PRINT_CREEP = { a: 0.1, n: 0.25, hourS: 3600 } as const;

/** Neither rule is taken past this loss: beyond it the part has failed, not aged. */
const MOST_LOST = 0.9;

/** Share of a rubber cord's force lost after `afterS` seconds at a fixed stretch. */
export function cordForceLost(afterS: number): number {
  if (!(afterS > CORD_RELAXATION.fromS)) return 0;
  return Math.min(MOST_LOST, CORD_RELAXATION.perDecade * Math.log10(afterS / CORD_RELAXATION.fromS));
}

/** Share of a printed part's stiffness lost after `afterS` seconds under a steady load. */
export function printStiffnessLost(afterS: number): number {
  if (!(afterS > 0)) return 0;
  const growth = PRINT_CREEP.a * (afterS / PRINT_CREEP.hourS) ** PRINT_CREEP.n;
  return Math.min(MOST_LOST, growth / (1 + growth));
}

/** What the aged case changes: the time, the shares lost, and whether each share is the spec's
 * own or the rule's. */
export interface AgedFactors {
  afterS: number;
  cordForceLost: number;
  printStiffnessLost: number;
  cordFromRule: boolean;
  printFromRule: boolean;
}

export function agedFactors(aged: AgedSettings): AgedFactors {
  return {
    afterS: aged.after,
    cordForceLost: aged.relaxation ?? cordForceLost(aged.after),
    printStiffnessLost: aged.creep ?? printStiffnessLost(aged.after),
    cordFromRule: aged.relaxation === undefined,
    printFromRule: aged.creep === undefined,
  };
}

/** Materials of the model's rubber cords (their force is proportional to the shear modulus). */
export function cordMaterials(model: ArmModel): Set<string> {
  const ids = new Set<string>();
  for (const s of model.springs) if (s.kind === "elastic") ids.add(s.material);
  return ids;
}

/** The arm after the aged case's time: every rubber cord's material keeps 1 - cordForceLost of
 * its moduli (the neo-Hookean force is proportional to them, so the force at every stretch falls
 * by that share), every printed material 1 - printStiffnessLost (its creep modulus). Geometry,
 * masses, strengths and steel springs are as built. */
export function agedModel(model: ArmModel, f: AgedFactors): ArmModel {
  const cords = cordMaterials(model);
  const materials: Record<string, Material> = {};
  for (const [id, m] of Object.entries(model.materials)) {
    const kept = cords.has(id) ? 1 - f.cordForceLost : m.printed ? 1 - f.printStiffnessLost : 1;
    materials[id] = kept === 1 ? m : { ...m, modulus: m.modulus * kept, shearModulus: m.shearModulus * kept };
  }
  return { ...model, materials };
}

/** A time in the words a designer would say it: hours, days, weeks, months or years. */
export function durationWords(seconds: number): string {
  const units: [string, number][] = [
    ["year", JULIAN_YEAR_S],
    ["month", JULIAN_YEAR_S / 12],
    ["week", 7 * DAY_S],
    ["day", DAY_S],
    ["hour", 3600],
  ];
  for (const [word, s] of units) {
    const n = seconds / s;
    if (n >= 1 || word === "hour") {
      const shown = Number(n.toPrecision(3));
      return `${shown} ${word}${shown === 1 ? "" : "s"}`;
    }
  }
  return `${seconds} s`;
}

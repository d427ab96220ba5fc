// One fastening under one load: the force on each screw or bolt (a group in shear and a moment, or
// tension from prying about the part's edge), then what fails first: the thread stripping in the
// softer part, the screw or bolt itself, the part bearing on the screw, or the glue. The checks
// call it at every pose; the rules are in docs/checks.md. SI.
import type { Fastening, FasteningAxis, Material } from "../../model/types";
import type { FasteningData } from "../../findings/data";
import { LAYER_STRENGTH_FRACTION } from "../../model/materials";
import { bondCombinedShearStress, bondShearStress } from "./bond";
import { groupShear, rowOfFasteners, tensionFromMoment } from "./fastener-group";
import {
  FORMED_THREAD_ENGAGEMENT_SHARE,
  internalThreadShearArea,
  rootArea,
  tensileStressArea,
  threadShearStrength,
  vonMisesStress,
} from "./threads";

/** The load a fastening passes, in the frame of the body it holds a part to: x along the body,
 * y across it in the arm's plane. */
export interface FasteningLoad {
  /** Force along and across the body, N. `across` is positive where it pulls the held part off
   * the body's face. */
  along: number;
  across: number;
  /** Moment in the arm's plane about the fastening's centre, N*m. */
  moment: number;
  /** Height of the load's line above the fastened face, m: `along` pries the part about its edge. */
  lever: number;
  /** The face's side is not known: an `across` force either way pulls. */
  eitherSide?: boolean;
}

/** Forces on the most loaded screw or bolt, N. */
export interface FastenerForces {
  shear: number;
  tension: number;
}

/** A single screw or bolt has no neighbour to set its part's edge by: the edge it pries about is
 * taken two diameters from its axis, about the seat of its head or washer (common practice, no
 * source). */
export const SINGLE_FASTENER_EDGE_DIAMETERS = 2;

/** Distances of a row's fasteners from the edge the part pries about: the edge half a spacing
 * beyond the last one (the part ends there), or for a single one two diameters from it. */
export function distancesFromEdge(count: number, spacing: number | undefined, diameter: number): number[] {
  if (count === 1 || !spacing) return [SINGLE_FASTENER_EDGE_DIAMETERS * diameter];
  return Array.from({ length: count }, (_, i) => (i + 0.5) * spacing);
}

/** Shear and tension on the most loaded fastener of a row of `count` at `spacing`:
 * - `through` the arm's plane: the in-plane force and moment shear the group (primary V / n plus
 *   the moment over the group, Shigley ch. 8); no tension. One fastener cannot hold a moment
 *   (tension and shear are then Infinity).
 * - `across` the body: `along` shears the row evenly; the pull and the prying moment (`along` x
 *   lever, plus the in-plane moment) put the row in tension about the part's edge (Shigley ch. 8,
 *   the bracket that tips about its heel). */
export function fastenerForces(
  count: number,
  spacing: number | undefined,
  diameter: number,
  axis: FasteningAxis,
  load: FasteningLoad,
): FastenerForces {
  if (axis === "through") {
    const g = groupShear(rowOfFasteners(count, spacing ?? 0), { x: load.along, y: load.across }, load.moment);
    return { shear: g.largest, tension: 0 };
  }
  const pull = load.eitherSide ? Math.abs(load.across) : Math.max(load.across, 0);
  const pry = Math.abs(load.along) * load.lever + Math.abs(load.moment);
  const t = tensionFromMoment(distancesFromEdge(count, spacing, diameter), pry, pull);
  return { shear: Math.abs(load.along) / count, tension: Math.max(...t) };
}

export interface FasteningSafety {
  safety: number;
  /** What fails first (the `check` of strength.fastening). */
  check: FasteningData["check"];
  /** Most loaded screw or bolt (glue: the whole bond), N. */
  shear: number;
  tension: number;
  /** Stress and allowable of what fails first, Pa (thread stripping: the pull-out force and the
   * stripping force, N). */
  stress: number;
  allowable: number;
}

/** The materials a fastening names, resolved. */
export interface FasteningMaterials {
  /** The screws' or bolts' own material. */
  fastener?: Material;
  /** What the screws' thread is in. */
  into?: Material;
  adhesive?: Material;
}

function throughLayers(m: Material): number {
  return m.printed ? (m.layerStrength ?? LAYER_STRENGTH_FRACTION * m.strength) : m.strength;
}

/** Least of several (safety, what) pairs. */
function least(
  options: Omit<FasteningSafety, "shear" | "tension">[],
  forces: FastenerForces,
): FasteningSafety {
  let best = options[0]!;
  for (const o of options) if (o.safety < best.safety) best = o;
  return { ...best, ...forces };
}

const ratio = (allowable: number, stress: number) => (stress > 0 ? allowable / stress : Infinity);

/** Safety of a screwed or bolted fastening given the forces on its most loaded member. */
export function fastenerSafety(
  f: Fastening,
  forces: FastenerForces,
  mats: FasteningMaterials,
): FasteningSafety {
  if (f.kind === "glue") throw new RangeError("glue has no screws: use glueSafety");
  if (!Number.isFinite(forces.shear) || !Number.isFinite(forces.tension))
    return { safety: 0, check: "cannot hold a moment", stress: Infinity, allowable: 0, ...forces };
  const d = f.diameter;
  const P = f.pitch;
  const sigma = forces.tension / tensileStressArea(d, P);
  const planes = f.kind === "bolts" ? f.shearPlanes : 1;
  const tau = forces.shear / (planes * rootArea(d, P));
  const vm = vonMisesStress(sigma, tau);
  const member = mats.fastener;
  const memberAllow = member ? (member.proofStrength ?? member.strength) : Infinity;
  const options: Omit<FasteningSafety, "shear" | "tension">[] = [
    {
      safety: ratio(memberAllow, vm),
      check: f.kind === "bolts" ? "bolt" : "screw",
      stress: vm,
      allowable: memberAllow,
    },
  ];
  if (f.kind === "screws" && mats.into) {
    const engaged = f.engagement * (f.thread === "formed" ? FORMED_THREAD_ENGAGEMENT_SHARE : 1);
    const strip = internalThreadShearArea(engaged, P, d) * threadShearStrength(mats.into);
    options.push({
      safety: ratio(strip, forces.tension),
      check: "thread stripping",
      stress: forces.tension,
      allowable: strip,
    });
    // the screw bears on the part over its engaged length: F / (d L)
    const bearing = forces.shear / (d * f.engagement);
    const bearingAllow = throughLayers(mats.into);
    options.push({
      safety: ratio(bearingAllow, bearing),
      check: "hole bearing",
      stress: bearing,
      allowable: bearingAllow,
    });
  }
  return least(options, forces);
}

/** Safety of a glued fastening (a bond of `area`, the adhesive's strength its lap-shear strength):
 * - `through` (the bond lies in the arm's plane, between overlapping parts): the mean shear of the
 *   force plus the twist of the moment (bond.ts), against the lap-shear strength;
 * - `across` (the bond on the body's face): `along` shears it; the pull and the prying moment open
 *   it (peel): their normal stress P / A + 6 M / a^3 on a square bond of side a, held to the
 *   lap-shear strength too, which a bond in peel does not reach (the readout says so). */
export function glueSafety(
  area: number,
  axis: FasteningAxis,
  load: FasteningLoad,
  adhesive: Material,
): FasteningSafety {
  const S = adhesive.strength;
  if (axis === "through") {
    const tau = bondCombinedShearStress(Math.hypot(load.along, load.across), load.moment, area);
    return {
      safety: ratio(S, tau),
      check: "glue shear",
      shear: Math.hypot(load.along, load.across),
      tension: 0,
      stress: tau,
      allowable: S,
    };
  }
  const tau = bondShearStress(load.along, area);
  const pull = load.eitherSide ? Math.abs(load.across) : Math.max(load.across, 0);
  const pry = Math.abs(load.along) * load.lever + Math.abs(load.moment);
  const side = Math.sqrt(area);
  const sigma = pull / area + (6 * pry) / side ** 3;
  const forces = { shear: Math.abs(load.along), tension: pull };
  return least(
    [
      { safety: ratio(S, tau), check: "glue shear", stress: tau, allowable: S },
      { safety: ratio(S, sigma), check: "glue peel", stress: sigma, allowable: S },
    ],
    forces,
  );
}

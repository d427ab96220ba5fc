// One bearing under one load: ball bearings by their most loaded ball and its Hertz contact,
// bought bearings by ISO 76, plain bearings by their pressure. The swivel and joint checks call
// bearingSafety with the loads they find at each pose; the safety is on load throughout (ISO 76's
// C0 / P0 is), so a Hertz stress ratio enters cubed. SI.
import type { Material } from "../../model/types";
import type { BearingData } from "../../findings/data";
import { LAYER_STRENGTH_FRACTION } from "../../model/materials";
import {
  radialBallLoad,
  staticEquivalentLoad,
  staticSafety,
  thrustRingLoad,
  plainBearingPressure,
} from "./ball-load";
import { ballInRace, contactModulus } from "./hertz";

export type BearingModel =
  | {
      kind: "balls";
      count: number;
      ballDiameter: number;
      ball: Material;
      pitchDiameter: number;
      race: Material;
      /** Radius of the races' groove across the rolling direction; Infinity (or absent): flat. */
      grooveRadius?: number;
    }
  | { kind: "plain"; bore: number; length: number; material: Material }
  | {
      kind: "rated";
      /** Basic static load rating C0, N. */
      staticRating: number;
      dynamicRating?: number;
      /** Pitch circle, m, where known: lets a thrust bearing's tilting moment be counted. */
      pitchDiameter?: number;
    };

/** Loads through the bearing: radial (across its axis), axial (along it), and the moment that
 * tilts it about an axis across its own, N and N m (magnitudes). */
export interface BearingLoad {
  radial: number;
  axial: number;
  moment: number;
}

/** A radial bearing carries load across its axis (a joint's pivot, one of a swivel's pair); a
 * thrust bearing along it (a turntable carrying the weight above it). */
export type BearingRole = "radial" | "thrust";

export interface BearingSafety {
  /** Safety on load: how many times the load could grow before the limit. */
  safety: number;
  /** What limits it (the `check` of strength.bearing). */
  governing: BearingData["check"];
  /** Most loaded ball, N (ball bearings). */
  ballLoad?: number;
  /** Peak Hertz pressure and its allowable in the softer part, Pa, and which material that is. */
  contactPressure?: number;
  allowablePressure?: number;
  softer?: string;
  /** Static equivalent load P0, N (rated bearings). */
  equivalentLoad?: number;
  /** Largest bore pressure, Pa (plain bearings), against allowablePressure. */
  borePressure?: number;
  notes: string[];
}

/** First yield beneath a ball at a peak pressure p0 = 1.60 Y for Poisson's ratio 0.3 (Johnson,
 * Contact Mechanics, 1985, section 6.2). */
export const FIRST_YIELD_CONTACT_RATIO = 1.6;

/** Strength a material offers where the load may cross printed layers: the layer strength for a
 * print (docs/checks.md), else its strength. */
function throughLayers(m: Material): number {
  return m.printed ? (m.layerStrength ?? LAYER_STRENGTH_FRACTION * m.strength) : m.strength;
}

/** Allowable peak contact pressure of a material, Pa: the library's figure where it gives one,
 * else the first-yield rule 1.6 x strength (layer strength for a print). */
export function contactAllowable(m: Material): number {
  return m.contactStrength ?? FIRST_YIELD_CONTACT_RATIO * throughLayers(m);
}

/** Most loaded ball of a ball bearing in its role, and notes on what the model leaves out. */
function ballLoad(
  b: Extract<BearingModel, { kind: "balls" }>,
  load: BearingLoad,
  role: BearingRole,
  notes: string[],
): { largest: number; tips: boolean } {
  if (role === "thrust") {
    if (load.radial > 0)
      notes.push(
        "A thrust ring carries no radial load by itself: a centring pin or radial bearings must take it.",
      );
    const r = thrustRingLoad(load.axial, load.moment, b.count, b.pitchDiameter);
    if (r.loadedShare < 1 && !r.tips)
      notes.push(
        `The moment lifts the ring off ${Math.round((1 - r.loadedShare) * 100)} % of its balls: the rest carry the load.`,
      );
    return { largest: r.largest, tips: r.tips };
  }
  // Radial role: Stribeck for the radial load; an axial load shared evenly as on a thrust ring and
  // a moment by the ring's linear share 4 M / (Z dp) (our rule: a deep-groove contact angle under
  // axial load would raise the ball load further).
  let q = radialBallLoad(load.radial, b.count);
  if (load.axial > 0) q += load.axial / b.count;
  if (load.moment > 0) {
    q += (4 * load.moment) / (b.count * b.pitchDiameter);
    notes.push(
      "A single radial bearing carries a tilting moment poorly: two bearings apart carry it as a couple.",
    );
  }
  return { largest: q, tips: false };
}

/** Safety of one bearing under one load in its role. */
export function bearingSafety(model: BearingModel, load: BearingLoad, role: BearingRole): BearingSafety {
  const notes: string[] = [];
  switch (model.kind) {
    case "balls": {
      const q = ballLoad(model, load, role, notes);
      if (q.tips) {
        notes.push("The tilting moment exceeds what the thrust holds down: the ring tips over its edge.");
        return { safety: 0, governing: "tipping", ballLoad: Infinity, notes };
      }
      const estar = contactModulus(
        model.ball.modulus,
        model.ball.poisson,
        model.race.modulus,
        model.race.poisson,
      );
      // the inner ring's convex race is the tighter contact of a radial bearing; a thrust ring's is flat
      const raceRadius = role === "radial" ? (model.pitchDiameter - model.ballDiameter) / 2 : Infinity;
      const contact = ballInRace(
        q.largest,
        { ballDiameter: model.ballDiameter, grooveRadius: model.grooveRadius ?? Infinity, raceRadius },
        estar,
      );
      const ballAllow = contactAllowable(model.ball);
      const raceAllow = contactAllowable(model.race);
      const softer = raceAllow <= ballAllow ? model.race : model.ball;
      const allow = Math.min(ballAllow, raceAllow);
      const p0 = contact.peakPressure;
      if (softer.printed)
        notes.push(
          `A printed ${softer.id} part yields beneath the most loaded ball long before it tears: this safety is to the onset of yield (Johnson, section 6.2). A groove that fits the balls spreads the contact and lowers the pressure several times.`,
        );
      return {
        safety: p0 > 0 ? (allow / p0) ** 3 : Infinity,
        governing: "ball contact",
        ballLoad: q.largest,
        contactPressure: p0,
        allowablePressure: allow,
        softer: softer.id,
        notes,
      };
    }
    case "rated": {
      let P0: number;
      if (role === "thrust") {
        // ISO 76, thrust ball bearings (contact angle 90 deg): P0a = Fa; a moment by the linear
        // share of a ring, Fa + 4 M / dp (common practice for turntable rings)
        P0 = load.axial;
        if (load.moment > 0) {
          if (model.pitchDiameter) {
            P0 += (4 * load.moment) / model.pitchDiameter;
            if (load.axial < (4 * load.moment) / model.pitchDiameter)
              notes.push(
                "The moment lifts part of the ring: its most loaded ball carries more than this figure says.",
              );
          } else notes.push("A tilting moment on a thrust bearing is not rated: give its pitch to count it.");
        }
        if (load.radial > 0)
          notes.push("A thrust bearing carries no radial load: radial bearings must take it.");
      } else {
        P0 = staticEquivalentLoad(load.radial, load.axial);
        if (load.moment > 0)
          notes.push(
            "ISO 76 rates no tilting moment on one radial bearing: two bearings apart carry it as a couple.",
          );
      }
      return {
        safety: staticSafety(model.staticRating, P0),
        governing: "static rating",
        equivalentLoad: P0,
        notes,
      };
    }
    case "plain": {
      // mean pressure F / (d L), plus a moment's edge pressure 6 M / (d L^2) for a pressure that
      // varies linearly along a rigid pin (common practice, no source)
      const p =
        plainBearingPressure(load.radial, model.bore, model.length) +
        (6 * load.moment) / (model.bore * model.length ** 2);
      const allow = throughLayers(model.material);
      if (load.axial > 0)
        notes.push("A plain bearing takes axial load only on a shoulder or washer, not checked here.");
      return {
        safety: p > 0 ? allow / p : Infinity,
        governing: "bore pressure",
        borePressure: p,
        allowablePressure: allow,
        softer: model.material.id,
        notes,
      };
    }
  }
}

// Internal loads along a straight body from the point loads on it and its own distributed
// weight (statics of a free body cut at a section; e.g. Roark's Formulas for Stress and Strain,
// 8th ed., ch. 8 sign conventions: tension positive). Local axes: x along the body from `start`.

/** A load on the body in its local axes: position (s along the axis, offset across it), force
 * components and a couple (CCW positive). */
export interface BeamPointLoad {
  s: number;
  offset: number;
  fx: number;
  fy: number;
  couple: number;
}

export interface SectionLoad {
  /** Position along the body, m. */
  s: number;
  /** Axial force, N, tension positive. */
  axial: number;
  /** Shear force, N. */
  shear: number;
  /** Bending moment, N m. */
  moment: number;
}

/** Internal loads at `s`: what the part beyond s exerts on the part before it (loads exactly at
 * s count as before when `includeAt`). `distributed` is force per length (local x, y) over
 * [0, length]. */
export function sectionLoadAt(
  loads: readonly BeamPointLoad[],
  distributed: { qx: number; qy: number },
  length: number,
  s: number,
  includeAt: boolean,
): SectionLoad {
  let fx = 0;
  let fy = 0;
  let m = 0;
  for (const p of loads) {
    if (p.s < s || (includeAt && p.s === s)) {
      fx += p.fx;
      fy += p.fy;
      // moment of the load about the cut point (s, 0)
      m += (p.s - s) * p.fy - p.offset * p.fx + p.couple;
    }
  }
  const w = Math.max(0, Math.min(s, length));
  fx += distributed.qx * w;
  fy += distributed.qy * w;
  m += distributed.qy * (w * (w / 2 - s));
  return { s, axial: -fx, shear: -fy, moment: -m };
}

/** Stations where the bending moment can peak: the ends, every load, and where the shear
 * changes sign between loads (the moment is piecewise quadratic). */
export function criticalStations(loads: readonly BeamPointLoad[], distributed: { qx: number; qy: number }, length: number): SectionLoad[] {
  const positions = [...new Set([0, length, ...loads.map((p) => Math.max(0, Math.min(length, p.s)))])].sort((a, b) => a - b);
  const out: SectionLoad[] = [];
  for (let k = 0; k < positions.length; k++) {
    const s = positions[k]!;
    out.push(sectionLoadAt(loads, distributed, length, s, false));
    out.push(sectionLoadAt(loads, distributed, length, s, true));
    const next = positions[k + 1];
    if (next !== undefined && distributed.qy !== 0) {
      const after = sectionLoadAt(loads, distributed, length, s, true);
      // the shear V(s') = V(s) - qy (s' - s) is linear between loads: it vanishes at s*
      const sStar = s + after.shear / distributed.qy;
      if (sStar > s && sStar < next) out.push(sectionLoadAt(loads, distributed, length, sStar, true));
    }
  }
  return out;
}

export interface BeamStressResult {
  /** Largest |N|/A + |M| c / I, Pa, and where. */
  stress: number;
  at: SectionLoad;
  /** Share of that stress from bending (0..1). */
  bendingShare: number;
  /** Largest compression (positive number, N; 0 if none) anywhere along the body. */
  compression: number;
  /** Largest |M|, N m. */
  moment: number;
}

export function beamStress(
  loads: readonly BeamPointLoad[],
  distributed: { qx: number; qy: number },
  length: number,
  section: { area: number; secondMoment: number; extremeFibre: number },
): BeamStressResult {
  let best: BeamStressResult | undefined;
  let compression = 0;
  let moment = 0;
  for (const st of criticalStations(loads, distributed, length)) {
    const axialStress = Math.abs(st.axial) / section.area;
    const bendingStress = (Math.abs(st.moment) * section.extremeFibre) / section.secondMoment;
    const stress = axialStress + bendingStress;
    compression = Math.max(compression, -st.axial);
    moment = Math.max(moment, Math.abs(st.moment));
    if (!best || stress > best.stress) best = { stress, at: st, bendingShare: stress > 0 ? bendingStress / stress : 0, compression: 0, moment: 0 };
  }
  return { ...best!, compression, moment };
}

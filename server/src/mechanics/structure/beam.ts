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
  const out: SectionLoad = { s, axial: 0, shear: 0, moment: 0 };
  evaluateSection(loads, loads.length, distributed, length, s, includeAt, out);
  return out;
}

/** Stations of the current beamStress call (reused: one body at a time, nothing keeps it). */
let stationBuffer = new Float64Array(16);

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
  /** Loads to use from the front of `loads` (a reused buffer may hold more). */
  count = loads.length,
): BeamStressResult {
  // Stations where the moment can peak: the ends, every load, and where the shear changes sign
  // between loads (the moment is piecewise quadratic). Hot loop: every body at every pose.
  if (stationBuffer.length < count + 2) stationBuffer = new Float64Array(2 * (count + 2));
  const pos = stationBuffer.subarray(0, count + 2);
  pos[0] = 0;
  pos[1] = length;
  for (let k = 0; k < count; k++) pos[k + 2] = Math.max(0, Math.min(length, loads[k]!.s));
  pos.sort();
  const st = scan;
  st.bestStress = -1;
  st.bestBending = 0;
  st.compression = 0;
  st.moment = 0;
  const best = st.best;
  best.s = 0;
  best.axial = 0;
  best.shear = 0;
  best.moment = 0;
  for (let k = 0; k < pos.length; k++) {
    const s = pos[k]!;
    if (k > 0 && s === pos[k - 1]) continue;
    visitStation(loads, count, distributed, length, section, s, false);
    visitStation(loads, count, distributed, length, section, s, true);
    const shearAfter = st.scratch.shear;
    let next = -1;
    for (let m = k + 1; m < pos.length; m++)
      if (pos[m]! > s) {
        next = pos[m]!;
        break;
      }
    if (next > s && distributed.qy !== 0) {
      // the shear V(s') = V(s) - qy (s' - s) is linear between loads: it vanishes at s*
      const sStar = s + shearAfter / distributed.qy;
      if (sStar > s && sStar < next) visitStation(loads, count, distributed, length, section, sStar, true);
    }
  }
  const bestStress = st.bestStress;
  return {
    stress: bestStress,
    at: { ...best },
    bendingShare: bestStress > 0 ? st.bestBending / bestStress : 0,
    compression: st.compression,
    moment: st.moment,
  };
}

/** The running state of the current beamStress call (one body at a time; nothing keeps it). */
const scan = {
  scratch: { s: 0, axial: 0, shear: 0, moment: 0 } as SectionLoad,
  best: { s: 0, axial: 0, shear: 0, moment: 0 } as SectionLoad,
  bestStress: -1,
  bestBending: 0,
  compression: 0,
  moment: 0,
};

/** Internal loads at one station, folded into `scan`: the largest stress so far and where, the
 * largest compression and moment. */
function visitStation(
  loads: readonly BeamPointLoad[],
  count: number,
  distributed: { qx: number; qy: number },
  length: number,
  section: { area: number; secondMoment: number; extremeFibre: number },
  s: number,
  includeAt: boolean,
): void {
  const st = scan;
  const scratch = st.scratch;
  evaluateSection(loads, count, distributed, length, s, includeAt, scratch);
  const axialStress = Math.abs(scratch.axial) / section.area;
  const bendingStress = (Math.abs(scratch.moment) * section.extremeFibre) / section.secondMoment;
  const stress = axialStress + bendingStress;
  st.compression = Math.max(st.compression, -scratch.axial);
  st.moment = Math.max(st.moment, Math.abs(scratch.moment));
  if (stress > st.bestStress) {
    st.bestStress = stress;
    const best = st.best;
    best.s = scratch.s;
    best.axial = scratch.axial;
    best.shear = scratch.shear;
    best.moment = scratch.moment;
    st.bestBending = bendingStress;
  }
}

/** sectionLoadAt written into `out` (no allocation). */
function evaluateSection(
  loads: readonly BeamPointLoad[],
  count: number,
  distributed: { qx: number; qy: number },
  length: number,
  s: number,
  includeAt: boolean,
  out: SectionLoad,
): void {
  let fx = 0;
  let fy = 0;
  let m = 0;
  for (let k = 0; k < count; k++) {
    const p = loads[k]!;
    if (p.s < s || (includeAt && p.s === s)) {
      fx += p.fx;
      fy += p.fy;
      m += (p.s - s) * p.fy - p.offset * p.fx + p.couple;
    }
  }
  const w = Math.max(0, Math.min(s, length));
  fx += distributed.qx * w;
  fy += distributed.qy * w;
  m += distributed.qy * (w * (w / 2 - s));
  out.s = s;
  out.axial = -fx;
  out.shear = -fy;
  out.moment = -m;
}

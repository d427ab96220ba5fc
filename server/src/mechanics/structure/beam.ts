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

/** A result for beamStressInto to fill (one can serve many calls). */
export function emptyBeamStress(): BeamStressResult {
  return {
    stress: 0,
    at: { s: 0, axial: 0, shear: 0, moment: 0 },
    bendingShare: 0,
    compression: 0,
    moment: 0,
  };
}

export function beamStress(
  loads: readonly BeamPointLoad[],
  distributed: { qx: number; qy: number },
  length: number,
  section: { area: number; secondMoment: number; extremeFibre: number },
  /** Loads to use from the front of `loads` (a reused buffer may hold more). */
  count = loads.length,
): BeamStressResult {
  const out = emptyBeamStress();
  beamStressInto(loads, count, distributed.qx, distributed.qy, length, section, out);
  return out;
}

/** beamStress written into `out` (its `at` too): the strength check's hot loop, every body at
 * every pose and load case, with no object per call. */
export function beamStressInto(
  loads: readonly BeamPointLoad[],
  count: number,
  qx: number,
  qy: number,
  length: number,
  section: { area: number; secondMoment: number; extremeFibre: number },
  out: BeamStressResult,
): void {
  // Stations where the moment can peak: the ends, every load, and where the shear changes sign
  // between loads (the moment is piecewise quadratic).
  const n = count + 2;
  if (stationBuffer.length < n) stationBuffer = new Float64Array(2 * n);
  const pos = stationBuffer;
  pos[0] = 0;
  pos[1] = length;
  for (let k = 0; k < count; k++) pos[k + 2] = Math.max(0, Math.min(length, loads[k]!.s));
  sortAscending(pos, n);
  // One function for the whole scan, the section sums and the folding written out: a call per
  // station and side is dear in the untuned tier. The sums run over the loads in their order, as
  // sectionLoadAt's do, so the figures are the same to the last bit.
  const { area, secondMoment, extremeFibre } = section;
  let bestStress = -1;
  let bestBending = 0;
  let compression = 0;
  let largestMoment = 0;
  const best = out.at;
  best.s = 0;
  best.axial = 0;
  best.shear = 0;
  best.moment = 0;
  for (let k = 0; k < n; k++) {
    let s = pos[k]!;
    if (k > 0 && s === pos[k - 1]) continue;
    let next = -1;
    for (let m = k + 1; m < n; m++)
      if (pos[m]! > s) {
        next = pos[m]!;
        break;
      }
    // at a station: first with the loads exactly at s not yet counted, then counted; then, where
    // the shear changes sign before the next station, at that point s* (counted)
    let both = true;
    for (;;) {
      let fxBefore = 0;
      let fyBefore = 0;
      let mBefore = 0;
      let fx = 0;
      let fy = 0;
      let m = 0;
      for (let i = 0; i < count; i++) {
        const p = loads[i]!;
        const ps = p.s;
        if (ps < s) {
          const pfx = p.fx;
          const pfy = p.fy;
          const dm = (ps - s) * pfy - p.offset * pfx + p.couple;
          fxBefore += pfx;
          fyBefore += pfy;
          mBefore += dm;
          fx += pfx;
          fy += pfy;
          m += dm;
        } else if (ps === s) {
          const pfx = p.fx;
          const pfy = p.fy;
          fx += pfx;
          fy += pfy;
          m += (ps - s) * pfy - p.offset * pfx + p.couple;
        }
      }
      const w = Math.max(0, Math.min(s, length));
      const dfx = qx * w;
      const dfy = qy * w;
      const dmq = qy * (w * (w / 2 - s));
      for (let side = both ? 0 : 1; side < 2; side++) {
        const axial = side === 0 ? -(fxBefore + dfx) : -(fx + dfx);
        const moment = side === 0 ? -(mBefore + dmq) : -(m + dmq);
        const axialStress = Math.abs(axial) / area;
        const bendingStress = (Math.abs(moment) * extremeFibre) / secondMoment;
        const stress = axialStress + bendingStress;
        compression = Math.max(compression, -axial);
        largestMoment = Math.max(largestMoment, Math.abs(moment));
        if (stress > bestStress) {
          bestStress = stress;
          best.s = s;
          best.axial = axial;
          best.shear = side === 0 ? -(fyBefore + dfy) : -(fy + dfy);
          best.moment = moment;
          bestBending = bendingStress;
        }
      }
      if (!both || !(next > s && qy !== 0)) break;
      // the shear V(s') = V(s) - qy (s' - s) is linear between loads: it vanishes at s*
      const sStar = s + -(fy + dfy) / qy;
      if (!(sStar > s && sStar < next)) break;
      s = sStar;
      both = false;
    }
  }
  out.stress = bestStress;
  out.bendingShare = bestStress > 0 ? bestBending / bestStress : 0;
  out.compression = compression;
  out.moment = largestMoment;
}

/** The first n entries of `a` in ascending order, NaN last (as a typed array's sort puts them):
 * a handful of stations, so insertion in place, without the subarray a sort() needs. */
function sortAscending(a: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) {
    const v = a[i]!;
    let j = i;
    while (j > 0 && (a[j - 1]! > v || (a[j - 1]! !== a[j - 1]! && v === v))) {
      a[j] = a[j - 1]!;
      j--;
    }
    a[j] = v;
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

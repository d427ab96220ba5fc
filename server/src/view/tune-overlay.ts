// Lays a tune run's preview (tune/preview.ts: built once, when the user asked for a search) over
// the view model of whichever text the editor holds: the present design, whose tuned values are
// a proposal, or the tuned design once they are written. The design the text holds is drawn as
// usual; the other one is the overlay: each tuned spring's other place, the other design's hand
// force at the same poses, and the anchor locus of the design drawn. Pure.
import type { ViewModel, ViewTune, ViewTuneLocus } from "./view-model";

type End = { body: string; local: [number, number] };

/** What the view reads of a tune preview (the tune folder's TunePreview fits). */
export interface TuneOverlayInput {
  springs: {
    id: string;
    kind: ViewTune["springs"][number]["kind"];
    present?: [End, End];
    tuned?: [End, End];
    changes: string[];
  }[];
  worstBefore?: number;
  worstAfter?: number;
  present: {
    poses: { angles: Record<string, number>; handForce: Record<string, number> }[];
    locus: ViewTuneLocus[];
  };
  tuned: {
    poses: { angles: Record<string, number>; handForce: Record<string, number> }[];
    locus: ViewTuneLocus[];
  };
}

const DEG = 180 / Math.PI;
/** Ends closer than this are the same place, m (a ten-thousandth of a millimetre). */
const SAME_PLACE_M = 1e-7;
/** Angles compared at the view's own rounding (a ten-thousandth of a degree). */
const key = (angles: readonly number[]) => angles.map((a) => Math.round(a * DEG * 1e4)).join(",");

/** The force to 1e-4 N, as the view model keeps its figures. */
const r4 = (x: number) => (Number.isFinite(x) ? Math.round(x * 1e4) / 1e4 : x);

/** The view model with the overlay of a tune run (a copy; `vm` is left as it is). */
export function withTuneOverlay(
  vm: ViewModel,
  preview: TuneOverlayInput,
  textIs: ViewTune["textIs"],
): ViewModel {
  const other = textIs === "present" ? preview.tuned : preview.present;
  const own = textIs === "present" ? preview.present : preview.tuned;
  const dofIds = vm.dofs.map((d) => d.id);
  const byAngles = new Map<string, Record<string, number>>();
  for (const p of other.poses) byAngles.set(key(dofIds.map((id) => p.angles[id] ?? NaN)), p.handForce);
  const tune: ViewTune = {
    textIs,
    otherLabel: textIs === "present" ? "as tuned" : "before tuning",
    springs: preview.springs.map((s) => {
      const ends = textIs === "present" ? s.tuned : s.present;
      const moved =
        s.present !== undefined &&
        s.tuned !== undefined &&
        s.present.some(
          (e, i) =>
            e.body !== s.tuned![i]!.body ||
            Math.hypot(e.local[0] - s.tuned![i]!.local[0], e.local[1] - s.tuned![i]!.local[1]) > SAME_PLACE_M,
        );
      return { id: s.id, kind: s.kind, ...(ends ? { other: ends } : {}), moved, changes: s.changes };
    }),
    otherHandForce: vm.poses.map((p) => {
      const f = byAngles.get(key(p.angles));
      return f ? Object.fromEntries(Object.entries(f).map(([k, v]) => [k, r4(v)])) : null;
    }),
    ...(preview.worstBefore !== undefined ? { worstBefore: preview.worstBefore } : {}),
    ...(preview.worstAfter !== undefined ? { worstAfter: preview.worstAfter } : {}),
    locus: own.locus,
  };
  return { ...vm, tune };
}

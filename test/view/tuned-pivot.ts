// A spec with a `tune` line whose search moves a spring's anchor: shared by the overlay's tests
// (test/view/tune-overlay.test.ts) and the report's label test in the browser.
import { pivotSpec } from "../tune/pivot-spec";

/** Anchor height above the pivot a, hook b along the boom, payload at l of mass m, rate k (SI). */
export const [A, B, L, M, K] = [0.02, 0.1, 0.4, 1, 500];
/** The anchor may rise to 40 mm above the pivot: short of the exact a = m g l / (k b) = 78 mm, so
 * the tuned design still needs a hand. */
export const TUNED_PIVOT = pivotSpec({
  a: A * 1000,
  b: B * 1000,
  l: L * 1000,
  m: M,
  rate: `${K / 1000} N/mm`,
  tune: "tune anchor (0 mm, 310 mm) .. (0 mm, 340 mm)",
});

// A spec with a `tune` line whose search moves a spring's anchor: shared by the overlay's tests
// (test/view/tune-overlay.test.ts) and the report's label test in the browser.
/** Anchor height above the pivot a, hook b along the boom, payload at l of mass m, rate k (SI). */
export const [A, B, L, M, K] = [0.02, 0.1, 0.4, 1, 500];
/** The anchor may rise to 40 mm above the pivot: short of the exact a = m g l / (k b) = 78 mm, so
 * the tuned design still needs a hand. */
export const TUNED_PIVOT = `# Invented for the tests: a boom whose spring anchor may rise a little up the post.
arm "Pivot" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, ${300 + A * 1000} mm)
  }
  link boom {
    length 450 mm
    mass 0 kg
  }
  joint shoulder {
    connects post.pivot to boom.start
    range -60 deg .. 60 deg
  }
  spring lift {
    zero_length
    between post.anchor and boom(${B * 1000} mm, 0 mm)
    rate ${K / 1000} N/mm
    tune anchor (0 mm, 310 mm) .. (0 mm, 340 mm)
  }
  payload weight {
    mass ${M} kg
    at boom(${L * 1000} mm, 0 mm)
  }
}
`;

// A spec written in inches and pounds, shared by the unit tests and the protocol test of the
// `displayUnits` setting.

/** Invented: a pivoting test boom drawn in inches (the pendulum of test/view, in US units). */
export const INCH_TEXT = `arm "Test boom in inches" {
  base post {
    point pivot (0 in, 12 in)
    point anchor (0 in, 14 in)
  }
  link boom {
    length 16 in
    section rect 0.75 in x 0.25 in
    mass 0 lb
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -30 deg .. 30 deg
    pin 0.125 in steel_1018
  }
  spring lift {
    zero_length
    between post.anchor and boom(4 in, 0 in)
    rate 3 lbf/in
  }
  payload lamp {
    mass 2 lb
    at boom.end
  }
}
`;

// A pivoting link (a lamp boom) with a real extension spring and Coulomb friction at its pivot,
// and its closed forms (docs/formulas.md, gravity balancing, Herder 2001; common statics for the
// friction): shared by the hand-force checks and the hand-force plot's test.
export const G = 9.80665; // standard gravity (SI Brochure, 9th ed.)
export const [m, l, a, b] = [1, 0.4, 0.05, 0.1];
// Under-balanced low in the range and over-balanced high: with C = Fi - k L0 > 0 the spring's
// F / L = k + C / L grows as it shortens; k a b is set so the two cancel at the horizontal.
export const C = 20;
export const L0 = 0.03;
export const k = (m * G * l - (C * a * b) / Math.hypot(a, b)) / (a * b);
export const Fi = C + k * L0;
export const friction = 0.05;

export const spec = `# Invented: a lamp boom whose spring holds it level but lets it sink low and rise high (issue 10 item 4).
arm "Boom with a stiff pivot" {
  base post {
    mass 20 kg
    footprint 400 mm x 400 mm
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, ${300 + a * 1000} mm)
  }
  link boom {
    length ${l * 1000} mm
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -60 deg .. 60 deg
    friction ${friction} N*m
  }
  spring lift {
    extension
    between post.anchor and boom(${b * 1000} mm, 0 mm)
    rate ${k / 1000} N/mm
    free_length ${L0 * 1000} mm
    initial_tension ${Fi} N
  }
  payload lamp {
    mass ${m} kg
    at boom.end
  }
  require {
    balance 5 N
  }
}
`;

/** Holding torque of the pivoting link at theta (docs/formulas.md, gravity balancing). */
export function holdingTorque(theta: number): number {
  const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(theta));
  return m * G * l * Math.cos(theta) - ((Fi + k * (L - L0)) * a * b * Math.cos(theta)) / L;
}

/** Coulomb friction holds up to f either way; the rest goes to the hand, at the payload's lever
 * l: |F| = max(0, |tau| - f) / l, and F_y has the sign of tau cos(theta) (the link points right,
 * so tau > 0 means the arm sinks and the hand lifts). */
export function signedHandForce(theta: number, f = friction): number {
  const tau = holdingTorque(theta);
  return (Math.sign(tau) * Math.max(0, Math.abs(tau) - f)) / l;
}

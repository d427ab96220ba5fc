// The pivoting link of docs/formulas.md (gravity balancing) as a spec: a massless boom on a post,
// a payload at l, a zero-free-length spring from a above the pivot to b along the boom. Shared by
// the search's, the locus's, the overlay's and the protocol's tests.

/** Lengths in mm, mass in kg; `tune` a spring line, `angle` the shoulder's reference angle. */
export function pivotSpec(o: {
  a: number;
  b: number;
  l: number;
  m: number;
  rate: string;
  tune?: string;
  friction?: string;
  angle?: string;
}) {
  return `# Invented for the tests: a pivoting link balanced by a zero-free-length spring.
arm "Pivot" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, ${300 + o.a} mm)
  }
  link boom {
    length ${o.l + 50} mm
    mass 0 kg
  }
  joint shoulder {
    connects post.pivot to boom.start${o.angle ? `\n    angle ${o.angle}` : ""}
    range -60 deg .. 60 deg${o.friction ? `\n    friction ${o.friction}` : ""}
  }
  spring lift {
    zero_length
    between post.anchor and boom(${o.b} mm, 0 mm)
    rate ${o.rate}${o.tune ? `\n    ${o.tune}` : ""}
  }
  payload weight {
    mass ${o.m} kg
    at boom(${o.l} mm, 0 mm)
  }
  require {
    balance 0.5 N
  }
}
`;
}

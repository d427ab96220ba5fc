// A lamp boom on a post with one spring given in full: the spring-kind tests' arm
// (test/tune/kinds.test.ts, test/tune/wire-sizes.test.ts).

/** The arm with `spring`'s lines (indented four spaces) inside `spring lift`, and `extra` blocks. */
export function arm(spring: string, extra = ""): string {
  return `# Invented for the tests: a lamp boom on a post, one spring of each kind in turn.
arm "Kinds" {
  base post {
    point pivot (0 mm, 600 mm)
    point anchor (0 mm, 700 mm)
    point low (0 mm, 500 mm)
  }
  link boom {
    length 450 mm
    mass 0 kg
  }
  joint shoulder {
    connects post.pivot to boom.start
    range -30 deg .. 30 deg
  }
  spring lift {
${spring}
  }
  payload lamp {
    mass 500 g
    at boom(400 mm, 0 mm)
  }${extra}
}
`;
}

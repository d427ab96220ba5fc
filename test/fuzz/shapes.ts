// Specs of the shapes that broke the promise of bounded work (issue 16): joints at huge angles or
// over huge ranges, thousands of declarations, long chains with no degree of freedom, chains with
// many degrees of freedom. Plain generators for the regression tests, and fast-check arbitraries
// of the same shapes for the fuzzer (campaign.ts, family "large").
import fc from "fast-check";

const HEAD = (title: string) => [
  `# Invented for the robustness tests: ${title}.`,
  `arm "${title}" {`,
  "  base stand {",
  "    mass 5 kg",
  "    footprint 300 mm x 300 mm",
  "    point pivot (0 mm, 300 mm)",
  "  }",
];

function link(name: string, length = "40 mm"): string[] {
  return [
    `  link ${name} {`,
    `    length ${length}`,
    "    section rect 10 mm x 4 mm",
    "    material aluminium_6061_t6",
    "  }",
  ];
}

/** One boom on a ranged joint, its angle and range written as given (`angle 1e9 deg`). */
export function boomSpec(angle: string, range: string): string {
  return [
    ...HEAD("one boom"),
    ...link("boom", "320 mm"),
    "  joint shoulder {",
    "    connects stand.pivot to boom.start",
    `    angle ${angle}`,
    `    range ${range}`,
    "  }",
    "  payload shade {",
    "    mass 350 g",
    "    at boom.end",
    "  }",
    "}",
    "",
  ].join("\n");
}

/** A chain of `links` links, each on a joint: the first `dofs` ranged (-10 .. 10 deg), the rest
 * fixed; a payload at the tip. */
export function linkChainSpec(links: number, dofs = 0): string {
  const out = HEAD(`chain of ${links} links, ${dofs} of them ranged`);
  let parent = "stand.pivot";
  for (let i = 0; i < links; i++) {
    out.push(...link(`l${i}`));
    out.push(
      `  joint j${i} {`,
      `    connects ${parent} to l${i}.start`,
      `    angle ${i % 2 ? 5 : -5} deg`,
      i < dofs ? "    range -10 deg .. 10 deg" : "    fixed",
      "  }",
    );
    parent = `l${i}.end`;
  }
  out.push("  payload tool {", "    mass 200 g", `    at ${parent}`, "  }", "}", "");
  return out.join("\n");
}

/** A base and `count` links no joint connects. */
export function unconnectedLinksSpec(count: number): string {
  const out = HEAD(`${count} unconnected links`);
  for (let i = 0; i < count; i++) out.push(...link(`l${i}`));
  out.push("}", "");
  return out.join("\n");
}

/** Angles a slip of the keyboard or a script can write: past a turn, huge, and at the limit. */
const ANGLE_WORDS = [
  "1e9 deg",
  "1e15 deg",
  "-1e14 deg",
  "361 deg",
  "360 deg",
  "-360 deg",
  "1e6 rad",
  "7 rad",
];

export const largeSpecArb: fc.Arbitrary<string> = fc.oneof(
  fc
    .record({
      angle: fc.constantFrom(...ANGLE_WORDS, "0 deg", "30 deg"),
      low: fc.constantFrom(...ANGLE_WORDS, "-30 deg", "0 deg"),
      high: fc.constantFrom(...ANGLE_WORDS, "40 deg", "1e14 deg"),
    })
    .map(({ angle, low, high }) => boomSpec(angle, `${low} .. ${high}`)),
  fc
    .tuple(fc.integer({ min: 100, max: 600 }), fc.integer({ min: 0, max: 3 }))
    .map(([links, dofs]) => linkChainSpec(links, dofs)),
  fc.integer({ min: 8, max: 14 }).map((dofs) => linkChainSpec(dofs, dofs)),
  fc.integer({ min: 1000, max: 5000 }).map(unconnectedLinksSpec),
);

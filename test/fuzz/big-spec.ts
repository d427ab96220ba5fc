// Generates large arm specs for the latency benchmark and the stress tests: a chain of
// parallelogram stages (three bodies each) alternating with plain links (one body each), every
// stage lifted by a zero-free-length spring, a payload at the tip.

export interface ChainOptions {
  /** Moving bodies wanted (the base not counted); rounded up to whole stages. */
  bodies: number;
  /** Give every parallelogram a range (a degree of freedom); links stay fixed. */
  ranges?: boolean;
  /** Poses per degree of freedom written in the `sweep` block. */
  steps?: number;
}

export function chainSpec({ bodies, ranges = true, steps = 13 }: ChainOptions): string {
  const out: string[] = [
    `# ${bodies}-body chain generated for the latency benchmark`,
    'arm "Generated chain" {',
  ];
  out.push(
    "  base stand {",
    "    mass 40 kg",
    "    footprint 600 mm x 600 mm",
    "    point pivot (0 mm, 300 mm)",
    "    point anchor (0 mm, 360 mm)",
    "  }",
  );
  let parent = "stand.pivot";
  let anchor = "stand.anchor";
  let count = 0;
  let i = 0;
  while (count < bodies) {
    const stage = `stage_${i}`;
    // Small alternating angles keep the chain folded near the base instead of reaching metres out.
    const angle = i % 2 === 0 ? 10 : -10;
    out.push(
      `  parallelogram ${stage} {`,
      `    on ${parent}`,
      "    length 120 mm",
      "    spacing 30 mm",
      `    angle ${angle} deg`,
      ranges ? `    range ${angle - 15} deg .. ${angle + 15} deg` : "    fixed",
      "    bars rect 12 mm x 4 mm aluminium_6061_t6",
      "    head_mass 10 g",
      "    pins 4 mm steel_1018",
      "  }",
      `  spring lift_${i} {`,
      "    zero_length",
      `    between ${anchor} and ${stage}.lower(40 mm, 0 mm)`,
      "    rate 0.2 N/mm",
      "  }",
    );
    count += 3;
    parent = `${stage}.head`;
    anchor = `${stage}.head(0 mm, 30 mm)`;
    if (count >= bodies) break;
    const link = `link_${i}`;
    out.push(
      `  link ${link} {`,
      "    length 40 mm",
      "    section rect 10 mm x 4 mm",
      "    material aluminium_6061_t6",
      "  }",
      `  joint joint_${i} {`,
      `    connects ${parent} to ${link}.start`,
      `    angle ${-angle} deg`,
      "    fixed",
      "  }",
    );
    count += 1;
    parent = `${link}.end`;
    anchor = `${link}.end`;
    i++;
  }
  out.push("  payload tool {", "    mass 200 g", `    at ${parent}`, "  }");
  out.push("  require {", "    balance 5 N at tool", "  }");
  out.push("  sweep {", `    steps ${steps}`, "    grid off", "  }", "}", "");
  return out.join("\n");
}

// Pins loaded out of the drawing plane where a designer reads them (issue 11): `poise results`
// adds a `joints` section with each such pin's force along it and moment across it, keeps cli.md's
// keys, and leaves it out for an arm that does not turn; the stage's hover shows the figures of
// its pins, and the record's least safety is the finding's. On the two-stage sample, whose first
// stage's pins carry the barrel's stage turned across as a couple.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { TextDocument } from "vscode-languageserver-textdocument";
import { analyse } from "../../server/src/analysis";
import { resultsOf } from "../../server/src/cli/results";
import { hoverAt } from "../../server/src/lsp/features/hover";
import { SyntaxViews } from "../../server/src/lsp/session/syntax-view";

const sample = (name: string) => readFileSync(join(__dirname, "..", "..", "samples", name), "utf8");
const text = sample("two-stage-arm.poise");
const analysis = analyse(text);

describe("pins in three dimensions in poise results and the hover", () => {
  it("a joints section carries the force along each pin and the moment across it, in the readout's figures", () => {
    const { json } = resultsOf(text, "si");
    const joints = json["joints"] as Record<string, Record<string, number | null>>;
    expect(joints).toBeDefined();
    const root = joints["first.upper_root"]!;
    const readout = analysis.readouts["first.upper_root"]!;
    const moment = readout.figures.find((f) => f.label === "largest moment across the pin")!;
    const along = readout.figures.find((f) => f.label === "largest force along the pin")!;
    // SI table units (cli.md): torque in N*m, force in N, six significant figures
    expect(root["moment_across_pin"]).toBeCloseTo(moment.value, 4);
    expect(root["force_along_pin"]).toBeCloseTo(along.value, 4);
    expect(moment.value).toBeGreaterThan(0);
    // cli.md's keys stay
    for (const key of ["units", "parts", "payloads", "frequency", "base", "swivels", "fastenings", "springs"])
      expect(json).toHaveProperty(key);
  });

  it("the pin's least safety in parts is the one its finding reports", () => {
    const { json } = resultsOf(text, "si");
    const parts = json["parts"] as Record<string, { safety: number; check: string; where?: string }>;
    const f = analysis.findings.find(
      (x) => x.code === "strength.overstress" && x.data.subject === "first.upper_root",
    )!;
    expect(f.message).toMatch(/across its axis|tilted in the hole/);
    expect(parts["first.upper_root"]).toMatchObject({ check: "pin" });
    expect(parts["first.upper_root"]!.safety).toBeCloseTo((f.data as { safety: number }).safety, 4);
    expect(parts["first.upper_root"]!.where).toContain("barrel turned");
  });

  it("an arm that does not turn has no joints section", () => {
    const { json } = resultsOf(sample("camera-arm.poise"), "si");
    expect(json).not.toHaveProperty("joints");
  });

  it("hovering the stage shows its pins' moments across them", () => {
    const uri = "file:///work/two-stage-arm.poise";
    const view = new SyntaxViews().view(TextDocument.create(uri, "counterpoise", 1, text), [], analysis);
    const offset = text.indexOf("parallelogram first") + "parallelogram ".length;
    const hover = hoverAt(view, offset, analysis, analysis, "si");
    const value = (hover?.contents as { value: string }).value;
    expect(value).toContain("pin of first.upper_root: largest moment across the pin");
  });
});

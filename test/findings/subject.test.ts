// The findings contract on every sample and fixture: a finding's subject is a model id, and it is
// the part whose declaration holds the words the finding points at (so the view and hover may read
// the subject instead of comparing spans); codes about a part always name one.
import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { analyse } from "../../server/src/analysis";
import type { ArmModel, Origin } from "../../server/src/model/types";
import type { Code } from "../../server/src/findings/codes";

const ROOT = join(__dirname, "..", "..");

function poiseFiles(dir: string): string[] {
  return readdirSync(dir)
    .sort()
    .flatMap((name) => {
      const path = join(dir, name);
      return statSync(path).isDirectory() ? poiseFiles(path) : name.endsWith(".poise") ? [path] : [];
    });
}

/** Codes whose data type makes `subject` required (findings/data.ts: AboutPart and its kin). */
const ABOUT_A_PART: Code[] = [
  "joint.unheld",
  "body.unconnected",
  "geometry.loop-open",
  "balance.unbalanced",
  "balance.drifts",
  "geometry.spring-toggle",
  "geometry.spring-leverage",
  "geometry.spring-slack",
  "geometry.tilt",
  "geometry.clearance",
  "geometry.tipping",
  "strength.overstress",
  "strength.overstretch",
  "stiffness.deflection",
  "stiffness.tilt",
];

/** Every id of the model, with the declaration its words are in (generated parts: the stage's). */
function declarationsById(model: ArmModel): Map<string, Origin> {
  const out = new Map<string, Origin>();
  const stage = (o: Origin) => model.parallelograms.find((p) => p.id === o.generatedBy)?.origin ?? o;
  for (const p of model.parallelograms) out.set(p.id, p.origin);
  for (const b of model.bodies) if (!out.has(b.id)) out.set(b.id, stage(b.origin));
  for (const j of model.joints) if (!out.has(j.id)) out.set(j.id, stage(j.origin));
  for (const s of model.springs) out.set(s.id, s.origin);
  for (const p of model.payloads) out.set(p.id, p.origin);
  return out;
}

const files = [...poiseFiles(join(ROOT, "samples")), ...poiseFiles(join(ROOT, "test", "fixtures"))];

describe("a finding's subject", () => {
  it.each(files.map((f) => [relative(ROOT, f), f]))("%s", (_name, file) => {
    const text = readFileSync(file, "utf8");
    const analysis = analyse(text, /^#\s*fixture:\s*model-only\s*$/m.test(text) ? { modelOnly: true } : {});
    const model = analysis.model;
    const parts = model ? declarationsById(model) : new Map<string, Origin>();
    for (const f of analysis.findings) {
      const what = `${f.code} at ${f.span.start}: ${f.message}`;
      if (ABOUT_A_PART.includes(f.code)) expect(f.data.subject, what).toBeTypeOf("string");
      const subject = f.data.subject;
      if (subject !== undefined && model && !model.materials[subject] && parts.has(subject)) {
        // The words it points at are in its subject's declaration.
        const d = parts.get(subject)!.declaration;
        expect(f.span.start, what).toBeGreaterThanOrEqual(d.start);
        expect(f.span.start, what).toBeLessThanOrEqual(d.end);
      }
      // A finding in the words of a part names that part (or a body or joint it generates).
      let holder: { id: string; size: number } | undefined;
      for (const [id, o] of parts) {
        const d = o.declaration;
        if (f.span.start >= d.start && f.span.start < d.end && (!holder || d.end - d.start < holder.size))
          holder = { id, size: d.end - d.start };
      }
      if (holder) expect(subject?.split(".")[0], what).toBe(holder.id.split(".")[0]);
    }
  });
});

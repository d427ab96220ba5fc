// The worker's copy of an analysis for the server keeps what the server reads: the status bar's
// worst hand force (the same figure and payload as from the whole sweep), the pose count of the
// log line, the quick-pass flag, the readouts and findings; and it leaves the worker's own
// analysis whole (the drawing panel is built from it).
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { serverCopy } from "../../server/src/lsp/session/server-copy";
import { worstHandForce } from "../../server/src/lsp/features/summary";
import { chainSpec } from "../fuzz/big-spec";

const ROOT = join(__dirname, "..", "..");

describe("the server's copy of an analysis", () => {
  const texts: [string, string][] = [
    ["engraver-arm", readFileSync(join(ROOT, "samples", "engraver-arm.poise"), "utf8")],
    ["60-body chain", chainSpec({ bodies: 60 })],
  ];
  for (const [name, text] of texts) {
    it(`keeps what the server reads of the ${name}`, () => {
      const whole = analyse(text, { quickSteps: 4 });
      const bodiesBefore = Object.keys(whole.sweep!.poses[0]!.bodies).length;
      const copy = serverCopy(whole);
      expect(worstHandForce(copy)).toEqual(worstHandForce(whole));
      expect(worstHandForce(copy)).toBeDefined();
      expect(copy.sweep!.poses.length).toBe(whole.sweep!.poses.length);
      expect(copy.sweep!.quick).toBe(whole.sweep!.quick);
      expect(copy.readouts).toBe(whole.readouts);
      expect(copy.findings).toBe(whole.findings);
      expect(copy.sweep!.poses[0]!.bodies).toEqual({});
      // The worker's own analysis is not touched.
      expect(Object.keys(whole.sweep!.poses[0]!.bodies).length).toBe(bodiesBefore);
      expect(bodiesBefore).toBeGreaterThan(0);
    });
  }
});

// The tune run in the arm drawing, through the real server over stdio (issue 13, the preview):
// the tune command with `{ write: false }` writes nothing, offers to write, and the drawing's
// request then carries the tuned spring beside the present one, the other design's hand force
// and the anchor locus; once the tuned text is in the editor, the roles turn round. Checked
// against k a b = m g l (docs/formulas.md), computed here.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  ExecuteCommandRequest,
  ApplyWorkspaceEditRequest,
  ShowMessageRequest,
  type ShowMessageRequestParams,
} from "vscode-languageserver-protocol/node";
import { ProtocolSession, ensureBuilt } from "./protocol-client";
import { TUNE_COMMAND, type TuneCommandResult } from "../../server/src/lsp/custom-protocol";
import { ARM_VIEW_REQUEST, type ArmViewResult } from "../../server/src/lsp/preview-protocol";
import { pivotSpec } from "../tune/pivot-spec";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;
const [A, B, L, M, K] = [0.05, 0.1, 0.4, 1, 500];

const LAMP = pivotSpec({
  a: A * 1000,
  b: B * 1000,
  l: L * 1000,
  m: M,
  rate: `${K / 1000} N/mm`,
  tune: "tune anchor (0 mm, 310 mm) .. (0 mm, 450 mm)",
});

let session: ProtocolSession;
let edits = 0;
const offers: ShowMessageRequestParams[] = [];

beforeAll(async () => {
  ensureBuilt();
  session = new ProtocolSession({ stepsWhileTyping: 0, diagnosticsDelayMs: 10 });
  session.connection.onRequest(ApplyWorkspaceEditRequest.type, () => {
    edits++;
    return { applied: true };
  });
  session.connection.onRequest(ShowMessageRequest.type, (p) => {
    offers.push(p);
    return null; // the user dismisses the offer
  });
  session.connection.onNotification("window/showMessage", () => {});
  session.connection.onNotification("$/progress", () => {});
  await session.initialize();
}, 120000);

afterAll(async () => {
  await session?.stop();
});

describe("the tune run in the arm drawing", () => {
  const uri = "file:///work/lamp-preview.poise";
  // Streit and Gilmore 1989; Herder 2001 (docs/formulas.md): exact balance at a = m g l / (k b)
  const exactA = (M * G0 * L) / (K * B);

  it("shows the tuned anchor beside the present one without writing it", async () => {
    await session.open(uri, LAMP, 1);
    const plain = (await session.connection.sendRequest(ARM_VIEW_REQUEST, { uri })) as ArmViewResult;
    expect(plain?.tune).toBeUndefined(); // no run asked for yet: no overlay
    const result = (await session.connection.sendRequest(ExecuteCommandRequest.type, {
      command: TUNE_COMMAND,
      arguments: [uri, { write: false }],
    })) as TuneCommandResult;
    expect(result.improved).toBe(true);
    expect(result.applied).toBe(false);
    expect(edits).toBe(0);
    await expect.poll(() => offers.length).toBe(1);
    expect(offers[0]!.actions?.map((a) => a.title)).toEqual(["Write the tuned values"]);

    const vm = (await session.connection.sendRequest(ARM_VIEW_REQUEST, { uri })) as ArmViewResult;
    const tune = vm!.tune!;
    expect(tune.textIs).toBe("present");
    expect(tune.otherLabel).toBe("as tuned");
    const lift = tune.springs.find((s) => s.id === "lift")!;
    expect(lift.moved).toBe(true);
    // The tuned anchor on the post at a = m g l / (k b) above the pivot, written to four figures
    expect(lift.other![0].body).toBe("post");
    expect(lift.other![0].local[0]).toBeCloseTo(0, 9);
    expect(lift.other![0].local[1]).toBeCloseTo(Number((0.3 + exactA).toPrecision(4)), 9);
    // The tuned design's hand force at each pose: (m g l - k a' b) cos(theta) / l with the written a'
    const a = Number((0.3 + exactA).toPrecision(4)) - 0.3;
    vm!.poses.forEach((pose, i) => {
      const expected = ((M * G0 * L - K * a * B) * Math.cos(pose.angles[0]!)) / L;
      expect(tune.otherHandForce[i]!.weight).toBeCloseTo(expected, 3);
    });
    // The present design's locus: the exact point straight above the pivot at a = m g l / (k b)
    const locus = tune.locus.find((l) => l.spring === "lift")!;
    expect(locus.exact.length).toBeGreaterThan(0);
    for (const [x, y] of locus.exact) {
      expect(Math.abs(x)).toBeLessThan(1e-9);
      expect(Math.abs((K * (y - 0.3) * B) / (M * G0 * L) - 1)).toBeLessThan(1e-6);
    }
  }, 60000);

  it("turns the roles round once the tuned values are in the text", async () => {
    const a = Number(((0.3 + exactA) * 1000).toPrecision(4));
    const tuned = LAMP.replace("point anchor (0 mm, 350 mm)", `point anchor (0 mm, ${a} mm)`);
    await session.replace(uri, tuned, 2);
    const vm = (await session.connection.sendRequest(ARM_VIEW_REQUEST, { uri })) as ArmViewResult;
    expect(vm!.tune?.textIs).toBe("tuned");
    expect(vm!.tune!.otherLabel).toBe("before tuning");
    // The other design is the one before tuning: its anchor 50 mm above the pivot, its hand force
    // (m g l - k a b) cos(theta) / l
    const lift = vm!.tune!.springs.find((s) => s.id === "lift")!;
    expect(lift.other![0].local[1]).toBeCloseTo(0.3 + A, 9);
    vm!.poses.forEach((pose, i) =>
      expect(vm!.tune!.otherHandForce[i]!.weight).toBeCloseTo(
        ((M * G0 * L - K * A * B) * Math.cos(pose.angles[0]!)) / L,
        3,
      ),
    );
    // Any other text: no overlay
    await session.replace(uri, tuned.replace("mass 1 kg", "mass 1.1 kg"), 3);
    const other = (await session.connection.sendRequest(ARM_VIEW_REQUEST, { uri })) as ArmViewResult;
    expect(other!.tune).toBeUndefined();
  }, 60000);
});

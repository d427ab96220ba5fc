// Hand force beyond friction, signed (issue 10 item 4): the hand supplies only the holding torque
// a pivot's friction does not hold, and the force says whether the arm sinks (+) or rises (-).
// Checked on a pivoting link with a real extension spring against docs/formulas.md's closed form
// (gravity balancing: tau(theta) = m g l cos(theta) - (Fi + k (L - L0)) a b cos(theta) / L,
// L = sqrt(a^2 + b^2 - 2 a b sin(theta)); Herder 2001), with Coulomb friction holding up to f
// either way (common statics). The drift finding names each run's own direction.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { buildResults } from "../../server/src/checks/results";
import { isCode } from "../../server/src/findings/finding";
import { bestSpringFit } from "../../server/src/mechanics/spring-fit";
import { G, a, b, friction, holdingTorque, k, l, m, signedHandForce, spec } from "./pivot-with-friction";

describe("a pivoting link with friction that sinks low and rises high", () => {
  const analysis = analyse(spec);
  const angles = analysis.sweep!.poses.map((p) => p.angles["shoulder"]!);

  it("holds torques as the closed form gives them", () => {
    for (const pose of analysis.sweep!.poses)
      // docs/formulas.md, gravity balancing (Herder 2001)
      expect(pose.cases[0]!.holdingTorque["shoulder"]).toBeCloseTo(
        holdingTorque(pose.angles["shoulder"]!),
        9,
      );
  });

  it("gives the hand force beyond friction, signed, and both ends of its range", () => {
    for (const pose of analysis.sweep!.poses) {
      const theta = pose.angles["shoulder"]!;
      // Coulomb friction on the pivot, then statics at the payload (above)
      expect(pose.cases[0]!.handForce["lamp"]).toBeCloseTo(Math.abs(signedHandForce(theta)), 9);
    }
    const expected = angles.map((t) => signedHandForce(t));
    const least = Math.min(...expected);
    const greatest = Math.max(...expected);
    expect(least).toBeLessThan(0); // it rises somewhere...
    expect(greatest).toBeGreaterThan(0); // ...and sinks elsewhere
    const fig = analysis.readouts["lamp"]!.figures.find((f) => f.result?.key === "hand_force")!;
    expect(fig.value).toBeCloseTo(least, 9);
    expect(fig.high).toBeCloseTo(greatest, 9);
    const record = buildResults(analysis);
    expect(record.sections["payloads"]!["lamp"]!["hand_force"]).toMatchObject({
      value: fig.value,
      high: fig.high,
    });
  });

  it("says each run of the drift turns its own way", () => {
    const f = analysis.findings.find(isCode("balance.drifts"))!;
    // Low in the range tau > f: the hand must add counter-clockwise torque, so the arm turns
    // clockwise (sinks); high in the range tau < -f: it turns counter-clockwise (rises).
    expect(f.data.turns).toEqual(["clockwise", "counter-clockwise"]);
    expect(f.message).toMatch(
      /clockwise over -60 deg \.\. -?[\d.]+ deg, counter-clockwise over -?[\d.]+ deg \.\. 60 deg/,
    );
    const [low, high] = f.data.ranges;
    // Each run is where |tau| > f, on the swept angles
    expect(angles.filter((t) => holdingTorque(t) > friction).every((t) => t >= low![0] && t <= low![1])).toBe(
      true,
    );
    expect(
      angles.filter((t) => holdingTorque(t) < -friction).every((t) => t >= high![0] && t <= high![1]),
    ).toBe(true);
  });
});

describe("a pivot whose friction holds the whole range", () => {
  // With friction above the largest |holding torque| over the range (closed form above), the hand
  // supplies nothing anywhere: the readout says so instead of naming one pose for both ends.
  const angles = Array.from({ length: 121 }, (_, i) => ((-60 + i) * Math.PI) / 180);
  const most = Math.max(...angles.map((t) => Math.abs(holdingTorque(t))));
  const held = analyse(spec.replace(/friction [\d.]+ N\*m/, `friction ${(most * 1.5).toFixed(4)} N*m`));
  it("reads 0 .. 0, none needed at any pose", () => {
    const fig = held.readouts["lamp"]!.figures.find((f) => f.result?.key === "hand_force")!;
    expect([fig.value, fig.high]).toEqual([0, 0]);
    expect(fig.where).toBe("none needed at any pose");
  });
});

describe("the best fit counts friction as free", () => {
  // Zero-length spring at half the ideal rate, friction f at the pivot: tau = (m g l - k a b)
  // cos(theta) (Streit and Gilmore 1989). Any rate with |m g l - k a b| <= f holds the arm
  // everywhere, so the best worst hand force is zero, where without friction it is not.
  const f = 0.3;
  const ideal = (m * G * l) / (a * b);
  const text = spec
    .replace(/extension\n/, "zero_length\n")
    .replace(/rate [\d.e-]+ N\/mm/, `rate ${ideal / 2 / 1000} N/mm`)
    .replace(/ *free_length .*\n/, "")
    .replace(/ *initial_tension .*\n/, "")
    .replace(/friction [\d.]+ N\*m/, `friction ${f} N*m`);
  it("fits to zero hand force, from the closed form's before", () => {
    const analysis = analyse(text);
    const fit = bestSpringFit(analysis.model!, analysis.sweep!, "lift")!;
    const angles = analysis.sweep!.poses.map((p) => p.angles["shoulder"]!);
    // Before: max over the swept angles of (|m g l - k a b| cos(theta) - f) / l
    const before = Math.max(
      ...angles.map((t) => Math.max(0, (m * G * l - (ideal / 2) * a * b) * Math.cos(t) - f) / l),
    );
    expect(fit.worstHandForceBefore).toBeCloseTo(before, 9);
    expect(fit.worstHandForceAfter).toBeLessThan(1e-6);
  });
});

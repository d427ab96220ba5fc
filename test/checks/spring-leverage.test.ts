// geometry.spring-leverage (issue 10 item 2): a spring nearly in line with its pivot pulls many
// times the weight it balances. The force, the pin's load and the bar's compression are checked
// against the pivoting-link geometry of docs/formulas.md (Streit and Gilmore 1989; Herder 2001) and
// plain statics; the textbook balancer of the same references is not flagged.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { analyse } from "../../server/src/analysis";
import { isCode } from "../../server/src/findings/finding";
import { SPRING_FORCE_RATIO_LIMIT } from "../../server/src/checks/spring-leverage";

const G = 9.80665; // standard gravity (SI Brochure, 9th ed.)
const deg = Math.PI / 180;

describe("a zero-length spring anchored 3 mm above the pivot", () => {
  const text = readFileSync("test/fixtures/checks/inline-spring.poise", "utf8");
  const [k, a, b, m] = [13.08e3, 0.003, 0.1, 1];
  const ends = [-40 * deg, 40 * deg];
  const f = analyse(text).findings.find(isCode("geometry.spring-leverage"))!;

  it("is flagged with its pull against the weight", () => {
    expect(f).toBeDefined();
    // docs/formulas.md, gravity balancing: spring length L = sqrt(a^2 + b^2 - 2 a b sin(theta)) with
    // theta from the horizontal; a zero-length spring pulls F = k L, largest at the low end
    const L = (t: number) => Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(t));
    const force = Math.max(...ends.map((t) => k * L(t)));
    expect(f.data.force).toBeCloseTo(force, 6);
    expect(f.data.weight).toBeCloseTo(m * G, 9);
    expect(f.data.ratio).toBeGreaterThan(SPRING_FORCE_RATIO_LIMIT);
    expect(f.message).toContain(`pulls ${Math.round(force)} N to hold 9.807 N of weight`);
  });

  it("says what the pull does to the pin and the boom (statics)", () => {
    // The pull on the hook, k (anchor - hook) = k (-b cos t, a - b sin t); the pin's reaction
    // balances it and the weight m g (the holding torque is a couple): |R| largest at an end.
    const pin = (t: number) => Math.hypot(k * b * Math.cos(t), k * (a - b * Math.sin(t)) - m * G);
    expect(f.data.pinReaction).toBeCloseTo(Math.max(...ends.map(pin)), 6);
    // Its component along the boom toward the pivot squeezes the boom: k (b - a sin t).
    expect(f.data.compression).toBeCloseTo(Math.max(...ends.map((t) => k * (b - a * Math.sin(t)))), 6);
    expect(f.data.body).toBe("boom");
    expect(f.message).toMatch(/the pin of shoulder carries up to \d+ N/);
    expect(f.message).toMatch(/link boom is squeezed by up to \d+ N/);
  });
});

it("leaves the textbook balancer alone (docs/formulas.md worked example)", () => {
  // m = 1 kg at l = 0.4 m, anchor a = 0.05 m above the pivot, hook b = 0.1 m along the link,
  // k a b = m g l (Streit and Gilmore 1989): it pulls at most k (a + b), about 12 times the weight
  const k = (1 * G * 0.4) / (0.05 * 0.1);
  const text = `# Invented: the balanced pivoting link of the references (issue 10 item 2).
arm "Balanced link" {
  base post {
    mass 20 kg
    footprint 400 mm x 400 mm
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 350 mm)
  }
  link boom {
    length 400 mm
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -80 deg .. 80 deg
  }
  spring lift {
    zero_length
    between post.anchor and boom(100 mm, 0 mm)
    rate ${k / 1000} N/mm
  }
  payload lamp {
    mass 1 kg
    at boom.end
  }
}
`;
  const analysis = analyse(text);
  expect(analysis.findings.filter(isCode("geometry.spring-leverage"))).toEqual([]);
  expect(analysis.findings.filter((x) => x.severity === "error")).toEqual([]);
});

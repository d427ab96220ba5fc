// `poise results` as docs/cli.md fixes it (issue 10 item 8): every figure behind the checks, pass or
// fail, in docs/cli.md's JSON shape, in the units it names; checked against closed forms on a held
// cantilever, and on every sample for its shape and exit status.
import { beforeAll, describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { analyse } from "../../server/src/analysis";
import { resultsOf } from "../../server/src/cli/results";
import { ensureBuilt, poise, specFile } from "./run-cli";

beforeAll(() => ensureBuilt());

interface ResultsJson {
  units: Record<string, string>;
  parts: Record<string, { safety: number; check: string; where?: string }>;
  payloads: Record<
    string,
    {
      hand_force: [number, number] | null;
      deflection: number | null;
      tilt: number | null;
      lean: number | null;
    }
  >;
  frequency: number | null;
  base: { tipping_safety: number | null };
  swivels: Record<string, unknown>;
  fastenings: Record<string, unknown>;
  springs: Record<
    string,
    { force: [number, number] | null; length: [number, number] | null; safety: number | null }
  >;
}

// A boom held level at its shoulder, massless, carrying 1 kg at its end: a cantilever with a tip
// load, which passes every requirement (so the figures are there although nothing fails).
const L = 0.4;
const OD = 0.02;
const WALL = 0.002;
const E = 68.9e9; // aluminium 6061-T6 as the built-in material gives it (docs/materials.md)
const CANTILEVER = `# Invented: a held boom carrying a 1 kg lamp at its end (issue 10 item 8).
arm "Held boom" {
  base post {
    mass 20 kg
    footprint 400 mm x 400 mm
    point pivot (0 mm, 300 mm)
  }
  link boom {
    length ${L * 1000} mm
    section tube ${OD * 1000} mm x ${WALL * 1000} mm
    material aluminium_6061_t6
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -1 deg .. 1 deg
    pin 6 mm steel_1018
  }
  payload lamp {
    mass 1 kg
    at boom.end
  }
  require {
    balance 20 N
    deflection 5 mm
    tilt 2 deg
  }
}
`;

function results(file: string, ...args: string[]): { json: ResultsJson; status: number | null } {
  const r = poise("results", file, "--json", ...args);
  return { json: JSON.parse(r.stdout) as ResultsJson, status: r.status };
}

// Spawns the bundled command several times: generous on a machine shared by many runs.
describe("poise results", { timeout: 120_000 }, () => {
  const file = specFile("held-boom.poise", CANTILEVER);

  it("gives deflection, tilt and frequency of a passing arm, against closed forms", () => {
    const { json, status } = results(file);
    expect(status).toBe(0);
    expect(json.units).toMatchObject({
      length: "mm",
      force: "N",
      torque: "N*m",
      angle: "deg",
      frequency: "Hz",
    });
    const P = 1 * 9.80665;
    const I = (Math.PI / 64) * (OD ** 4 - (OD - 2 * WALL) ** 4);
    const lamp = json.payloads["lamp"]!;
    // Roark 8th ed., table 8.1 case 1a: tip deflection W l^3 / (3 E I), tip slope W l^2 / (2 E I)
    expect(lamp.deflection! / 1000).toBeCloseTo((P * L ** 3) / (3 * E * I), 6);
    expect((lamp.tilt! * Math.PI) / 180).toBeCloseTo((P * L ** 2) / (2 * E * I), 6);
    // A massless cantilever with a tip mass M is one degree of freedom: f = sqrt(3 E I / (l^3 M)) / (2 pi)
    // (Thomson and Dahleh, Theory of Vibration with Applications, 5th ed., ch. 2)
    const f = Math.sqrt((3 * E * I) / L ** 3 / 1) / (2 * Math.PI);
    expect(Math.abs(json.frequency! - f) / f).toBeLessThan(1e-4);
    expect(lamp.lean).toBeNull();
    // Held level, the hand holds the whole weight: m g at the reference pose (statics)
    expect(Math.max(...lamp.hand_force!.map(Math.abs))).toBeCloseTo(P, 3);
    expect(json.parts["shoulder"]!.check).toBe("pin");
  });

  it("switches to US customary units with --units us and names them", () => {
    const si = results(file).json;
    const us = results(file, "--units", "us").json;
    expect(us.units).toMatchObject({ length: "in", force: "lbf", torque: "lbf*in", angle: "deg" });
    // 1 in = 25.4 mm and 1 lbf = 4.4482216152605 N exactly (NIST SP 811, appendix B)
    expect(us.payloads["lamp"]!.deflection!).toBeCloseTo(si.payloads["lamp"]!.deflection! / 25.4, 5);
    expect(us.payloads["lamp"]!.hand_force![1]).toBeCloseTo(
      si.payloads["lamp"]!.hand_force![1] / 4.4482216152605,
      4,
    );
    expect(us.frequency).toBe(si.frequency);
  });

  it("has docs/cli.md's keys for every sample, and exits 1 exactly when the spec has errors", () => {
    // The record in process for every sample (spawning one command each is slow on a busy machine),
    // the command itself for one sample without errors and one with.
    for (const name of readdirSync("samples").filter((f) => f.endsWith(".poise"))) {
      const text = readFileSync(`samples/${name}`, "utf8");
      const json = resultsOf(text, "si").json as unknown as ResultsJson;
      for (const key of [
        "units",
        "parts",
        "payloads",
        "frequency",
        "base",
        "swivels",
        "fastenings",
        "springs",
      ])
        expect(json, `${name}: ${key}`).toHaveProperty(key);
      for (const p of Object.values(json.payloads))
        expect(Object.keys(p)).toEqual(expect.arrayContaining(["hand_force", "deflection", "tilt", "lean"]));
      for (const s of Object.values(json.springs))
        expect(Object.keys(s)).toEqual(expect.arrayContaining(["force", "length", "safety"]));
      expect(json.base).toHaveProperty("tipping_safety");
    }
    for (const name of ["camera-arm", "lamp-arm"]) {
      const path = `samples/${name}.poise`;
      const errors = analyse(readFileSync(path, "utf8")).findings.filter(
        (f) => f.severity === "error",
      ).length;
      expect(poise("results", path, "--json").status, path).toBe(errors > 0 ? 1 : 0);
    }
  });

  it("prints lines to read without --json, and exits 2 when it cannot run", () => {
    const r = poise("results", file);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(
      /lamp\s+hand force -?[\d.]+ \.\. -?[\d.]+ N; deflection [\d.]+ mm; tilt [\d.]+ deg/,
    );
    expect(r.stdout).toMatch(/^frequency [\d.]+ Hz$/m);
    expect(poise("results", "no-such-file.poise").status).toBe(2);
    expect(poise("results", file, "--units", "furlongs").status).toBe(2);
    expect(poise("results").status).toBe(2);
  });
});

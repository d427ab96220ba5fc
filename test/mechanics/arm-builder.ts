// Builds ArmModel values directly in tests (SI units), without the parser: bodies, joints,
// parallelograms laid out as the conventions say, springs and payloads.
import type { ArmModel, Body, Joint, Origin, Payload, Spring, Vec2 } from "../../server/src/model/types";
import { REQUIREMENT_DEFAULTS } from "../../server/src/model/schema";

export const G0 = 9.80665;

let spanCounter = 0;
/** Distinct spans so tests can tell which words a finding points at. */
export function origin(keys: string[] = []): Origin {
  const start = (spanCounter += 100);
  const properties: Record<string, { start: number; end: number }> = {};
  keys.forEach((k, i) => (properties[k] = { start: start + 10 + 5 * i, end: start + 14 + 5 * i }));
  return { declaration: { start, end: start + 90 }, name: { start: start + 1, end: start + 5 }, properties };
}

export type Mode = { range: [number, number] } | "fixed" | "passive";
export const deg = (d: number) => (d * Math.PI) / 180;

export class ArmBuilder {
  readonly model: ArmModel;
  constructor(baseId = "ground", basePoints: Record<string, Vec2> = {}) {
    this.model = {
      title: "test arm",
      gravity: G0,
      base: { bodyId: baseId, mass: 0, yaw: false, surface: 0 },
      bodies: [
        {
          id: baseId,
          kind: "base",
          length: 0,
          mass: 0,
          massGiven: true,
          centreOfMass: { x: 0, y: 0 },
          points: { ...basePoints },
          origin: origin(),
        },
      ],
      joints: [],
      parallelograms: [],
      springs: [],
      payloads: [],
      materials: {
        latex: {
          id: "latex",
          density: 930,
          modulus: 1.2e6,
          shearModulus: 0.4e6,
          poisson: 0.5,
          strength: 20e6,
          printed: false,
          builtin: true,
        },
      },
      bearings: {},
      fastenings: {},
      require: {
        balance: { default: REQUIREMENT_DEFAULTS.balanceN, byPayload: {} },
        safety: REQUIREMENT_DEFAULTS.safety,
        tilt: { default: REQUIREMENT_DEFAULTS.tiltRad, byPayload: {} },
        deflection: { default: REQUIREMENT_DEFAULTS.deflectionM, byPayload: {} },
        frequency: REQUIREMENT_DEFAULTS.frequencyHz,
        tipping: REQUIREMENT_DEFAULTS.tipping,
        clearance: REQUIREMENT_DEFAULTS.clearanceM,
      },
      sweep: { steps: 37, grid: true },
      span: { start: 0, end: 10 },
    };
  }

  get baseId(): string {
    return this.model.bodies[0]!.id;
  }

  link(
    id: string,
    length: number,
    mass: number,
    extra: { com?: Vec2; points?: Record<string, Vec2> } = {},
  ): this {
    const body: Body = {
      id,
      kind: "link",
      length,
      mass,
      massGiven: true,
      centreOfMass: extra.com ?? { x: length / 2, y: 0 },
      points: { start: { x: 0, y: 0 }, end: { x: length, y: 0 }, ...(extra.points ?? {}) },
      origin: origin(["length", "mass"]),
    };
    this.model.bodies.push(body);
    return this;
  }

  joint(
    id: string,
    parent: string,
    parentPoint: Vec2,
    child: string,
    childPoint: Vec2,
    angle: number,
    mode: Mode,
    friction?: number,
  ): this {
    const j: Joint = {
      id,
      parent,
      child,
      parentPoint,
      childPoint,
      angle,
      mode: mode === "fixed" || mode === "passive" ? mode : "range",
      ...(typeof mode === "object" ? { range: mode.range } : {}),
      ...(friction !== undefined ? { friction } : {}),
      origin: origin(["connects", "angle", "range", "friction"]),
    };
    this.model.joints.push(j);
    return this;
  }

  /** A parallelogram stage as the conventions lay it out. */
  parallelogram(
    id: string,
    parent: string,
    root: Vec2,
    p: {
      length: number;
      spacing: number;
      angle: number;
      range?: [number, number];
      barMass: number;
      headMass: number;
      upperLength?: number;
      headCom?: Vec2;
      friction?: number;
    },
  ): this {
    const o = origin(["on", "length", "spacing", "angle", "range", "friction"]);
    const upperLength = p.upperLength ?? p.length;
    const bar = (bid: string, len: number): Body => ({
      id: bid,
      kind: "bar",
      length: len,
      mass: p.barMass,
      massGiven: true,
      centreOfMass: { x: len / 2, y: 0 },
      points: { start: { x: 0, y: 0 }, end: { x: len, y: 0 } },
      origin: { ...o, generatedBy: id },
    });
    this.model.bodies.push(bar(`${id}.lower`, p.length), bar(`${id}.upper`, upperLength), {
      id: `${id}.head`,
      kind: "head",
      length: 0,
      mass: p.headMass,
      massGiven: true,
      centreOfMass: p.headCom ?? { x: 0, y: p.spacing / 2 },
      points: {},
      origin: { ...o, generatedBy: id },
    });
    const jo = { ...o, generatedBy: id };
    const upperRoot = { x: root.x, y: root.y + p.spacing };
    this.model.joints.push(
      {
        id,
        parent,
        child: `${id}.lower`,
        parentPoint: root,
        childPoint: { x: 0, y: 0 },
        angle: p.angle,
        mode: p.range ? "range" : "fixed",
        ...(p.range ? { range: p.range } : {}),
        ...(p.friction !== undefined ? { friction: p.friction } : {}),
        origin: jo,
      },
      {
        id: `${id}.upper_root`,
        parent,
        child: `${id}.upper`,
        parentPoint: upperRoot,
        childPoint: { x: 0, y: 0 },
        angle: p.angle,
        mode: "passive",
        origin: jo,
      },
      {
        id: `${id}.lower_far`,
        parent: `${id}.lower`,
        child: `${id}.head`,
        parentPoint: { x: p.length, y: 0 },
        childPoint: { x: 0, y: 0 },
        angle: -p.angle,
        mode: "passive",
        origin: jo,
      },
      {
        id: `${id}.upper_far`,
        parent: `${id}.upper`,
        child: `${id}.head`,
        parentPoint: { x: upperLength, y: 0 },
        childPoint: { x: 0, y: p.spacing },
        angle: -p.angle,
        mode: "passive",
        origin: jo,
      },
    );
    this.model.parallelograms.push({
      id,
      parent,
      rootPoint: root,
      length: p.length,
      upperLength,
      spacing: p.spacing,
      angle: p.angle,
      ...(p.range ? { range: p.range } : {}),
      joints: {
        lowerRoot: id,
        upperRoot: `${id}.upper_root`,
        lowerFar: `${id}.lower_far`,
        upperFar: `${id}.upper_far`,
      },
      bodies: { lower: `${id}.lower`, upper: `${id}.upper`, head: `${id}.head` },
      origin: o,
    });
    return this;
  }

  private attach(body: string, point: Vec2) {
    return { body, point, span: { start: 1, end: 2 } };
  }

  spring(s: Spring): this {
    this.model.springs.push(s);
    return this;
  }

  extension(
    id: string,
    a: [string, Vec2],
    b: [string, Vec2],
    rate: number,
    freeLength: number,
    initialTension: number,
  ): this {
    return this.spring({
      id,
      kind: "extension",
      a: this.attach(...a),
      b: this.attach(...b),
      rate,
      freeLength,
      initialTension,
      origin: origin(["rate", "free_length", "initial_tension"]),
    });
  }

  zeroLength(id: string, a: [string, Vec2], b: [string, Vec2], rate: number, initialTension = 0): this {
    return this.spring({
      id,
      kind: "zero_length",
      a: this.attach(...a),
      b: this.attach(...b),
      rate,
      initialTension,
      origin: origin(["rate", "initial_tension"]),
    });
  }

  elastic(id: string, a: [string, Vec2], b: [string, Vec2], freeLength: number, area: number): this {
    return this.spring({
      id,
      kind: "elastic",
      a: this.attach(...a),
      b: this.attach(...b),
      freeLength,
      area,
      material: "latex",
      origin: origin(["free_length", "tube"]),
    });
  }

  gas(
    id: string,
    a: [string, Vec2],
    b: [string, Vec2],
    force: number,
    progression: number,
    stroke: number,
    extendedLength: number,
  ): this {
    return this.spring({
      id,
      kind: "gas",
      a: this.attach(...a),
      b: this.attach(...b),
      force,
      progression,
      stroke,
      extendedLength,
      origin: origin(["force"]),
    });
  }

  torsion(id: string, joint: string, rate: number, preloadTorque: number): this {
    return this.spring({
      id,
      kind: "torsion",
      joint,
      rate,
      preloadTorque,
      origin: origin(["rate", "preload"]),
    });
  }

  payload(
    id: string,
    body: string,
    point: Vec2,
    mass: number,
    extra: { massRange?: [number, number]; force?: Vec2 } = {},
  ): this {
    const p: Payload = { id, body, point, mass, ...extra, origin: origin(["mass", "at", "range"]) };
    this.model.payloads.push(p);
    return this;
  }

  sweep(steps: number, grid = true): this {
    this.model.sweep = { steps, grid };
    return this;
  }

  balance(limitN: number, payload?: string): this {
    if (payload) this.model.require.balance.byPayload[payload] = limitN;
    else this.model.require.balance.default = limitN;
    return this;
  }

  build(): ArmModel {
    return this.model;
  }
}

/** Seeded pseudo-random numbers in [0, 1) (mulberry32), for repeatable random linkages. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// Builds the rigid parts of the arm: materials, the base, links, joints and parallelogram stages
// (expanded into bars, head and four joints as docs/language.md and the conventions say).
import type { Base, Body, Joint, JointMode, Material, Parallelogram, Pin, Section, Vec2 } from "./types";
import { sectionProperties } from "./section";
import { DEFAULT_POISSON } from "./materials";
import {
  pointValue,
  readChoice,
  readDims,
  readFlag,
  readPoint,
  readQuantity,
  readRange,
  readReference,
  readSection,
  readWord,
  type Read,
} from "./read-values";
import type { BuildContext, Props } from "./build-context";
import { boundedQuantity, readConnects } from "./read-props";
import type { Span } from "../syntax/span";
import { MAX_JOINT_ANGLE_RAD } from "../limits";

// ---- materials ----

export function buildMaterial(ctx: BuildContext, p: Props, id: string): Material {
  const positive = (key: string, note: string): number | undefined => {
    const v = p.values(key);
    if (!v) return undefined;
    const q = readQuantity(v, [key === "density" ? "density" : "pressure"]);
    v.finish();
    if (q && q.value <= 0) {
      ctx.r.add("value.impossible", q.span, `${note} must be positive, got ${ctx.r.quote(q.span)}`);
      return undefined;
    }
    return q?.value;
  };
  for (const key of ["density", "modulus", "strength"]) if (!p.has(key)) p.missing(key);
  const density = positive("density", "a density") ?? 0;
  const modulus = positive("modulus", "a modulus") ?? 0;
  const strength = positive("strength", "a strength") ?? 0;
  const shear = positive("shear_modulus", "a shear modulus");
  const layer = positive("layer_strength", "a layer strength");
  let poisson = DEFAULT_POISSON;
  const pv = p.values("poisson");
  if (pv) {
    const q = readQuantity(pv, ["dimensionless"]);
    pv.finish();
    // Poisson's ratio of an isotropic solid lies in (-1, 0.5] (Timoshenko and Goodier, Theory of Elasticity).
    if (q && (q.value <= -1 || q.value > 0.5))
      ctx.r.add(
        "value.impossible",
        q.span,
        `Poisson's ratio lies between -1 and 0.5, got ${ctx.r.quote(q.span)}`,
      );
    else if (q) poisson = q.value;
  }
  return {
    id,
    density,
    modulus,
    shearModulus: shear ?? modulus / (2 * (1 + poisson)),
    poisson,
    strength,
    ...(layer !== undefined ? { layerStrength: layer } : {}),
    printed: layer !== undefined,
    builtin: false,
    origin: p.origin(),
  };
}

// ---- shared readers ----

/** A quantity that must be positive (sizes, lengths); reports zero or negative values. */
function positiveLength(ctx: BuildContext, p: Props, key: string, what: string): Read<number> | undefined {
  return boundedQuantity(ctx, p, key, "length", what, "positive");
}

/** `point NAME (x, y)` properties (also written `point NAME(x, y)`). */
function namedPoints(
  ctx: BuildContext,
  p: Props,
  bodyId: string,
  points: Record<string, Vec2>,
  reserved: readonly string[],
): void {
  for (const prop of p.all("point")) {
    const v = p.cursor(prop);
    const nameNode = v.next();
    if (!nameNode || nameNode.kind !== "reference" || nameNode.parts.length !== 1) {
      ctx.r.add(
        "value.invalid",
        nameNode?.span ?? prop.key.span,
        `expected a point name and its place, e.g. \`${v.example}\``,
      );
      continue;
    }
    const name = nameNode.parts[0]!;
    let place: Vec2 | undefined;
    if (nameNode.point) {
      place = pointValue(nameNode.point, prop.key.text, "length", ctx.r);
    } else {
      const pt = readPoint(v, "length");
      place = pt?.value;
    }
    v.finish();
    if (!ctx.checkName(name.text, name.span)) continue;
    if (reserved.includes(name.text)) {
      ctx.r.add(
        "value.invalid",
        name.span,
        `\`${name.text}\` is a built-in point of ${bodyId}; give this point another name`,
      );
      continue;
    }
    if (points[name.text] && !reserved.includes(name.text)) {
      const earlier = ctx.symbols.declarations.find(
        (d) => d.kind === "point" && d.id === `${bodyId}.${name.text}`,
      );
      ctx.r.add(
        "name.duplicate",
        name.span,
        `${bodyId} already has a point \`${name.text}\``,
        earlier ? { related: [{ span: earlier.nameSpan, message: "the first one" }] } : {},
      );
      continue;
    }
    ctx.symbols.declarations.push({
      id: `${bodyId}.${name.text}`,
      kind: "point",
      name: name.text,
      nameSpan: name.span,
      span: prop.span,
      container: bodyId,
    });
    if (place) points[name.text] = place;
    else points[name.text] = { x: 0, y: 0 }; // keeps the name for the editor; the error stands
  }
}

/** A declared material by name, given as a word in a property (`material pla`); `what` names it
 * in the message when the word is missing. */
export function materialOf(
  ctx: BuildContext,
  p: Props,
  key: string,
  what = "a material name",
): string | undefined {
  const v = p.values(key);
  if (!v) return undefined;
  const w = readWord(v, what);
  v.finish();
  return w ? ctx.resolveMaterial(w) : undefined;
}

/** `pin 5 mm steel_1018`: diameter then material. */
function readPin(ctx: BuildContext, p: Props, key: string, shearKey: string): Pin | undefined {
  const v = p.values(key);
  let planes: 1 | 2 = 1;
  const sv = p.values(shearKey);
  if (sv) {
    const w = readChoice(sv, ["single", "double"]);
    sv.finish();
    if (w?.value === "double") planes = 2;
  }
  if (!v) return undefined;
  const d = readQuantity(v, ["length"], { nextTakesWord: true });
  const m = readWord(v, "the pin's material");
  v.finish();
  if (d && d.value <= 0) {
    ctx.r.add("value.impossible", d.span, `a pin's diameter must be positive, got ${ctx.r.quote(d.span)}`);
    return undefined;
  }
  const material = m ? ctx.resolveMaterial(m) : undefined;
  if (!d || !material) return undefined;
  return { diameter: d.value, material, shearPlanes: planes };
}

function withinOneTurn(ctx: BuildContext, value: number, at: Span): boolean {
  if (Math.abs(value) <= MAX_JOINT_ANGLE_RAD * (1 + 1e-12)) return true;
  ctx.r.add(
    "value.impossible",
    at,
    `\`${ctx.r.quote(at)}\` is more than a full turn: a joint's angle and the ends of its range lie within -360 deg .. 360 deg`,
  );
  return false;
}

/** `range` or `fixed` or neither; with the reference angle. */
function readMode(ctx: BuildContext, p: Props): { angle: number; mode: JointMode; range?: [number, number] } {
  let range: [number, number] | undefined;
  const rv = p.values("range");
  if (rv) {
    const read = readRange(rv, "angle");
    rv.finish();
    const lowOk = read ? withinOneTurn(ctx, read.value[0], read.ends[0]) : false;
    const highOk = read ? withinOneTurn(ctx, read.value[1], read.ends[1]) : false;
    if (read && lowOk && highOk) range = read.value;
  }
  const fv = p.values("fixed");
  if (fv) readFlag(fv);
  if (rv && fv) {
    ctx.r.add(
      "property.conflict",
      p.get("fixed")!.key.span,
      `${p.what} has both \`range\` and \`fixed\`: a joint is either swept over a range or locked`,
      {
        related: [{ span: p.get("range")!.span, message: "the range" }],
      },
    );
  }
  let angle: number | undefined;
  const av = p.values("angle");
  if (av) {
    const read = readQuantity(av, ["angle"]);
    av.finish();
    if (read && withinOneTurn(ctx, read.value, read.span)) angle = read.value;
  }
  // Without an angle the reference pose is 0, or the middle of a range that excludes 0.
  if (angle === undefined) angle = range && (range[0] > 0 || range[1] < 0) ? (range[0] + range[1]) / 2 : 0;
  // A range that could not be read still makes a degree of freedom (its error stands), so that the
  // joint is not also reported as unheld.
  const mode: JointMode = rv ? "range" : fv ? "fixed" : "passive";
  if (mode === "range" && !range) range = [angle, angle];
  return { angle, mode, ...(range ? { range } : {}) };
}

// ---- base ----

export function buildBase(ctx: BuildContext, p: Props, id: string): { body: Body; base: Base } {
  const mass = boundedQuantity(ctx, p, "mass", "mass", "a mass", "non-negative");
  let footprint: Base["footprint"];
  const fv = p.values("footprint");
  if (fv) {
    const d = readDims(fv);
    fv.finish();
    if (d && (d.value[0] <= 0 || d.value[1] <= 0))
      ctx.r.add(
        "value.impossible",
        d.span,
        `a footprint's sides must be positive, got ${ctx.r.quote(d.span)}`,
      );
    else if (d) footprint = { width: d.value[0], depth: d.value[1] };
  }
  const yv = p.values("yaw");
  if (yv) readFlag(yv);
  let surface = 0;
  const sv = p.values("surface");
  if (sv) {
    surface = readQuantity(sv, ["length"])?.value ?? 0;
    sv.finish();
  }
  const points: Record<string, Vec2> = {};
  namedPoints(ctx, p, id, points, []);
  const body: Body = {
    id,
    kind: "base",
    length: 0,
    mass: mass?.value ?? 0,
    massGiven: mass !== undefined,
    centreOfMass: { x: 0, y: 0 },
    points,
    origin: p.origin(),
  };
  return {
    body,
    base: {
      bodyId: id,
      mass: mass?.value ?? 0,
      ...(footprint ? { footprint } : {}),
      yaw: p.has("yaw"),
      surface,
    },
  };
}

// ---- links ----

export function buildLink(ctx: BuildContext, p: Props, id: string): Body {
  if (!p.has("length")) p.missing("length");
  const length = positiveLength(ctx, p, "length", "a length");
  let section: Section | undefined;
  const sv = p.values("section");
  if (sv) {
    section = readSection(sv)?.value;
    sv.finish();
  }
  const material = materialOf(ctx, p, "material");
  const mass = boundedQuantity(ctx, p, "mass", "mass", "a mass", "non-negative");
  if (!p.has("mass") && (!p.has("section") || !p.has("material"))) {
    for (const k of ["section", "material"]) if (!p.has(k)) p.missing(k, " (or `mass`)");
  }
  const holes = positiveLength(ctx, p, "holes", "a hole's wall");
  const L = length?.value ?? 0;
  let massValue = mass?.value ?? 0;
  if (!mass && section && material && ctx.materials[material])
    massValue = sectionProperties(section).area * L * ctx.materials[material]!.density;
  const points: Record<string, Vec2> = { start: { x: 0, y: 0 }, end: { x: L, y: 0 } };
  const nameSpan = p.nameSpan;
  for (const implicit of ["start", "end"]) {
    ctx.symbols.declarations.push({
      id: `${id}.${implicit}`,
      kind: "point",
      name: implicit,
      nameSpan,
      span: p.decl.span,
      container: id,
      implicit: true,
    });
  }
  namedPoints(ctx, p, id, points, ["start", "end"]);
  const holeThickness = holes?.value ?? (section ? sectionProperties(section).width : undefined);
  return {
    id,
    kind: "link",
    length: L,
    ...(section ? { section } : {}),
    ...(material ? { material } : {}),
    mass: massValue,
    massGiven: mass !== undefined,
    centreOfMass: { x: L / 2, y: 0 },
    points,
    ...(holeThickness !== undefined ? { holeThickness } : {}),
    origin: p.origin(),
  };
}

// ---- joints ----

export function buildJoint(ctx: BuildContext, p: Props, id: string): Joint | undefined {
  const { angle, mode, range } = readMode(ctx, p);
  const pin = readPin(ctx, p, "pin", "shear");
  const friction = boundedQuantity(ctx, p, "friction", "torque", "friction", "non-negative");
  const ends = readConnects(
    ctx,
    p,
    "the parent's point",
    (child) =>
      `the base cannot be a joint's child: write the base first, \`connects ${child} to ...\` (the parent comes first)`,
  );
  if (!ends) return undefined;
  const { parent, child } = ends;
  return {
    id,
    parent: parent.body,
    child: child.body,
    parentPoint: parent.point,
    childPoint: child.point,
    ...(parent.pointName ? { parentPointName: parent.pointName } : {}),
    ...(child.pointName ? { childPointName: child.pointName } : {}),
    angle,
    mode,
    ...(range ? { range } : {}),
    ...(pin ? { pin } : {}),
    ...(friction ? { friction: friction.value } : {}),
    origin: p.origin(),
  };
}

// ---- parallelograms ----

/** Head points: the lower and upper far pivots. */
export const HEAD_POINTS = { lower: "lower_pivot", upper: "upper_pivot" } as const;

export interface ParallelogramBuild {
  bodies: Body[];
  /** Built once the parent is known (after every body exists). */
  finish: () => { joints: Joint[]; parallelogram?: Parallelogram };
}

export function buildParallelogram(ctx: BuildContext, p: Props, id: string): ParallelogramBuild {
  for (const key of ["on", "length", "spacing", "bars"]) if (!p.has(key)) p.missing(key);
  const length = positiveLength(ctx, p, "length", "a length");
  const upperGiven = positiveLength(ctx, p, "upper_length", "a length");
  const spacing = positiveLength(ctx, p, "spacing", "a spacing");
  const L = length?.value ?? 0;
  const Lu = upperGiven?.value ?? L;
  const s = spacing?.value ?? 0;
  if (spacing && length && s >= L) {
    ctx.r.add(
      "value.impossible",
      spacing.span,
      `a spacing of ${ctx.r.quote(spacing.span)} is not less than the bars' length ${ctx.r.quote(length.span)}: the stage would be taller than it is long`,
    );
  }
  let section: Section | undefined;
  let material: string | undefined;
  const bv = p.values("bars");
  if (bv) {
    section = readSection(bv)?.value;
    const m = readWord(bv, "the bars' material");
    bv.finish();
    material = m ? ctx.resolveMaterial(m) : undefined;
  }
  const headMass = boundedQuantity(ctx, p, "head_mass", "mass", "a mass", "non-negative");
  const { angle, mode, range } = readMode(ctx, p);
  const pin = readPin(ctx, p, "pins", "shear");
  const friction = boundedQuantity(ctx, p, "friction", "torque", "friction", "non-negative");
  const origin = p.origin(id);
  const density = material ? (ctx.materials[material]?.density ?? 0) : 0;
  const area = section ? sectionProperties(section).area : 0;
  const bar = (suffix: "lower" | "upper", len: number): Body => ({
    id: `${id}.${suffix}`,
    kind: "bar",
    length: len,
    ...(section ? { section } : {}),
    ...(material ? { material } : {}),
    mass: area * len * density,
    massGiven: false,
    centreOfMass: { x: len / 2, y: 0 },
    points: { start: { x: 0, y: 0 }, end: { x: len, y: 0 } },
    ...(section ? { holeThickness: sectionProperties(section).width } : {}),
    origin,
  });
  const head: Body = {
    id: `${id}.head`,
    kind: "head",
    length: 0,
    mass: headMass?.value ?? 0,
    massGiven: headMass !== undefined,
    // The far upright's own mass sits midway between its pivots (no section is given for it).
    centreOfMass: { x: 0, y: s / 2 },
    points: { [HEAD_POINTS.lower]: { x: 0, y: 0 }, [HEAD_POINTS.upper]: { x: 0, y: s } },
    origin,
  };
  const bodies = [bar("lower", L), bar("upper", Lu), head];
  const nameSpan = p.nameSpan;
  for (const b of bodies)
    ctx.symbols.declarations.push({
      id: b.id,
      kind: "body",
      name: b.id,
      nameSpan,
      span: p.decl.span,
      container: id,
      implicit: true,
    });
  for (const b of bodies)
    for (const pt of Object.keys(b.points))
      ctx.symbols.declarations.push({
        id: `${b.id}.${pt}`,
        kind: "point",
        name: pt,
        nameSpan,
        span: p.decl.span,
        container: b.id,
        implicit: true,
      });

  const finish = (): { joints: Joint[]; parallelogram?: Parallelogram } => {
    const ov = p.values("on");
    if (!ov) return { joints: [] };
    const onRef = readReference(ov, "the parent's point");
    ov.finish();
    const on = onRef ? ctx.resolvePoint(onRef, "on", { keepBodyOnBadPoint: true }) : undefined;
    if (!on) return { joints: [] };
    if (on.body.startsWith(`${id}.`)) {
      ctx.r.add("value.impossible", onRef!.span, `${p.what} cannot sit on its own bodies`);
      return { joints: [] };
    }
    const ids = {
      lowerRoot: id,
      upperRoot: `${id}.upper_root`,
      lowerFar: `${id}.lower_far`,
      upperFar: `${id}.upper_far`,
    };
    const upperRootPoint = { x: on.point.x, y: on.point.y + s };
    const joint = (
      jid: string,
      parent: string,
      parentPoint: Vec2,
      child: string,
      childPoint: Vec2,
      a: number,
      jmode: JointMode,
      parentPointName?: string,
      childPointName?: string,
    ): Joint => ({
      id: jid,
      parent,
      child,
      parentPoint,
      childPoint,
      ...(parentPointName ? { parentPointName } : {}),
      ...(childPointName ? { childPointName } : {}),
      angle: a,
      mode: jmode,
      ...(jid === id && range ? { range } : {}),
      ...(pin ? { pin } : {}),
      ...(jid === id && friction ? { friction: friction.value } : {}),
      origin,
    });
    const joints = [
      joint(
        ids.lowerRoot,
        on.body,
        on.point,
        `${id}.lower`,
        { x: 0, y: 0 },
        angle,
        mode,
        on.pointName,
        "start",
      ),
      joint(
        ids.upperRoot,
        on.body,
        upperRootPoint,
        `${id}.upper`,
        { x: 0, y: 0 },
        angle,
        "passive",
        undefined,
        "start",
      ),
      joint(
        ids.lowerFar,
        `${id}.lower`,
        { x: L, y: 0 },
        `${id}.head`,
        { x: 0, y: 0 },
        -angle,
        "passive",
        "end",
        HEAD_POINTS.lower,
      ),
      joint(
        ids.upperFar,
        `${id}.upper`,
        { x: Lu, y: 0 },
        `${id}.head`,
        { x: 0, y: s },
        -angle,
        "passive",
        "end",
        HEAD_POINTS.upper,
      ),
    ];
    const parallelogram: Parallelogram = {
      id,
      parent: on.body,
      rootPoint: on.point,
      length: L,
      upperLength: Lu,
      spacing: s,
      angle,
      ...(range ? { range } : {}),
      joints: ids,
      bodies: { lower: `${id}.lower`, upper: `${id}.upper`, head: `${id}.head` },
      origin,
    };
    return { joints, parallelogram };
  };
  return { bodies, finish };
}

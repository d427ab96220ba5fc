// Builds payloads, the `require` block (acceptance limits, defaults filled in) and the `sweep`
// settings (steps capped), and the aged load case.
import type { AgedSettings, Payload, Requirements, SweepSettings, Vec2 } from "./types";
import { REQUIREMENT_DEFAULTS, SWEEP_DEFAULTS } from "./schema";
import {
  isWord,
  pointValue,
  vectorValue,
  readChoice,
  readQuantity,
  readRange,
  readReference,
  readWord,
  type Read,
} from "./read-values";
import type { BuildContext, Props } from "./build-context";
import type { DimensionName } from "../units/dimension";

export function buildPayload(ctx: BuildContext, p: Props, id: string): Payload | undefined {
  for (const key of ["mass", "at"]) if (!p.has(key)) p.missing(key);
  let mass: Read<number> | undefined;
  const mv = p.values("mass");
  if (mv) {
    mass = readQuantity(mv, ["mass"]);
    mv.finish();
    if (mass && mass.value < 0) {
      ctx.r.add("value.impossible", mass.span, `a mass cannot be negative, got ${ctx.r.quote(mass.span)}`);
      mass = undefined;
    }
  }
  let massRange: [number, number] | undefined;
  const rv = p.values("range");
  if (rv) {
    const r = readRange(rv, "mass");
    rv.finish();
    if (r && r.value[0] < 0)
      ctx.r.add("value.impossible", r.span, `a mass cannot be negative: ${ctx.r.quote(r.span)}`);
    else if (r) massRange = r.value;
    if (r && mass && massRange && (mass.value < massRange[0] || mass.value > massRange[1])) {
      ctx.r.add(
        "value.impossible",
        mass.span,
        `the mass ${ctx.r.quote(mass.span)} lies outside its range ${ctx.r.quote(r.span)}`,
      );
    }
  }
  let force: Vec2 | undefined;
  let forceAcross: number | undefined;
  const fv = p.values("force");
  if (fv) {
    const node = fv.next();
    if (!node || node.kind !== "point") {
      if (node)
        ctx.r.add(
          "value.invalid",
          node.span,
          `\`force\` expects \`(Fx, Fy)\` or \`(Fx, Fy, Fz)\`, e.g. \`force (0 N, -5 N)\``,
        );
      else fv.missing("a force `(Fx, Fy)`");
    } else {
      const f = vectorValue(node, "force", "force", ctx.r);
      if (f) {
        force = { x: f.x, y: f.y };
        if (f.z !== 0) forceAcross = f.z;
      }
    }
    fv.finish();
  }
  let torque: Payload["torque"];
  const tv = p.values("torque");
  if (tv) {
    const node = tv.next();
    if (!node || node.kind !== "point") {
      if (node)
        ctx.r.add(
          "value.invalid",
          node.span,
          `\`torque\` expects \`(Tx, Ty, Tz)\`, e.g. \`torque (0 N*m, 0.2 N*m, 0 N*m)\``,
        );
      else tv.missing("a torque `(Tx, Ty, Tz)`");
    } else {
      const t = vectorValue(node, "torque", "torque", ctx.r);
      if (t && (t.x !== 0 || t.y !== 0 || t.z !== 0)) torque = t;
    }
    tv.finish();
  }
  let at: Payload["point"] | undefined;
  let body: string | undefined;
  const av = p.values("at");
  if (av) {
    const ref = readReference(av, "its centre of mass");
    av.finish();
    const a = ref ? ctx.resolvePoint(ref, "at") : undefined;
    if (a) {
      at = a.point;
      body = a.body;
      if (ctx.bodies.get(a.body)?.kind === "base") {
        ctx.r.add(
          "payload.on-base",
          ref!.span,
          `payload ${id} sits on the base ${a.body}: no joint carries it, so no hand holds it and it takes no part in balance`,
        );
      }
    }
  }
  if (mass && mass.value === 0 && !massRange && !force && !torque) {
    ctx.r.add(
      "payload.weightless",
      mass.span,
      `payload ${id} has no mass and no force: it loads nothing, so the balance checks have nothing to hold there`,
    );
  }
  if (!body || !at) return undefined;
  return {
    id,
    body,
    point: at,
    mass: mass?.value ?? (massRange ? massRange[0] : 0),
    ...(massRange ? { massRange } : {}),
    ...(force ? { force } : {}),
    ...(forceAcross !== undefined ? { forceAcross } : {}),
    ...(torque ? { torque } : {}),
    origin: p.origin(),
  };
}

export function defaultRequirements(): Requirements {
  const d = REQUIREMENT_DEFAULTS;
  return {
    balance: { default: d.balanceN, byPayload: {} },
    safety: d.safety,
    tilt: { default: d.tiltRad, byPayload: {} },
    deflection: { default: d.deflectionM, byPayload: {} },
    frequency: d.frequencyHz,
    tipping: d.tipping,
    clearance: d.clearanceM,
  };
}

export function buildRequirements(ctx: BuildContext, p: Props): Requirements {
  const req = defaultRequirements();
  // `balance F at PAYLOAD`, `tilt A at PAYLOAD`, `deflection D at PAYLOAD`: `at` optional.
  const perPayload = (key: "balance" | "tilt" | "deflection", dim: DimensionName) => {
    const seen = new Map<string, boolean>();
    for (const prop of p.all(key)) {
      const v = p.cursor(prop);
      const q = readQuantity(v, [dim], { nextTakesWord: true });
      let payload: string | undefined;
      let target = "";
      const next = v.peek();
      if (isWord(next) && next.parts[0]!.text === "at") {
        v.next();
        const w = readWord(v, "a payload name");
        target = w?.value ?? "";
        payload = w ? ctx.resolveName(w, ["payload"], "a payload")?.id : undefined;
      }
      v.finish();
      if (seen.has(target)) {
        ctx.r.add(
          "property.repeated",
          prop.key.span,
          `\`${key}\`${target ? ` at ${target}` : ""} is given twice; this one counts`,
        );
      }
      seen.set(target, true);
      if (!q) continue;
      if (q.value <= 0) {
        ctx.r.add("value.impossible", q.span, `a limit must be positive, got ${ctx.r.quote(q.span)}`);
        continue;
      }
      if (payload) req[key].byPayload[payload] = q.value;
      else if (!target) req[key].default = q.value;
    }
  };
  perPayload("balance", "force");
  perPayload("tilt", "angle");
  perPayload("deflection", "length");
  const single = (
    key: "safety" | "frequency" | "tipping" | "clearance",
    dim: DimensionName,
    atLeast: number,
    note: string,
  ) => {
    const v = p.values(key);
    if (!v) return;
    const q = readQuantity(v, [dim]);
    v.finish();
    if (!q) return;
    if (q.value < atLeast || (atLeast === 0 && q.value <= 0)) {
      ctx.r.add("value.impossible", q.span, `${key} ${note}, got ${ctx.r.quote(q.span)}`);
      return;
    }
    req[key] = q.value;
  };
  single("safety", "dimensionless", 1, "is a safety factor, at least 1");
  single("frequency", "frequency", 0, "must be positive");
  single("tipping", "dimensionless", 1, "is a safety factor, at least 1");
  single("clearance", "length", 0, "must be positive");
  req.origin = p.origin();
  return req;
}

export function defaultSweep(): SweepSettings {
  return { steps: SWEEP_DEFAULTS.steps, grid: SWEEP_DEFAULTS.grid };
}

export function buildSweep(ctx: BuildContext, p: Props): SweepSettings {
  const sweep = defaultSweep();
  const sv = p.values("steps");
  if (sv) {
    const q = readQuantity(sv, ["dimensionless"]);
    sv.finish();
    if (q && (!Number.isInteger(q.value) || q.value < 2)) {
      ctx.r.add(
        "value.impossible",
        q.span,
        `steps is a whole number of poses, at least 2 (both ends of the range), got ${ctx.r.quote(q.span)}`,
      );
    } else if (q && q.value > SWEEP_DEFAULTS.maxSteps) {
      ctx.r.add(
        "sweep.capped",
        q.span,
        `${q.value} steps per degree of freedom is more than the ${SWEEP_DEFAULTS.maxSteps} allowed: ${SWEEP_DEFAULTS.maxSteps} are used`,
        {
          data: { requested: q.value, used: SWEEP_DEFAULTS.maxSteps },
        },
      );
      sweep.steps = SWEEP_DEFAULTS.maxSteps;
      sweep.requestedSteps = q.value;
    } else if (q) sweep.steps = q.value;
  }
  const gv = p.values("grid");
  if (gv) {
    const w = readChoice(gv, ["on", "off"]);
    gv.finish();
    if (w) sweep.grid = w.value === "on";
  }
  sweep.origin = p.origin();
  return sweep;
}

/** `aged { after T; relaxation R; creep C }`: undefined when the time is missing or impossible
 * (its finding says why). */
export function buildAged(ctx: BuildContext, p: Props): AgedSettings | undefined {
  if (!p.has("after")) p.missing("after");
  let after: number | undefined;
  const tv = p.values("after");
  if (tv) {
    const q = readQuantity(tv, ["time"]);
    tv.finish();
    if (q && !(q.value > 0))
      ctx.r.add("value.impossible", q.span, `after must be a positive time, got ${ctx.r.quote(q.span)}`);
    else if (q) after = q.value;
  }
  const share = (key: "relaxation" | "creep", what: string): number | undefined => {
    const v = p.values(key);
    if (!v) return undefined;
    const q = readQuantity(v, ["dimensionless"]);
    v.finish();
    if (q && !(q.value >= 0 && q.value < 1)) {
      ctx.r.add(
        "value.impossible",
        q.span,
        `${key} is the share of ${what} lost, from 0 up to (not including) 1, got ${ctx.r.quote(q.span)}`,
      );
      return undefined;
    }
    return q?.value;
  };
  const relaxation = share("relaxation", "a rubber cord's force");
  const creep = share("creep", "printed parts' stiffness");
  if (after === undefined) return undefined;
  return {
    after,
    ...(relaxation !== undefined ? { relaxation } : {}),
    ...(creep !== undefined ? { creep } : {}),
    origin: p.origin(),
  };
}

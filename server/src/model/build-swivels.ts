// Builds swivels (docs/checks.md, Swivels; docs/language.md, `swivel NAME`): a pivot about the parent's
// y axis. In the drawing plane a swivel stands as a locked joint (the child keeps the parent's
// orientation, or its `angle`); its heading range, bearings and friction are kept for the checks
// that turn the arm. The base's `yaw` is a swivel at the base's origin.
import type { Base, Joint, Spring, Swivel } from "./types";
import { readQuantity, readRange, readWord, type Values } from "./read-values";
import type { BuildContext, Props } from "./build-context";
import { boundedQuantity, readConnects } from "./read-props";

/** A heading range wider than a full turn says nothing more than a full turn. */
const FULL_TURN = 2 * Math.PI;

/** The name of a bearing declaration, when one is written after the spacing or after `thrust`. */
function readBearingName(ctx: BuildContext, v: Values): string | undefined {
  if (v.peek() === undefined) return undefined;
  const word = readWord(v, "a bearing's name");
  return word ? ctx.resolveName(word, ["bearing"], "a bearing")?.id : undefined;
}

/** `bearings D [NAME]` and `thrust [NAME]`, on a swivel or on a base with `yaw`. */
export function readSwivelBearings(ctx: BuildContext, p: Props): Pick<Swivel, "bearings" | "thrust"> {
  const out: Pick<Swivel, "bearings" | "thrust"> = {};
  const bv = p.values("bearings");
  if (bv) {
    const spacing = readQuantity(bv, ["length"]);
    const bearing = readBearingName(ctx, bv);
    bv.finish();
    if (spacing && spacing.value <= 0)
      ctx.r.add(
        "value.impossible",
        spacing.span,
        `the bearings must be some distance apart along the axis to carry a moment, got ${ctx.r.quote(spacing.span)}`,
      );
    else if (spacing) out.bearings = { spacing: spacing.value, ...(bearing ? { bearing } : {}) };
  }
  const tv = p.values("thrust");
  if (tv) {
    const bearing = readBearingName(ctx, tv);
    tv.finish();
    out.thrust = bearing ? { bearing } : {};
  }
  return out;
}

function readHeading(ctx: BuildContext, p: Props): [number, number] | undefined {
  const hv = p.values("heading");
  if (!hv) return undefined;
  const range = readRange(hv, "angle");
  hv.finish();
  if (!range) return undefined;
  if (range.value[1] - range.value[0] >= FULL_TURN) return undefined; // all the way round
  return range.value;
}

/** A swivel and the locked joint that stands for it in the plane. */
export function buildSwivel(
  ctx: BuildContext,
  p: Props,
  id: string,
): { swivel: Swivel; joint: Joint } | undefined {
  let angle = 0;
  const av = p.values("angle");
  if (av) {
    angle = readQuantity(av, ["angle"])?.value ?? 0;
    av.finish();
  }
  const heading = readHeading(ctx, p);
  const bearings = readSwivelBearings(ctx, p);
  const friction = boundedQuantity(ctx, p, "friction", "torque", "friction", "non-negative")?.value;
  const ends = readConnects(
    ctx,
    p,
    "the parent's point (on the axis)",
    () => "the base cannot be a swivel's child: the parent, which carries the axis, comes first",
  );
  if (!ends) return undefined;
  const { parent, child } = ends;
  const origin = p.origin();
  const joint: Joint = {
    id,
    parent: parent.body,
    child: child.body,
    parentPoint: parent.point,
    childPoint: child.point,
    ...(parent.pointName ? { parentPointName: parent.pointName } : {}),
    ...(child.pointName ? { childPointName: child.pointName } : {}),
    angle,
    mode: "fixed",
    swivel: id,
    origin,
  };
  const swivel: Swivel = {
    id,
    joint: id,
    parent: parent.body,
    child: child.body,
    point: parent.point,
    ...(heading ? { heading } : {}),
    ...bearings,
    ...(friction !== undefined ? { friction } : {}),
    origin,
  };
  return { swivel, joint };
}

/** The base's `yaw` as a swivel at the base's origin, with the base's `bearings` and `thrust`;
 * those two on a base without `yaw` contradict it (nothing turns there). */
export function baseSwivel(ctx: BuildContext, base: Base, p: Props): Swivel | undefined {
  if (!base.yaw) {
    for (const key of ["bearings", "thrust"]) {
      const prop = p.get(key);
      if (prop)
        ctx.r.add(
          "property.conflict",
          prop.key.span,
          `\`${key}\` on a base without \`yaw\`: nothing turns there (add \`yaw\`, or a \`swivel\` where the arm turns)`,
        );
    }
    return undefined;
  }
  return {
    id: base.bodyId,
    parent: base.bodyId,
    point: { x: 0, y: 0 },
    ...readSwivelBearings(ctx, p),
    origin: p.origin(),
  };
}

/** The bodies a swivel carries: everything reachable from its child without passing through the
 * swivel itself (for the base's yaw: every body but the base). `loops` is set when that reaches
 * back to the parent (a closed loop through the swivel). */
export function carriedBodies(
  joints: readonly Joint[],
  swivel: Pick<Swivel, "id" | "joint" | "parent" | "child">,
): { bodies: Set<string>; loops: boolean } {
  const bodies = new Set<string>();
  if (!swivel.child) {
    for (const j of joints) {
      if (j.parent !== swivel.parent) bodies.add(j.parent);
      if (j.child !== swivel.parent) bodies.add(j.child);
    }
    return { bodies, loops: false };
  }
  const queue = [swivel.child];
  bodies.add(swivel.child);
  let loops = false;
  while (queue.length > 0) {
    const b = queue.pop()!;
    for (const j of joints) {
      if (j.id === swivel.joint) continue;
      const other = j.parent === b ? j.child : j.child === b ? j.parent : undefined;
      if (other === undefined || bodies.has(other)) continue;
      if (other === swivel.parent) {
        loops = true;
        continue;
      }
      bodies.add(other);
      queue.push(other);
    }
  }
  return { bodies, loops };
}

/** A swivel must be the only way from what it carries back to the rest: a loop through it, or a
 * spring with one end on each side (its length would change with the heading), is reported. */
export function checkSwivelCuts(
  ctx: BuildContext,
  joints: readonly Joint[],
  swivels: readonly Swivel[],
  springs: readonly Spring[],
): void {
  for (const s of swivels) {
    if (!s.child) continue;
    const { bodies, loops } = carriedBodies(joints, s);
    const at = s.origin.properties["connects"] ?? s.origin.name ?? s.origin.declaration;
    if (loops)
      ctx.r.about(s.id, () =>
        ctx.r.add(
          "value.invalid",
          at,
          `swivel ${s.id} sits in a closed loop: what it carries must hang on it alone, or it could not turn`,
        ),
      );
    for (const sp of springs) {
      if (sp.kind === "torsion") continue;
      if (bodies.has(sp.a.body) !== bodies.has(sp.b.body))
        ctx.r.about(sp.id, () =>
          ctx.r.add(
            "value.invalid",
            sp.origin.properties["between"] ?? sp.origin.declaration,
            `spring ${sp.id} reaches across swivel ${s.id}: its length would change as the swivel turns; hook both ends on the same side`,
            { related: [{ span: at, message: `swivel ${s.id}` }] },
          ),
        );
    }
  }
}

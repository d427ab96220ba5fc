// Property readers shared by the builders of parts, swivels and hardware: a quantity that must be
// positive or at least zero, and the `connects PARENT.POINT to CHILD.POINT` of a joint or swivel.
import { readKeyword, readQuantity, readReference, type Read } from "./read-values";
import type { BuildContext, Props } from "./build-context";
import type { Attachment } from "./types";
import type { DimensionName } from "../units/dimension";

/** A single quantity under `key` that must be above zero ("positive") or not below it
 * ("non-negative"); `what` names it in the message. A value out of bounds is said and dropped. */
export function boundedQuantity(
  ctx: BuildContext,
  p: Props,
  key: string,
  dim: DimensionName,
  what: string,
  bound: "positive" | "non-negative",
): Read<number> | undefined {
  const v = p.values(key);
  if (!v) return undefined;
  const q = readQuantity(v, [dim]);
  v.finish();
  if (q && (bound === "non-negative" ? q.value < 0 : q.value <= 0)) {
    const rule = bound === "non-negative" ? "cannot be negative" : "must be positive";
    ctx.r.add("value.impossible", q.span, `${what} ${rule}, got ${ctx.r.quote(q.span)}`);
    return undefined;
  }
  return q;
}

/** `connects PARENT.POINT to CHILD.POINT`, resolved; undefined (after saying why) when it is
 * missing, names an unknown point, joins a body to itself or makes the base a child.
 * `parentWhat` names the parent's point in messages; `baseChildRule` says what to write instead
 * when the base is given as the child. */
export function readConnects(
  ctx: BuildContext,
  p: Props,
  parentWhat: string,
  baseChildRule: (childWritten: string) => string,
): { parent: Attachment; child: Attachment } | undefined {
  const cv = p.values("connects");
  if (!cv) {
    p.missing("connects");
    return undefined;
  }
  const parentRef = readReference(cv, parentWhat);
  const hasTo = parentRef ? readKeyword(cv, "to", "and the child's point") : false;
  const childRef = hasTo ? readReference(cv, "the child's point") : undefined;
  cv.finish();
  const parent = parentRef
    ? ctx.resolvePoint(parentRef, "connects", { keepBodyOnBadPoint: true })
    : undefined;
  const child = childRef ? ctx.resolvePoint(childRef, "connects", { keepBodyOnBadPoint: true }) : undefined;
  if (!parent || !child) return undefined;
  if (parent.body === child.body) {
    ctx.r.add("value.impossible", childRef!.span, `${p.what} connects ${parent.body} to itself`);
    return undefined;
  }
  if (ctx.bodies.get(child.body)?.kind === "base") {
    ctx.r.add("value.invalid", childRef!.span, baseChildRule(ctx.r.quote(childRef!.span)));
    return undefined;
  }
  return { parent, child };
}

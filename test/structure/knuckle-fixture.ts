// An invented two-link arm with a swivel between its links (a knuckle): the boom, a flat
// aluminium bar held level on a post, and a round tube that turns on the knuckle; weightless links
// and a 10 N tip load, so that the closed forms of docs/formulas.md and Roark apply as they stand.
import type { Swivel } from "../../server/src/model/types";
import { armModel, baseBody, G, joint, linkBody, MATERIALS, origin, payload } from "./arm-fixture";

export const L1 = 0.3;
export const L2 = 0.2;
export const P = 10;
export const rectBar = { shape: "rect" as const, depth: 0.025, width: 0.01 };
export const tube = { shape: "tube" as const, outerDiameter: 0.02, wall: 0.002 };
export const al = MATERIALS["aluminium_6061_t6"]!;

export function knuckleArm(heading?: [number, number]) {
  const base = baseBody("post", { top: { x: 0, y: 0.3 } });
  const boom = linkBody("boom", L1, rectBar, "aluminium_6061_t6");
  const arm2 = linkBody("arm2", L2, tube, "aluminium_6061_t6");
  // weightless links: the tip load alone, as in the closed forms
  for (const b of [boom, arm2]) Object.assign(b, { mass: 0, massGiven: true });
  const knuckle = joint("knuckle", "boom", { x: L1, y: 0 }, "arm2", 0, "fixed", { swivel: "knuckle" });
  const swivel: Swivel = {
    id: "knuckle",
    joint: "knuckle",
    parent: "boom",
    child: "arm2",
    point: { x: L1, y: 0 },
    origin: origin("connects", "heading"),
    ...(heading ? { heading } : {}),
  };
  const model = armModel({
    bodies: [base, boom, arm2],
    joints: [joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "fixed"), knuckle],
    payloads: [payload("tool", "arm2", { x: L2, y: 0 }, P / G)],
  });
  model.swivels = [swivel];
  return model;
}

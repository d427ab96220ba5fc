// Plane geometry, written once for the solver, the checks and the view: a body's frame (its origin
// and the angle of its x axis) carries the body's local points into the world, and a few small
// helpers on plane points. SI: m and rad.
import type { Vec2 } from "../model/types";

/** A body's frame in the world: origin, m, and the angle of its x axis from horizontal, rad
 * (CCW positive). The base's frame is the world's. */
export interface PlaneFrame {
  x: number;
  y: number;
  phi: number;
}

/** x of the local point (lx, ly) turned by the frame's angle, given its cosine c and sine s (for
 * loops that keep them). */
export function turnedX(c: number, s: number, lx: number, ly: number): number {
  return c * lx - s * ly;
}

/** y of the local point (lx, ly) turned by the frame's angle (cosine c, sine s). */
export function turnedY(c: number, s: number, lx: number, ly: number): number {
  return s * lx + c * ly;
}

/** x, in a frame turned by (c, s), of the world vector (dx, dy): the turn undone. */
export function unturnedX(c: number, s: number, dx: number, dy: number): number {
  return c * dx + s * dy;
}

/** y, in a frame turned by (c, s), of the world vector (dx, dy). */
export function unturnedY(c: number, s: number, dx: number, dy: number): number {
  return -s * dx + c * dy;
}

/** World x of the local point (lx, ly) on a frame with origin x `ox` turned by (c, s). */
export function worldX(ox: number, c: number, s: number, lx: number, ly: number): number {
  return ox + c * lx - s * ly;
}

/** World y of the local point (lx, ly) on a frame with origin y `oy` turned by (c, s). */
export function worldY(oy: number, c: number, s: number, lx: number, ly: number): number {
  return oy + s * lx + c * ly;
}

/** World position of a body's local point: the body-to-world transform. */
export function toWorld(frame: PlaneFrame, local: Vec2): Vec2 {
  const c = Math.cos(frame.phi);
  const s = Math.sin(frame.phi);
  return { x: worldX(frame.x, c, s, local.x, local.y), y: worldY(frame.y, c, s, local.x, local.y) };
}

/** A vector turned by `phi`, rad (CCW positive). */
export function rotate(v: Vec2, phi: number): Vec2 {
  const c = Math.cos(phi);
  const s = Math.sin(phi);
  return { x: turnedX(c, s, v.x, v.y), y: turnedY(c, s, v.x, v.y) };
}

/** Distance between two points. */
export function distance(a: Vec2, b: Vec2): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** Perpendicular distance from p to the line through a and b (to a itself when a = b). */
export function distanceToLine(a: Vec2, b: Vec2, p: Vec2): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const L = Math.hypot(dx, dy);
  return L > 0 ? Math.abs(dx * (p.y - a.y) - dy * (p.x - a.x)) / L : Math.hypot(p.x - a.x, p.y - a.y);
}

/** The point of segment ab nearest p. */
export function nearestOnSegment(p: Vec2, a: Vec2, b: Vec2): Vec2 {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2)) : 0;
  return { x: a.x + t * dx, y: a.y + t * dy };
}

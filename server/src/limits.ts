// The documented limits of one analysis (docs/robustness.md, "Limits"): with them every `poise`
// command and every server request is bounded in time, memory and output. One place, so the docs
// and the tests read the same numbers. (The sweep's own caps, `sweep steps` at most 2001 and a
// grid of at most 20,000 poses, live with the sweep: model/schema.ts and mechanics/sweep-plan.ts.)

/** Longest spec text read, in characters (a file: bytes): 1 MiB. A bench arm is a few kilobytes;
 * ten thousand link declarations are under 1 MiB; parsing 1 MiB takes about a second. Longer
 * texts are refused with a finding, unread. */
export const MAX_SPEC_CHARS = 1024 * 1024;

/** A joint's angle and the ends of its range lie within one full turn either way, rad. The sweep
 * walks from the reference angle to every pose in steps of a few degrees, so `1e9 deg` (a slip
 * of the keyboard) would take it hours; and a turn is all a planar joint can tell apart. Beyond
 * it the value is refused with a finding. */
export const MAX_JOINT_ANGLE_RAD = 2 * Math.PI;

/** Moving bodies the solver takes, nearest the base first. The pose solver and the stiffness
 * frame hold square matrices of the arm's coordinates, so memory grows with the square of the
 * bodies and time faster: 200 bodies (66 parallelogram stages) is far past any bench arm and
 * solves in seconds. Bodies beyond are left out with a finding on the first of them. */
export const MAX_SOLVED_BODIES = 200;

/** Poses times moving bodies in one sweep: each pose keeps every body's position and every
 * joint's reaction per load case, about a kilobyte per body-pose with all its tables, and
 * `poise sweep` prints them all. 200,000 keeps a sweep under about 250 MB of memory and its
 * JSON table under about 50 MB; past it the steps per degree of freedom are lowered (a grid that
 * would pass it even at 2 steps is swept one degree of freedom at a time), with a finding. */
export const MAX_POSE_BODIES = 200_000;

/** Time budget of one spec's analysis in the `poise` command, ms: past it the sweep and the checks
 * stop where they are and a finding says the results are partial (the editor's budget is the
 * `counterpoise.analysisBudgetMs` setting). A minute is a hundred times what a bench arm takes;
 * the phases that cannot stop midway are bounded by the limits above. */
export const CLI_BUDGET_MS = 60_000;

// What the analysis leaves out (docs/checks.md, Limits) and the cautions shown wherever a part
// of a spring-loaded arm can fall or fly off. Shared by the panel and the report.

export const MODEL_LIMITS: readonly string[] = [
  "Balance and statics in each stage's vertical plane; loads out of it (a stage turned on a swivel, a sideways working force or torque) are checked for stiffness at a few representative poses, and for stress with torsion, buckling, pins and joint bearings at those and where each swivel's stage reaches out most, not at every pose; fastenings, spring ends and clearances take the planar loads only.",
  "Quasi-static motion: no inertia, no impact, no shock when the arm is let go or bumped.",
  "Small elastic deflections about the rigid-body pose.",
  "Pins without clearance: play in the holes adds droop the figures do not show.",
  "Friction only as a holding torque at the pivots that declare it.",
  "No fatigue life: a part that passes here can still crack after many cycles.",
  "Creep and relaxation only as an optional aged case (`aged { after ... }`), by rough rules whose values are from memory: printed plastic and rubber slowly give under constant load and springs relax; without an aged block they are not modelled.",
  "A check that passes is no substitute for a test of the real arm.",
];

export const SAFETY_CAUTIONS: readonly string[] = [
  "Keep hands, face and cables clear of the arm's swing and of every spring while assembling, adjusting or releasing it; a loaded spring stores energy and can throw a part.",
  "Test under load at reduced height first, with the payload replaced by a dummy mass, before trusting the arm over work or people.",
  "Follow local codes and the tool maker's instructions for the tool or light the arm carries.",
  "These figures support a design; they do not certify one. Where a failure could hurt someone, defer to licensed engineering practice.",
];

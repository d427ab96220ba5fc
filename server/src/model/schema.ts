// What each declaration accepts: property names, the shape of their values, the dimension a
// quantity must have, whether required. One table serves the model builder, completion, hover
// and the language reference, so they cannot disagree.
import type { DimensionName } from "../units/dimension";
import type { DeclarationKeyword } from "../syntax/ast";
import { kindsTaking, SPRING_KIND_TABLE, SPRING_KIND_WORDS } from "./spring-kinds";
import type { SpringKind } from "./types";

/** How a property's values read, position by position. */
export type ValueShape =
  | { type: "quantity"; dimension: DimensionName }
  | { type: "quantity-or"; dimensions: DimensionName[] } // e.g. torsion preload: angle or torque
  | { type: "range"; dimension: DimensionName }
  | { type: "point" } // (x, y) lengths
  | { type: "vector"; dimension: DimensionName } // (Fx, Fy)
  | { type: "named-point" } // NAME (x, y)
  | { type: "section" } // rect D x W | tube OD x WALL | rod D
  | { type: "dims"; dimension: DimensionName } // A x B
  | { type: "count-of"; dimension: DimensionName } // N x SIZE: a count (no unit) of a size
  | {
      type: "reference";
      to: "body" | "point" | "joint" | "joint-or-parallelogram" | "payload" | "bearing" | "fastening";
    } // body, body.point, body(x, y), body.point(x, y); or a declaration's name
  | { type: "material" }
  | { type: "word"; words: string[] }
  | { type: "flag" } // the key alone, e.g. `fixed`, `yaw`, `extension`
  | { type: "sequence"; items: (ValueShape | { type: "keyword"; word: string })[] }
  | { type: "tuning" }; // WHAT LO .. HI: `anchor`/`hook` and a region, or a property and its range

export interface PropertySpec {
  key: string;
  shape: ValueShape;
  required?: boolean;
  /** Only for these spring kinds (spring declarations). */
  springKinds?: string[];
  /** One line for hover and completion. */
  doc: string;
  /** Example as it would be typed, for snippets and docs. */
  example: string;
}

export interface DeclarationSpec {
  keyword: DeclarationKeyword;
  named: boolean;
  doc: string;
  properties: PropertySpec[];
}

const q = (dimension: DimensionName): ValueShape => ({ type: "quantity", dimension });
const kw = (word: string) => ({ type: "keyword" as const, word });

/** The spring kind words, in order (their facts: model/spring-kinds.ts). */
export const SPRING_KINDS: readonly SpringKind[] = SPRING_KIND_WORDS;

/** The kind word properties of a spring, each a flag with its kind's meaning. */
const springKindFlags = (): PropertySpec[] =>
  SPRING_KIND_WORDS.map((kind) => ({
    key: kind,
    shape: { type: "flag" },
    doc: SPRING_KIND_TABLE[kind].doc,
    example: kind,
  }));

export const DECLARATIONS: readonly DeclarationSpec[] = [
  {
    keyword: "material",
    named: true,
    doc: "A material of your own (the built-in library supplies common ones by name).",
    properties: [
      {
        key: "density",
        shape: q("density"),
        required: true,
        doc: "Mass per volume.",
        example: "density 1.24 g/cm^3",
      },
      {
        key: "modulus",
        shape: q("pressure"),
        required: true,
        doc: "Young's modulus.",
        example: "modulus 3.4 GPa",
      },
      {
        key: "shear_modulus",
        shape: q("pressure"),
        doc: "Shear modulus (else from poisson).",
        example: "shear_modulus 1.3 GPa",
      },
      {
        key: "poisson",
        shape: q("dimensionless"),
        doc: "Poisson's ratio (default 0.3).",
        example: "poisson 0.35",
      },
      {
        key: "strength",
        shape: q("pressure"),
        required: true,
        doc: "Yield strength, or tensile strength for brittle prints.",
        example: "strength 50 MPa",
      },
      {
        key: "layer_strength",
        shape: q("pressure"),
        doc: "Strength across printed layers; marks the material as printed.",
        example: "layer_strength 25 MPa",
      },
    ],
  },
  {
    keyword: "base",
    named: true,
    doc: "The fixed ground: world coordinates, x to the reach side, y up.",
    properties: [
      { key: "mass", shape: q("mass"), doc: "Mass of the base (resists tipping).", example: "mass 4 kg" },
      {
        key: "footprint",
        shape: { type: "dims", dimension: "length" },
        doc: "Footprint width (along x) x depth, centred on the origin.",
        example: "footprint 240 mm x 200 mm",
      },
      {
        key: "yaw",
        shape: { type: "flag" },
        doc: "The arm turns about a vertical axis through the base: adds thrust-bearing and tipping checks for every heading.",
        example: "yaw",
      },
      {
        key: "bearings",
        shape: { type: "sequence", items: [q("length"), { type: "reference", to: "bearing" }] },
        doc: "With `yaw`: two radial bearings this far apart along the vertical axis (the bearing's name is optional).",
        example: "bearings 60 mm base_ring",
      },
      {
        key: "thrust",
        shape: { type: "reference", to: "bearing" },
        doc: "With `yaw`: the bearing that carries the arm's weight.",
        example: "thrust base_ring",
      },
      {
        key: "surface",
        shape: q("length"),
        doc: "Height of the bench surface (default 0).",
        example: "surface 0 mm",
      },
      {
        key: "point",
        shape: { type: "named-point" },
        doc: "A named point in world coordinates.",
        example: "point top (0 mm, 300 mm)",
      },
      {
        key: "fastening",
        shape: { type: "reference", to: "fastening" },
        doc: "How the base is held to the bench.",
        example: "fastening bench_screws",
      },
    ],
  },
  {
    keyword: "link",
    named: true,
    doc: "A rigid bar from `start` (0, 0) to `end` (length, 0).",
    properties: [
      {
        key: "length",
        shape: q("length"),
        required: true,
        doc: "Pivot-to-pivot length.",
        example: "length 300 mm",
      },
      {
        key: "section",
        shape: { type: "section" },
        doc: "Cross-section: rect DEPTH x WIDTH, tube OD x WALL, rod D.",
        example: "section rect 20 mm x 6 mm",
      },
      {
        key: "material",
        shape: { type: "material" },
        doc: "Material name (built-in or declared).",
        example: "material pla",
      },
      { key: "mass", shape: q("mass"), doc: "Overrides section x length x density.", example: "mass 120 g" },
      {
        key: "point",
        shape: { type: "named-point" },
        doc: "A named point in the link's frame.",
        example: "point hook (100 mm, 10 mm)",
      },
      {
        key: "holes",
        shape: q("length"),
        doc: "Wall thickness the pins bear on (default: the section's width).",
        example: "holes 6 mm",
      },
    ],
  },
  {
    keyword: "joint",
    named: true,
    doc: "A revolute pivot between a parent and a child body.",
    properties: [
      {
        key: "connects",
        shape: {
          type: "sequence",
          items: [{ type: "reference", to: "point" }, kw("to"), { type: "reference", to: "point" }],
        },
        required: true,
        doc: "Parent point to child point.",
        example: "connects post.top to arm.start",
      },
      {
        key: "angle",
        shape: q("angle"),
        doc: "Child x axis from parent x axis (CCW positive): the reference pose.",
        example: "angle 30 deg",
      },
      {
        key: "range",
        shape: { type: "range", dimension: "angle" },
        doc: "Makes the joint a degree of freedom swept over this range.",
        example: "range -30 deg .. 60 deg",
      },
      { key: "fixed", shape: { type: "flag" }, doc: "Locks the joint at `angle`.", example: "fixed" },
      {
        key: "pin",
        shape: { type: "sequence", items: [q("length"), { type: "material" }] },
        doc: "Pin diameter and material.",
        example: "pin 5 mm steel_1018",
      },
      {
        key: "shear",
        shape: { type: "word", words: ["single", "double"] },
        doc: "Shear planes of the pin (default single).",
        example: "shear double",
      },
      {
        key: "friction",
        shape: q("torque"),
        doc: "Holding torque of the pivot's friction.",
        example: "friction 0.2 N*m",
      },
      {
        key: "bearing",
        shape: { type: "reference", to: "bearing" },
        doc: "The bearing the joint turns on (instead of, or as well as, a pin).",
        example: "bearing elbow_bushing",
      },
      {
        key: "fastening",
        shape: { type: "reference", to: "fastening" },
        doc: "How a fixed joint is held: its locked moment and force pass through it.",
        example: "fastening clamp_bolts",
      },
    ],
  },
  {
    keyword: "swivel",
    named: true,
    doc: "A pivot about a vertical axis (a turning knuckle, the barrel between two stages): the axis runs along the parent's y axis through its point; everything the child carries turns with it.",
    properties: [
      {
        key: "connects",
        shape: {
          type: "sequence",
          items: [{ type: "reference", to: "point" }, kw("to"), { type: "reference", to: "point" }],
        },
        required: true,
        doc: "Parent point (on the axis) to child point.",
        example: "connects boom.end to upright.start",
      },
      {
        key: "angle",
        shape: q("angle"),
        doc: "Child x axis from parent x axis in the drawing plane (default 0: the child keeps the parent's orientation).",
        example: "angle 0 deg",
      },
      {
        key: "heading",
        shape: { type: "range", dimension: "angle" },
        doc: "The range it turns through, 0 being the drawing plane (default: all the way round).",
        example: "heading -120 deg .. 120 deg",
      },
      {
        key: "bearings",
        shape: { type: "sequence", items: [q("length"), { type: "reference", to: "bearing" }] },
        doc: "Two radial bearings this far apart along the axis, which carry the moment as a couple (the bearing's name is optional).",
        example: "bearings 50 mm ring_bearing",
      },
      {
        key: "thrust",
        shape: { type: "reference", to: "bearing" },
        doc: "The bearing that carries the weight along the axis.",
        example: "thrust ring_bearing",
      },
      {
        key: "friction",
        shape: q("torque"),
        doc: "Holding torque of the swivel's friction about its axis.",
        example: "friction 0.3 N*m",
      },
    ],
  },
  {
    keyword: "parallelogram",
    named: true,
    doc: "A four-bar stage whose far upright keeps the root's orientation; creates NAME.lower, NAME.upper and NAME.head.",
    properties: [
      {
        key: "on",
        shape: { type: "reference", to: "point" },
        required: true,
        doc: "Where the lower root pivot sits on the parent.",
        example: "on base.top",
      },
      {
        key: "length",
        shape: q("length"),
        required: true,
        doc: "Pivot-to-pivot length of the bars.",
        example: "length 350 mm",
      },
      {
        key: "upper_length",
        shape: q("length"),
        doc: "Upper bar length, for a stage whose bars differ.",
        example: "upper_length 352 mm",
      },
      {
        key: "spacing",
        shape: q("length"),
        required: true,
        doc: "Distance between the bars' root pivots, along the parent's y axis.",
        example: "spacing 40 mm",
      },
      {
        key: "angle",
        shape: q("angle"),
        doc: "Reference angle of the bars from the parent's x axis.",
        example: "angle 20 deg",
      },
      {
        key: "range",
        shape: { type: "range", dimension: "angle" },
        doc: "Range of the bars' angle (the stage's degree of freedom).",
        example: "range -30 deg .. 50 deg",
      },
      { key: "fixed", shape: { type: "flag" }, doc: "Locks the stage at `angle`.", example: "fixed" },
      {
        key: "bars",
        shape: { type: "sequence", items: [{ type: "section" }, { type: "material" }] },
        required: true,
        doc: "Section and material of both bars.",
        example: "bars rect 16 mm x 5 mm petg",
      },
      {
        key: "head_mass",
        shape: q("mass"),
        doc: "Mass of the far upright (default 0).",
        example: "head_mass 50 g",
      },
      {
        key: "pins",
        shape: { type: "sequence", items: [q("length"), { type: "material" }] },
        doc: "Diameter and material of the four pins.",
        example: "pins 4 mm steel_1018",
      },
      {
        key: "shear",
        shape: { type: "word", words: ["single", "double"] },
        doc: "Shear planes of the pins (default single).",
        example: "shear double",
      },
      {
        key: "friction",
        shape: q("torque"),
        doc: "Holding torque of the root pivot's friction.",
        example: "friction 0.1 N*m",
      },
    ],
  },
  {
    keyword: "spring",
    named: true,
    doc: "A force element between two points (or, for torsion, at a joint).",
    properties: [
      ...springKindFlags(),
      {
        key: "between",
        shape: {
          type: "sequence",
          items: [{ type: "reference", to: "point" }, kw("and"), { type: "reference", to: "point" }],
        },
        springKinds: kindsTaking("between"),
        doc: "The two hook points.",
        example: "between base.anchor and arm(80 mm, 0 mm)",
      },
      {
        key: "at",
        shape: { type: "reference", to: "joint-or-parallelogram" },
        springKinds: kindsTaking("at"),
        doc: "The joint (or parallelogram) it acts at.",
        example: "at shoulder",
      },
      {
        key: "rate",
        shape: { type: "quantity-or", dimensions: ["stiffness", "angular_stiffness"] },
        springKinds: kindsTaking("rate"),
        doc: "Spring rate (angular for torsion).",
        example: "rate 0.8 N/mm",
      },
      {
        key: "free_length",
        shape: q("length"),
        springKinds: kindsTaking("free_length"),
        doc: "Unloaded length.",
        example: "free_length 60 mm",
      },
      {
        key: "initial_tension",
        shape: q("force"),
        springKinds: kindsTaking("initial_tension"),
        doc: "Force the coils hold closed before stretching.",
        example: "initial_tension 4 N",
      },
      {
        key: "max_length",
        shape: q("length"),
        springKinds: kindsTaking("max_length"),
        doc: "Longest safe length.",
        example: "max_length 140 mm",
      },
      {
        key: "wire",
        shape: q("length"),
        springKinds: kindsTaking("wire"),
        doc: "Wire diameter (coil geometry instead of rate; for torsion, also to check its stress).",
        example: "wire 1.2 mm",
      },
      {
        key: "coil",
        shape: q("length"),
        springKinds: kindsTaking("coil"),
        doc: "Mean coil diameter.",
        example: "coil 9.6 mm",
      },
      {
        key: "coils",
        shape: q("dimensionless"),
        springKinds: kindsTaking("coils"),
        doc: "Number of body coils (of a torsion spring: active coils, legs not counted).",
        example: "coils 20",
      },
      {
        key: "material",
        shape: { type: "material" },
        springKinds: kindsTaking("material"),
        doc: "Wire material, or the cord's rubber.",
        example: "material music_wire",
      },
      {
        key: "area",
        shape: q("area"),
        springKinds: kindsTaking("area"),
        doc: "Unstretched cross-section of the cord.",
        example: "area 12 mm^2",
      },
      {
        key: "tube",
        shape: { type: "dims", dimension: "length" },
        springKinds: kindsTaking("tube"),
        doc: "Rubber tube outer diameter x wall.",
        example: "tube 6 mm x 1.5 mm",
      },
      {
        key: "max_stretch",
        shape: q("dimensionless"),
        springKinds: kindsTaking("max_stretch"),
        doc: "Largest safe stretch ratio L / L0.",
        example: "max_stretch 2.5",
      },
      {
        key: "force",
        shape: q("force"),
        springKinds: kindsTaking("force"),
        doc: "Force at full extension.",
        example: "force 100 N",
      },
      {
        key: "progression",
        shape: q("dimensionless"),
        springKinds: kindsTaking("progression"),
        doc: "Compressed force / extended force.",
        example: "progression 1.3",
      },
      {
        key: "stroke",
        shape: q("length"),
        springKinds: kindsTaking("stroke"),
        doc: "Stroke.",
        example: "stroke 60 mm",
      },
      {
        key: "extended_length",
        shape: q("length"),
        springKinds: kindsTaking("extended_length"),
        doc: "Eye-to-eye length fully extended.",
        example: "extended_length 180 mm",
      },
      {
        key: "preload",
        shape: { type: "quantity-or", dimensions: ["angle", "torque"] },
        springKinds: kindsTaking("preload"),
        doc: "Wind-up angle or torque at the reference pose; positive turns the child counter-clockwise.",
        example: "preload 90 deg",
      },
      {
        key: "max_angle",
        shape: q("angle"),
        springKinds: kindsTaking("max_angle"),
        doc: "Largest safe wind-up angle.",
        example: "max_angle 270 deg",
      },
      {
        key: "anchor_fastening",
        shape: { type: "reference", to: "fastening" },
        springKinds: kindsTaking("anchor_fastening"),
        doc: "How the first end's lug or eyelet is held to its body.",
        example: "anchor_fastening lug_screws",
      },
      {
        key: "hook_fastening",
        shape: { type: "reference", to: "fastening" },
        springKinds: kindsTaking("hook_fastening"),
        doc: "How the second end's lug or eyelet is held to its body.",
        example: "hook_fastening lug_screws",
      },
      {
        key: "strands",
        shape: q("dimensionless"),
        springKinds: ["elastic"],
        doc: "Number of equal cords side by side (default 1): the cross-section is this many times `area` or `tube`.",
        example: "strands 2",
      },
      {
        key: "tune",
        shape: { type: "tuning" },
        doc: "Frees one thing for the design search (`poise tune`) within bounds: `anchor` or `hook` in a rectangle of its body's frame, or a numeric property in a range. One line each.",
        example: "tune anchor (-10 mm, 40 mm) .. (10 mm, 120 mm)",
      },
      {
        key: "adjust",
        shape: { type: "tuning" },
        doc: "An adjuster set in service (a slot for the anchor, a preload screw, a strut's setting): the analysis gives its setting for each payload mass. Same shape as `tune`.",
        example: "adjust initial_tension 0 N .. 20 N",
      },
    ],
  },
  {
    keyword: "payload",
    named: true,
    doc: "What the arm carries: a mass at a point, with an optional steady working force.",
    properties: [
      { key: "mass", shape: q("mass"), required: true, doc: "Mass of the payload.", example: "mass 450 g" },
      {
        key: "at",
        shape: { type: "reference", to: "point" },
        required: true,
        doc: "Its centre of mass.",
        example: "at reach.head(40 mm, -20 mm)",
      },
      {
        key: "force",
        shape: { type: "vector", dimension: "force" },
        doc: "Steady working force (Fx, Fy), world, or (Fx, Fy, Fz) with z out of the drawing plane towards the reader.",
        example: "force (0 N, -5 N)",
      },
      {
        key: "torque",
        shape: { type: "vector", dimension: "torque" },
        doc: "Steady working torque (Tx, Ty, Tz) in the drawing's axes, z out of the plane towards the reader (a rotary tool's reaction, a cable's twist).",
        example: "torque (0 N*m, 0.2 N*m, 0 N*m)",
      },
      {
        key: "range",
        shape: { type: "range", dimension: "mass" },
        doc: "Range of masses (a holder for several tools).",
        example: "range 300 g .. 700 g",
      },
      {
        key: "fastening",
        shape: { type: "reference", to: "fastening" },
        doc: "How it is clamped to its body.",
        example: "fastening tool_clamp",
      },
    ],
  },
  {
    keyword: "bearing",
    named: true,
    doc: "What turns on what: a ball bearing (balls), a plain bearing (bore), or a bought one (static_rating).",
    properties: [
      {
        key: "balls",
        shape: { type: "sequence", items: [{ type: "count-of", dimension: "length" }, { type: "material" }] },
        doc: "Ball count x diameter, and the balls' material.",
        example: "balls 12 x 6 mm chrome_steel",
      },
      {
        key: "pitch",
        shape: q("length"),
        doc: "Pitch circle diameter of the balls.",
        example: "pitch 50 mm",
      },
      {
        key: "races",
        shape: { type: "material" },
        doc: "Material of the races the balls roll on.",
        example: "races pla",
      },
      {
        key: "groove",
        shape: q("length"),
        doc: "Radius of the races' groove across the rolling direction (default: flat races).",
        example: "groove 3.2 mm",
      },
      {
        key: "bore",
        shape: q("length"),
        doc: "Bore of a plain bearing (a sleeve or a printed hole).",
        example: "bore 8 mm",
      },
      {
        key: "length",
        shape: q("length"),
        doc: "Length of a plain bearing along its axis.",
        example: "length 12 mm",
      },
      {
        key: "material",
        shape: { type: "material" },
        doc: "Material of a plain bearing's sleeve or hole.",
        example: "material petg",
      },
      {
        key: "static_rating",
        shape: q("force"),
        doc: "Basic static load rating C0 of a bought bearing (maker's data).",
        example: "static_rating 1.37 kN",
      },
      {
        key: "dynamic_rating",
        shape: q("force"),
        doc: "Basic dynamic load rating C (maker's data; shown, not checked).",
        example: "dynamic_rating 3.3 kN",
      },
    ],
  },
  {
    keyword: "fastening",
    named: true,
    doc: "How two parts are held together where a load passes: screws, bolts or glue.",
    properties: [
      {
        key: "screws",
        shape: { type: "sequence", items: [{ type: "count-of", dimension: "length" }, { type: "material" }] },
        doc: "Screw count x nominal diameter, and optionally their property class (default steel_4_8).",
        example: "screws 2 x 3 mm",
      },
      {
        key: "into",
        shape: { type: "material" },
        doc: "The material the screws' thread is cut or formed in.",
        example: "into pla",
      },
      {
        key: "engagement",
        shape: q("length"),
        doc: "Length of thread engaged in that material.",
        example: "engagement 6 mm",
      },
      {
        key: "thread",
        shape: { type: "word", words: ["formed", "tapped"] },
        doc: "Thread formed by the screw in a pilot hole, or tapped (default: formed in prints, tapped otherwise).",
        example: "thread tapped",
      },
      {
        key: "bolts",
        shape: { type: "sequence", items: [{ type: "count-of", dimension: "length" }, { type: "material" }] },
        doc: "Bolt count x nominal diameter, and their material or property class (with nuts).",
        example: "bolts 2 x 4 mm steel_8_8",
      },
      {
        key: "shear",
        shape: { type: "word", words: ["single", "double"] },
        doc: "Shear planes of each bolt (default single).",
        example: "shear double",
      },
      {
        key: "pitch",
        shape: q("length"),
        doc: "Thread pitch (default: ISO coarse pitch of the diameter).",
        example: "pitch 0.5 mm",
      },
      {
        key: "spacing",
        shape: q("length"),
        doc: "Between neighbouring screws or bolts, in a row.",
        example: "spacing 12 mm",
      },
      {
        key: "adhesive",
        shape: { type: "material" },
        doc: "Adhesive: a material whose strength is its lap-shear strength.",
        example: "adhesive epoxy",
      },
      {
        key: "area",
        shape: q("area"),
        doc: "Bonded area.",
        example: "area 300 mm^2",
      },
      {
        key: "axis",
        shape: { type: "word", words: ["across", "through"] },
        doc: "Screws across the body in the arm's plane, or through the plane (default: through at a joint, else across).",
        example: "axis across",
      },
      {
        key: "lever",
        shape: q("length"),
        doc: "Height of the load's line above the fastened face: it pries the part off (default: the point's offset from the body's axis).",
        example: "lever 10 mm",
      },
    ],
  },
  {
    keyword: "require",
    named: false,
    doc: "The design's acceptance limits; each omitted one takes its documented default.",
    properties: [
      {
        key: "balance",
        shape: { type: "sequence", items: [q("force"), kw("at"), { type: "reference", to: "payload" }] },
        doc: "Largest hand force to hold the payload anywhere in range (default 1 N; `at` optional).",
        example: "balance 2 N at camera",
      },
      {
        key: "safety",
        shape: q("dimensionless"),
        doc: "Least safety factor on every part (default 2).",
        example: "safety 2.5",
      },
      {
        key: "tilt",
        shape: { type: "sequence", items: [q("angle"), kw("at"), { type: "reference", to: "payload" }] },
        doc: "Largest head orientation change (default 2 deg).",
        example: "tilt 1 deg at camera",
      },
      {
        key: "deflection",
        shape: { type: "sequence", items: [q("length"), kw("at"), { type: "reference", to: "payload" }] },
        doc: "Largest elastic deflection (default 2 mm).",
        example: "deflection 1 mm at camera",
      },
      {
        key: "frequency",
        shape: q("frequency"),
        doc: "Lowest natural frequency of the loaded arm (default 4 Hz).",
        example: "frequency 6 Hz",
      },
      {
        key: "tipping",
        shape: q("dimensionless"),
        doc: "Safety against tipping the base (default 1.5).",
        example: "tipping 2",
      },
      {
        key: "clearance",
        shape: q("length"),
        doc: "Least distance between bodies and to the bench (default 3 mm).",
        example: "clearance 5 mm",
      },
    ],
  },
  {
    keyword: "sweep",
    named: false,
    doc: "How densely the analysis visits the range of motion.",
    properties: [
      {
        key: "steps",
        shape: q("dimensionless"),
        doc: "Poses per degree of freedom, both ends included (default 37, at most 2001).",
        example: "steps 37",
      },
      {
        key: "grid",
        shape: { type: "word", words: ["on", "off"] },
        doc: "Sweep the grid of all degrees of freedom (on) or each alone (off). Default on.",
        example: "grid on",
      },
    ],
  },
  {
    keyword: "aged",
    named: false,
    doc: "An aged load case: the arm after a time under its load, rubber cords relaxed and printed parts crept; balance and stiffness are checked on it too.",
    properties: [
      {
        key: "after",
        shape: q("time"),
        required: true,
        doc: "How long the arm has held its load.",
        example: "after 1 year",
      },
      {
        key: "relaxation",
        shape: q("dimensionless"),
        doc: "Share of a rubber cord's force lost by then, 0 to 1 (default from the relaxation rule in docs/checks.md).",
        example: "relaxation 0.2",
      },
      {
        key: "creep",
        shape: q("dimensionless"),
        doc: "Share of printed parts' stiffness lost by then, 0 to 1 (default from the creep rule in docs/checks.md).",
        example: "creep 0.4",
      },
    ],
  },
];

/** Properties allowed directly inside `arm { }`. */
export const ARM_PROPERTIES: readonly PropertySpec[] = [
  {
    key: "gravity",
    shape: q("acceleration"),
    doc: "Acceleration of gravity (default standard gravity 9.80665 m/s^2).",
    example: "gravity 9.81 m/s^2",
  },
];

export function declarationSpec(keyword: string): DeclarationSpec | undefined {
  return DECLARATIONS.find((d) => d.keyword === keyword);
}

/** Documented defaults of the `require` block (SI). Common practice with no source: a designer's
 * starting points, stated in docs/language.md. */
export const REQUIREMENT_DEFAULTS = {
  balanceN: 1.0,
  safety: 2.0,
  tiltRad: (2 * Math.PI) / 180,
  deflectionM: 0.002,
  frequencyHz: 4,
  tipping: 1.5,
  clearanceM: 0.003,
} as const;

export const SWEEP_DEFAULTS = { steps: 37, maxSteps: 2001, grid: true } as const;

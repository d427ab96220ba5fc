// The physical dimensions a property can expect. Angle is kept as its own base dimension (though SI
// treats the radian as 1) so that "angle expects an angle, got a length" can be said.

export type DimensionName =
  | "length"
  | "area"
  | "mass"
  | "force"
  | "torque"
  | "stiffness" // force per length
  | "angular_stiffness" // torque per angle
  | "angle"
  | "pressure" // also modulus and strength
  | "density"
  | "acceleration"
  | "frequency"
  | "time" // how long a load is held (the aged case)
  | "dimensionless";

/** Exponents of the base dimensions: mass, length, time, angle. */
export interface DimensionVector {
  readonly mass: number;
  readonly length: number;
  readonly time: number;
  readonly angle: number;
}

export const DIMENSIONS: Readonly<Record<DimensionName, DimensionVector>> = {
  length: { mass: 0, length: 1, time: 0, angle: 0 },
  area: { mass: 0, length: 2, time: 0, angle: 0 },
  mass: { mass: 1, length: 0, time: 0, angle: 0 },
  force: { mass: 1, length: 1, time: -2, angle: 0 },
  torque: { mass: 1, length: 2, time: -2, angle: 0 },
  stiffness: { mass: 1, length: 0, time: -2, angle: 0 },
  angular_stiffness: { mass: 1, length: 2, time: -2, angle: -1 },
  angle: { mass: 0, length: 0, time: 0, angle: 1 },
  pressure: { mass: 1, length: -1, time: -2, angle: 0 },
  density: { mass: 1, length: -3, time: 0, angle: 0 },
  acceleration: { mass: 0, length: 1, time: -2, angle: 0 },
  frequency: { mass: 0, length: 0, time: -1, angle: 0 },
  time: { mass: 0, length: 0, time: 1, angle: 0 },
  dimensionless: { mass: 0, length: 0, time: 0, angle: 0 },
};

/** Words for messages: "mass expects a mass, got a length". */
export const DIMENSION_WITH_ARTICLE: Readonly<Record<DimensionName, string>> = {
  length: "a length",
  area: "an area",
  mass: "a mass",
  force: "a force",
  torque: "a torque",
  stiffness: "a stiffness (force per length)",
  angular_stiffness: "an angular stiffness (torque per angle)",
  angle: "an angle",
  pressure: "a pressure or modulus",
  density: "a density",
  acceleration: "an acceleration",
  frequency: "a frequency",
  time: "a time",
  dimensionless: "a plain number",
};

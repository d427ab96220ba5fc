// A typical bench arm for the benchmark: 12 bodies (base, two parallelogram stages, a wrist link
// and a locked parallelogram visor), 3 degrees of freedom, every common spring kind.
export const TYPICAL_ARM = `
arm "Benchmark: typical two-stage arm with a wrist" {
  base post {
    mass 3 kg
    footprint 250 mm x 200 mm
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 380 mm)
  }
  parallelogram lower_stage {
    on post.pivot
    length 300 mm
    spacing 40 mm
    angle 20 deg
    range -20 deg .. 50 deg
    bars rect 20 mm x 6 mm aluminium_6061_t6
    head_mass 60 g
    pins 5 mm steel_1018
    friction 0.1 N*m
  }
  parallelogram upper_stage {
    on lower_stage.head
    length 280 mm
    spacing 35 mm
    angle -10 deg
    range -40 deg .. 30 deg
    bars rect 18 mm x 5 mm aluminium_6061_t6
    head_mass 80 g
    pins 5 mm steel_1018
  }
  link wrist_arm {
    length 80 mm
    section rect 15 mm x 6 mm
    material aluminium_6061_t6
  }
  joint wrist {
    connects upper_stage.head to wrist_arm.start
    angle -60 deg
    range -90 deg .. -30 deg
    pin 5 mm steel_1018
    friction 0.2 N*m
  }
  parallelogram visor {
    on wrist_arm.end
    length 60 mm
    spacing 20 mm
    angle 0 deg
    fixed
    bars rect 8 mm x 3 mm pla
  }
  spring lower_lift {
    zero_length
    between post.anchor and lower_stage.lower(80 mm, 0 mm)
    rate 0.6 N/mm
  }
  spring upper_lift {
    extension
    between lower_stage.head(0 mm, 70 mm) and upper_stage.lower(90 mm, 0 mm)
    rate 0.4 N/mm
    free_length 40 mm
    initial_tension 5 N
  }
  spring wrist_coil {
    torsion
    at wrist
    rate 0.002 N*m/deg
    preload -20 deg
  }
  payload lamp {
    mass 400 g
    at visor.head(30 mm, 0 mm)
  }
}
`;

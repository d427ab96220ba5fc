// Plain SI wording of numbers inside mechanics and balance messages (mm, deg, N, N*m). The
// editor layer formats readout figures in the user's unit system; messages stay in SI.

export function formatLength(m: number): string {
  return `${(m * 1000).toFixed(m < 0.01 ? 3 : 1)} mm`;
}

export function formatAngle(rad: number): string {
  return `${((rad * 180) / Math.PI).toFixed(1)} deg`;
}

export function formatForce(n: number): string {
  return `${n.toFixed(Math.abs(n) < 10 ? 2 : 1)} N`;
}

export function formatTorque(nm: number): string {
  return `${nm.toFixed(Math.abs(nm) < 10 ? 3 : 2)} N*m`;
}

export function formatRate(nPerM: number): string {
  return `${(nPerM / 1000).toFixed(3)} N/mm`;
}

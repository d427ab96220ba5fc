// Golden-section narrowing of a bracket around the least of a one-variable function (Kiefer 1953;
// Press et al., Numerical Recipes, 3rd ed., section 10.2). Its callers differ only in when to
// stop and in how they treat the bracket's ends, so those stay with them.

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Narrows [lo, hi] while `goOn(width, step)` says so; returns the final bracket [a, b]. Each step
 * costs one evaluation of f (two at the start). */
export function narrowBracket(
  f: (x: number) => number,
  lo: number,
  hi: number,
  goOn: (width: number, step: number) => boolean,
): [number, number] {
  let a = lo;
  let b = hi;
  let c = b - GOLDEN * (b - a);
  let d = a + GOLDEN * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let step = 0; goOn(b - a, step); step++) {
    if (fc <= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - GOLDEN * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + GOLDEN * (b - a);
      fd = f(d);
    }
  }
  return [a, b];
}

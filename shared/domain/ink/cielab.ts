/**
 * sRGB (8-bit, IEC 61966-2-1) → CIE 1976 L*a*b* under the D65 reference white, the perceptual space the ink
 * colour model scores in. Matrix and white point as Bruce Lindbloom tabulates them (RGB/XYZ matrices, sRGB,
 * D65); L*a*b* from XYZ with the CIE's ε = 216/24389 and κ = 24389/27 (CIE 15:2004, exact form).
 */
export interface Lab {
  l: number;
  a: number;
  b: number;
}

const WHITE_X = 0.95047;
const WHITE_Y = 1;
const WHITE_Z = 1.08883;
const EPSILON = 216 / 24389;
const KAPPA = 24389 / 27;

// Linear-light value of each 8-bit sRGB code (the sRGB transfer curve).
const LINEAR = new Float64Array(256);
for (let v = 0; v < 256; v++) {
  const c = v / 255;
  LINEAR[v] = c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function f(t: number): number {
  return t > EPSILON ? Math.cbrt(t) : (KAPPA * t + 16) / 116;
}

/** L*a*b* of an sRGB colour given as 0–255 channel values (fractions are rounded). */
export function srgbToLab(r: number, g: number, b: number): Lab {
  const lr = LINEAR[clampByte(r)];
  const lg = LINEAR[clampByte(g)];
  const lb = LINEAR[clampByte(b)];
  const x = 0.4124564 * lr + 0.3575761 * lg + 0.1804375 * lb;
  const y = 0.2126729 * lr + 0.7151522 * lg + 0.072175 * lb;
  const z = 0.0193339 * lr + 0.119192 * lg + 0.9503041 * lb;
  const fx = f(x / WHITE_X);
  const fy = f(y / WHITE_Y);
  const fz = f(z / WHITE_Z);
  return { l: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

function clampByte(v: number): number {
  return Math.min(255, Math.max(0, Math.round(v)));
}

/** CIE 1976 colour difference ΔE*ab: the Euclidean distance in L*a*b*. */
export function deltaE(p: Lab, q: Lab): number {
  return Math.hypot(p.l - q.l, p.a - q.a, p.b - q.b);
}

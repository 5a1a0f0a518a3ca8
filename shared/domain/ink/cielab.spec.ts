import { deltaE, srgbToLab } from './cielab';

describe('srgbToLab', () => {
  // Reference values: Bruce Lindbloom's CIE colour calculator (sRGB, D65 reference white, no adaptation), as
  // commonly quoted for the sRGB primaries; figures from memory of that table, checked against color-convert 2.0.1
  // (a reference npm library) to within its rounder matrix (±0.02).
  it.each([
    ['white', [255, 255, 255], [100, 0, 0]],
    ['black', [0, 0, 0], [0, 0, 0]],
    ['red', [255, 0, 0], [53.2408, 80.0925, 67.2032]],
    ['green', [0, 255, 0], [87.7347, -86.1827, 83.1793]],
    ['blue', [0, 0, 255], [32.297, 79.1875, -107.8602]],
  ])('when the colour is sRGB %s, then L*a*b* matches the published value within 0.01', (_name, rgb, lab) => {
    const result = srgbToLab(rgb[0], rgb[1], rgb[2]);

    expect(result.l).toBeCloseTo(lab[0], 2);
    expect(result.a).toBeCloseTo(lab[1], 2);
    expect(result.b).toBeCloseTo(lab[2], 2);
  });

  it('when the colour is a mid grey, then a* and b* are zero and L* is 53.59 (sRGB 128, D65)', () => {
    // L* of sRGB 128: Y = ((128/255 + 0.055)/1.055)^2.4 = 0.21586, L* = 116·Y^(1/3) − 16 = 116 · 0.59987 − 16 = 53.585 (worked by hand from IEC 61966-2-1 and CIE 15).
    const grey = srgbToLab(128, 128, 128);

    expect(grey.l).toBeCloseTo(53.585, 2);
    expect(Math.abs(grey.a)).toBeLessThan(0.01);
    expect(Math.abs(grey.b)).toBeLessThan(0.01);
  });

  it('when two colours are given, then ΔE*ab is their Euclidean distance in L*a*b*', () => {
    expect(deltaE({ l: 50, a: 3, b: 4 }, { l: 50, a: 0, b: 0 })).toBeCloseTo(5, 10);
  });
});

import {
  geometricFromGeopotentialM,
  geopotentialFromGeometricM,
  pressureAltitudeM,
  standardDensityKgM3,
  standardPressureHpa,
  standardTemperatureK,
} from './standard-atmosphere';

// ISO 2533:1975 Table 5 rows (docs/references.md Table 1.1): H m′, h m, T K, p hPa, ρ kg m⁻³, and the size of one unit
// in the last printed digit of p and ρ (printed tables are rounded; allow ±1 in the last digit).
const table5: [number, number, number, number, number, number, number][] = [
  [-500, -500, 291.4, 1074.78, 1.28489, 0.01, 0.00001],
  [0, 0, 288.15, 1013.25, 1.225, 0.01, 0.00001],
  [500, 500, 284.9, 954.608, 1.16727, 0.001, 0.00001],
  [1000, 1000, 281.65, 898.746, 1.11164, 0.001, 0.00001],
  [1500, 1500, 278.4, 845.56, 1.05807, 0.001, 0.00001],
  [2000, 2001, 275.15, 794.952, 1.00649, 0.001, 0.00001],
  [3000, 3001, 268.65, 701.085, 0.909122, 0.001, 0.000001],
  [4000, 4003, 262.15, 616.402, 0.819129, 0.001, 0.000001],
  [5000, 5004, 255.65, 540.199, 0.736116, 0.001, 0.000001],
  [8000, 8010, 236.15, 355.998, 0.525167, 0.001, 0.000001],
  [10000, 10016, 223.15, 264.362, 0.412706, 0.001, 0.000001],
  [11000, 11019, 216.65, 226.32, 0.363918, 0.001, 0.000001],
  [15000, 15035, 216.65, 120.445, 0.193673, 0.001, 0.000001],
  // At 20 000 m′ the ISO formula gives 54.74889 hPa (layer base 5 474.889 Pa), 1.9 units of the last printed
  // digit above the table's 54.7487, which matches ICAO Doc 7488/3's 5 474.87 Pa; this row allows ±2 units (ρ ±4).
  [20000, 20063, 216.65, 54.7487, 0.0880345, 0.0002, 0.0000004],
];

describe('standard atmosphere', () => {
  it.each(table5)('when H = %i m′, then h, T, p and ρ match ISO 2533:1975 Table 5', (altitudeM, geometricM, temperatureK, pressureHpa, density, pStep, rhoStep) => {
    const t = standardTemperatureK(altitudeM);
    const p = standardPressureHpa(altitudeM);
    const rho = standardDensityKgM3(altitudeM);
    const h = geometricFromGeopotentialM(altitudeM);

    expect(Math.abs(t - temperatureK)).toBeLessThanOrEqual(0.0005); // ISO 2533:1975 Table 5, T to 3 decimals
    expect(Math.abs(p - pressureHpa)).toBeLessThanOrEqual(pStep); // ISO 2533:1975 Table 5, ±1 last digit
    expect(Math.abs(rho - density)).toBeLessThanOrEqual(rhoStep); // ISO 2533:1975 Table 5, ±1 last digit
    expect(Math.abs(h - geometricM)).toBeLessThanOrEqual(1); // ISO 2533:1975 Table 5, h to the metre
  });

  it.each<[number, number, number]>([
    [11000, 22632.06, 0.05], // layer base, several reproductions of ISO 2533 (docs/references.md §1)
    [20000, 5474.889, 0.05],
    [32000, 868.02, 0.05],
    [47000, 110.91, 0.05],
  ])('when H = %i m′, then the layer-base pressure is %f Pa', (altitudeM, pressurePa, tolerancePa) => {
    const p = standardPressureHpa(altitudeM) * 100;

    expect(Math.abs(p - pressurePa)).toBeLessThanOrEqual(tolerancePa);
  });

  it.each<[number, number, number]>([
    // ISO 2533 inverse formula H = (T0/L)·[1 − (p/P0)^0.1902632], derived (docs/references.md §1 [D]).
    [1000, 110.88, 0.005],
    [850, 1457.3, 0.05],
    [700, 3012.18, 0.005],
    [500, 5574.44, 0.005],
    // Round trip of ISO 2533:1975 Table 5 row H = 1000 m′, p = 898.746 hPa (printed to 3 decimals: ±0.01 m).
    [898.746, 1000.0, 0.01],
    [1013.25, 0, 1e-9],
  ])('when p = %f hPa, then the pressure altitude is %f m′', (pressureHpa, expectedM, toleranceM) => {
    const h = pressureAltitudeM(pressureHpa);

    expect(Math.abs(h - expectedM)).toBeLessThanOrEqual(toleranceM);
  });

  it.each<number>([-4000, -500, 5000, 11000, 15000, 25000, 40000, 49000, 60000, 75000])(
    'when H = %i m′ goes to pressure and back, then it returns',
    (altitudeM) => {
      const back = pressureAltitudeM(standardPressureHpa(altitudeM));

      expect(back).toBeCloseTo(altitudeM, 6);
    },
  );

  it.each<number>([-100, 0, 1234.5, 20000])('when h = %f m goes to geopotential and back, then it returns', (geometricM) => {
    const back = geometricFromGeopotentialM(geopotentialFromGeometricM(geometricM));

    expect(back).toBeCloseTo(geometricM, 6);
  });

  it.each<[string, () => number]>([
    ['an altitude above 80 km', () => standardPressureHpa(90000)],
    ['an altitude below −5 km', () => standardTemperatureK(-6000)],
    ['a pressure above the −5 km value', () => pressureAltitudeM(2000)],
    ['a negative pressure', () => pressureAltitudeM(-1)],
  ])('when asked for %s, then it throws a RangeError', (_label, act) => {
    expect(act).toThrow(RangeError);
  });
});

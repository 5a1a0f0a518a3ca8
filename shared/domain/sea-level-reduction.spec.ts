import { meanColumnTemperatureK, reduceLowLevelStationHpa, reduceToSeaLevelHpa, virtualTemperatureK } from './sea-level-reduction';

describe('reduceToSeaLevelHpa', () => {
  // WMO-No. 8 Part I Ch. 3: log10(p0/p) = Kp·Hp/Tmv, Tmv = Ts + a·Hp/2 + es·Ch, Kp = 0.0148275, a = 0.0065, Ch = 0.12.
  // Check values derived from that formula (docs/references.md §4 [D]), printed to 0.01 hPa.
  it.each<[number, number, number, number, number]>([
    [950.0, 500, 15, 10, 1007.4],
    [900.0, 1000, 5, 6, 1015.78],
    [1000.0, 100, 20, 15, 1011.63],
  ])('when p = %f hPa at %i gpm, %f °C, es = %f hPa, then p0 = %f hPa', (stationPressureHpa, elevationM, temperatureC, vapourPressureHpa, expectedHpa) => {
    const p0 = reduceToSeaLevelHpa({ stationPressureHpa, elevationM, temperatureC, vapourPressureHpa });

    expect(Math.abs(p0 - expectedHpa)).toBeLessThanOrEqual(0.005);
  });

  it('when the station is at 500 gpm, 15 °C with es = 10 hPa, then Tmv = 290.975 K', () => {
    // WMO-No. 8 Part I Ch. 3 formula; value derived (docs/references.md §4 [D]).
    const tmv = meanColumnTemperatureK(500, 15, 10);

    expect(tmv).toBeCloseTo(290.975, 9);
  });

  it('when the station is at sea level, then p0 is the station pressure', () => {
    const p0 = reduceToSeaLevelHpa({ stationPressureHpa: 1009.2, elevationM: 0, temperatureC: 10, vapourPressureHpa: 8 });

    expect(p0).toBe(1009.2);
  });
});

describe('reduceLowLevelStationHpa', () => {
  it('when p = 1010 hPa at 30 gpm with Tv = 290 K, then p0 = 1013.570 hPa', () => {
    // WMO-No. 8 Part I Ch. 3 low-level formula p0 = p + p·Hp/(29.27·Tv); value derived (docs/references.md §4 [D]).
    const p0 = reduceLowLevelStationHpa(1010, 30, 290);

    expect(Math.abs(p0 - 1013.57)).toBeLessThanOrEqual(0.0005);
  });

  it('when the low-level and full WMO forms reduce the same dry 30 gpm station, then they agree within 0.01 hPa', () => {
    // docs/references.md §4: at 30 m the low-level form gives 1013.570 and the exponential 1013.576 (derived).
    const low = reduceLowLevelStationHpa(1010, 30, 290);
    const full = reduceToSeaLevelHpa({ stationPressureHpa: 1010, elevationM: 30, temperatureC: 290 - 273.15 - 0.0065 * 15, vapourPressureHpa: 0 });

    expect(Math.abs(low - full)).toBeLessThanOrEqual(0.01);
  });
});

describe('virtualTemperatureK', () => {
  it.each<[number, number, number, number]>([
    [15, 0, 1000, 288.15],
    // Tv = T/(1 − (e/p)(1 − 0.622)) (Wallace & Hobbs, from memory): 288.15/(1 − 0.01·0.378).
    [15, 10, 1000, 288.15 / (1 - 0.00378)],
  ])('when t = %f °C, e = %f hPa and p = %f hPa, then Tv = %f K', (temperatureC, vapourPressureHpa, pressureHpa, expected) => {
    const tv = virtualTemperatureK(temperatureC, vapourPressureHpa, pressureHpa);

    expect(tv).toBeCloseTo(expected, 9);
  });
});

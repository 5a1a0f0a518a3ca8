import {
  altimeterSettingHpa,
  asosAltimeterSettingInHg,
  nwsPressureAltitudeFt,
  nwsPressureAltitudeM,
  stationPressureFromAltimeterHpa,
  awosAltimeterSettingInHg,
  stationPressureFromAsosAltimeterInHg,
  stationPressureFromAwosAltimeterInHg,
} from './altimeter';
import { convertPressure } from './pressure-units';

describe('nwsPressureAltitudeFt', () => {
  // NWS WFO El Paso wxcalc "Pressure Altitude": 145 366.45·[1 − (p/1013.25)^0.190284]; values derived (docs/references.md §3 [D]).
  it.each<[number, number]>([
    [1013.25, 0],
    [1000, 363.6],
    [950, 1772.0],
    [900, 3241.8],
    [850, 4779.2],
    [700, 9878.4],
    [500, 18281.2],
  ])('when station pressure is %f hPa, then pressure altitude is %f ft', (pressureHpa, expectedFt) => {
    const ft = nwsPressureAltitudeFt(pressureHpa);

    expect(Math.abs(ft - expectedFt)).toBeLessThanOrEqual(0.05);
  });

  it.each<[number, number]>([
    [1000, 110.8], // NWS wxcalc formula, derived; 1 ft = 0.3048 m (NIST SP 811)
    [850, 1456.7],
  ])('when station pressure is %f hPa, then pressure altitude is %f m', (pressureHpa, expectedM) => {
    const m = nwsPressureAltitudeM(pressureHpa);

    expect(Math.abs(m - expectedM)).toBeLessThanOrEqual(0.05);
  });
});

describe('altimeterSettingHpa and its inverse', () => {
  // NWS wxcalc "Altimeter Setting" (Smithsonian Meteorological Tables, List 1951, p. 269, eqs 1 and 3), n = 0.190284.
  // Values derived with n = 0.190284 (docs/references.md §3 [D]); MetPy's test values (n = 0.190260) within 0.03 hPa.
  it.each<[number, number, number, number]>([
    [1000, 2000, 784.287, 784.263],
    [1010, 1000, 896.052, 896.038],
    [convertPressure(29.8, 'inHg', 'hPa'), 500, 950.972, 950.965],
  ])('when the altimeter setting is %f hPa at %i m, then station pressure is %f hPa', (altimeterHpa, elevationM, derivedHpa, metPyHpa) => {
    const station = stationPressureFromAltimeterHpa(altimeterHpa, elevationM);

    expect(Math.abs(station - derivedHpa)).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(station - metPyHpa)).toBeLessThanOrEqual(0.03); // MetPy tests/calc/test_basic.py cross-check
  });

  it.each<[number, number]>([
    [1013.25, 0],
    [850.3, 1500],
    [950, 500],
    [700, 3000],
  ])('when station pressure %f hPa at %i m goes to an altimeter setting and back, then it returns', (stationHpa, elevationM) => {
    const back = stationPressureFromAltimeterHpa(altimeterSettingHpa(stationHpa, elevationM), elevationM);

    expect(back).toBeCloseTo(stationHpa, 9);
  });

  it('when the station is at sea level, then the altimeter setting is station pressure less the 0.3 hPa term', () => {
    // NWS wxcalc "Altimeter Setting": with H = 0, A = P − 0.3.
    const a = altimeterSettingHpa(1013.55, 0);

    expect(a).toBeCloseTo(1013.25, 9);
  });
});

describe('awos and asos altimeter settings', () => {
  // FAA AWOS formula AS = (Pa^N + K·Ha)^(1/N), N = 0.1903, K = 1.313e-5, as quoted with its worked examples by
  // J. Denker, av8n.com/physics/barometry.html, ±2 Pa (docs/references.md §3); inHg = 3386.389 Pa (NIST SP 811 B.8).
  it.each<[string, number, number, number]>([
    ['Prescott (KPRC)', 5045, 30.2, 84977],
    ['Flagstaff (KFLG)', 7014, 30.37, 79375],
  ])('when %s at %i ft reports A = %f inHg, then station pressure is %i Pa', (_station, elevationFt, altimeterInHg, expectedPa) => {
    const stationInHg = stationPressureFromAwosAltimeterInHg(altimeterInHg, elevationFt);

    expect(Math.abs(stationInHg * 3386.389 - expectedPa)).toBeLessThanOrEqual(2);
  });

  it.each<[number, number]>([
    [25.09, 5045],
    [23.44, 7014],
    [29.92, 0],
  ])('when field pressure is %f inHg at %i ft, then the ASOS (…^5.255) and AWOS (…^(1/0.1903)) forms agree within 0.003 inHg', (stationInHg, elevationFt) => {
    // NWS Training Center ASOS algorithm vs the FAA AWOS form; 5.255 vs 1/0.1903 = 5.2549 (derived).
    const asos = asosAltimeterSettingInHg(stationInHg, elevationFt);
    const awos = awosAltimeterSettingInHg(stationInHg, elevationFt);

    expect(Math.abs(asos - awos)).toBeLessThanOrEqual(0.003);
  });

  it.each<[number, number]>([
    [25.1, 5045],
    [23.44, 7014],
  ])('when field pressure %f inHg at %i ft goes to an AWOS setting and back, then it returns', (stationInHg, elevationFt) => {
    const back = stationPressureFromAwosAltimeterInHg(awosAltimeterSettingInHg(stationInHg, elevationFt), elevationFt);

    expect(back).toBeCloseTo(stationInHg, 9);
  });

  it.each<[number, number]>([
    [25.1, 5045],
    [29.92, 0],
    [23.44, 7014],
  ])('when field pressure %f inHg at %i ft goes to an altimeter setting and back, then it returns', (stationInHg, elevationFt) => {
    const back = stationPressureFromAsosAltimeterInHg(asosAltimeterSettingInHg(stationInHg, elevationFt), elevationFt);

    expect(back).toBeCloseTo(stationInHg, 9);
  });
});

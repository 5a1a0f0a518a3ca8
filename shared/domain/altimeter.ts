/**
 * U.S. weather-service pressure altitude and altimeter setting formulas (docs/references.md §3). These follow the
 * published constants exactly (n = 0.190284, T0 = 288 K), so they differ slightly from the ISO atmosphere.
 */

const FEET_PER_METRE = 1 / 0.3048; // 1 ft = 0.3048 m exactly (NIST SP 811)
const NWS_EXPONENT = 0.190284;
const NWS_PRESSURE_ALTITUDE_FT = 145_366.45;
// k = 1013.25^n · 0.0065/288 (Smithsonian Meteorological Tables, as used by the NWS).
const NWS_ALTIMETER_K = (1013.25 ** NWS_EXPONENT * 0.0065) / 288;
// Barometer reads ~0.3 hPa low relative to the altimeter reference in the NWS formula.
const NWS_ALTIMETER_OFFSET_HPA = 0.3;
const ASOS_EXPONENT = 0.1903;
const ASOS_POWER = 5.255;
const ASOS_K = 1.313e-5;

/** NWS pressure altitude, ft, from station pressure (hPa > 0): 145 366.45·[1 − (p/1013.25)^0.190284]. */
export function nwsPressureAltitudeFt(stationPressureHpa: number): number {
  return NWS_PRESSURE_ALTITUDE_FT * (1 - (stationPressureHpa / 1013.25) ** NWS_EXPONENT);
}

/** NWS pressure altitude in metres (0.3048 m per ft) from station pressure (hPa > 0). */
export function nwsPressureAltitudeM(stationPressureHpa: number): number {
  return nwsPressureAltitudeFt(stationPressureHpa) / FEET_PER_METRE;
}

/**
 * NWS altimeter setting, hPa, from station pressure (hPa > 0.3) and station elevation (m):
 * A = (P − 0.3)·[1 + k·H/(P − 0.3)^n]^(1/n), n = 0.190284, k = 8.42288 × 10⁻⁵.
 */
export function altimeterSettingHpa(stationPressureHpa: number, elevationM: number): number {
  const p = stationPressureHpa - NWS_ALTIMETER_OFFSET_HPA;
  return p * (1 + (NWS_ALTIMETER_K * elevationM) / p ** NWS_EXPONENT) ** (1 / NWS_EXPONENT);
}

/** Inverse of altimeterSettingHpa: station pressure, hPa, from altimeter setting (hPa) and elevation (m): P = [A^n − k·H]^(1/n) + 0.3. */
export function stationPressureFromAltimeterHpa(altimeterHpa: number, elevationM: number): number {
  return (altimeterHpa ** NWS_EXPONENT - NWS_ALTIMETER_K * elevationM) ** (1 / NWS_EXPONENT) + NWS_ALTIMETER_OFFSET_HPA;
}

/**
 * ASOS altimeter setting, inHg, from field pressure (inHg > 0) and field elevation (ft):
 * [Pa^0.1903 + 1.313 × 10⁻⁵·Ha]^5.255 (NWS Training Center, ASOS pressure algorithms).
 */
export function asosAltimeterSettingInHg(stationPressureInHg: number, elevationFt: number): number {
  return (stationPressureInHg ** ASOS_EXPONENT + ASOS_K * elevationFt) ** ASOS_POWER;
}

/** Exact inverse of asosAltimeterSettingInHg: field pressure, inHg, from altimeter setting (inHg) and field elevation (ft). */
export function stationPressureFromAsosAltimeterInHg(altimeterInHg: number, elevationFt: number): number {
  return (altimeterInHg ** (1 / ASOS_POWER) - ASOS_K * elevationFt) ** (1 / ASOS_EXPONENT);
}

/**
 * FAA AWOS altimeter setting, inHg: (Pa^N + K·Ha)^(1/N), N = 0.1903, K = 1.313 × 10⁻⁵, Ha in ft. The same law as
 * ASOS with the outer exponent written 1/N (5.2549 instead of 5.255); the two differ by ~0.002 inHg near 25 inHg.
 */
export function awosAltimeterSettingInHg(stationPressureInHg: number, elevationFt: number): number {
  return (stationPressureInHg ** ASOS_EXPONENT + ASOS_K * elevationFt) ** (1 / ASOS_EXPONENT);
}

/** Exact inverse of awosAltimeterSettingInHg: field pressure, inHg, from altimeter setting (inHg) and field elevation (ft). */
export function stationPressureFromAwosAltimeterInHg(altimeterInHg: number, elevationFt: number): number {
  return (altimeterInHg ** ASOS_EXPONENT - ASOS_K * elevationFt) ** (1 / ASOS_EXPONENT);
}

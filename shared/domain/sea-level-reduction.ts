/**
 * Reduction of station pressure to mean sea level, WMO-No. 8 (Guide to Instruments and Methods of Observation,
 * Part I, Ch. 3; after WMO Technical Note No. 61). Elevations are geopotential metres of the barometer.
 */

/** WMO constant Kp, K per gpm: 9.8/(287.04·ln 10) ≈ 0.0148275. */
export const WMO_KP = 0.0148275;
/** WMO assumed lapse rate a, K per gpm. */
export const WMO_LAPSE_RATE = 0.0065;
/** WMO humidity coefficient Ch, K per hPa of vapour pressure. */
export const WMO_CH = 0.12;
/** Below this barometer elevation (gpm) WMO-No. 8 allows the simple low-level formula. */
export const WMO_LOW_LEVEL_LIMIT_M = 50;

const KELVIN_AT_0_C = 273.15;

/** Inputs of a reduction: station pressure hPa, barometer elevation gpm, station temperature °C, vapour pressure hPa (≥ 0). */
export interface StationObservation {
  stationPressureHpa: number;
  elevationM: number;
  temperatureC: number;
  vapourPressureHpa: number;
}

/**
 * WMO-No. 8 reduction: log10(p0/p) = Kp·Hp/Tmv with Tmv = Ts + a·Hp/2 + es·Ch. Returns mean sea level pressure, hPa.
 * Valid for any elevation; WMO-No. 8 notes its limits for high stations (> ~500 gpm) and strong inversions.
 */
export function reduceToSeaLevelHpa(observation: StationObservation): number {
  const { stationPressureHpa, elevationM, temperatureC, vapourPressureHpa } = observation;
  const meanTemperatureK = meanColumnTemperatureK(elevationM, temperatureC, vapourPressureHpa);
  return stationPressureHpa * 10 ** ((WMO_KP * elevationM) / meanTemperatureK);
}

/** Tmv of the WMO reduction, K: Ts + a·Hp/2 + es·Ch (station temperature °C, elevation gpm, vapour pressure hPa). */
export function meanColumnTemperatureK(elevationM: number, temperatureC: number, vapourPressureHpa: number): number {
  return temperatureC + KELVIN_AT_0_C + (WMO_LAPSE_RATE * elevationM) / 2 + vapourPressureHpa * WMO_CH;
}

/** WMO-No. 8 low-level form (Hp < 50 gpm): p0 = p + p·Hp/(29.27·Tv), Tv virtual temperature in K. Returns hPa. */
export function reduceLowLevelStationHpa(stationPressureHpa: number, elevationM: number, virtualTemperatureK: number): number {
  return stationPressureHpa + (stationPressureHpa * elevationM) / (29.27 * virtualTemperatureK);
}

/**
 * Virtual temperature, K, from temperature (°C), vapour pressure and pressure (hPa): Tv = T/(1 − (e/p)(1 − ε)),
 * ε = 0.622 (Wallace & Hobbs, Atmospheric Science, from memory).
 */
export function virtualTemperatureK(temperatureC: number, vapourPressureHpa: number, pressureHpa: number): number {
  return (temperatureC + KELVIN_AT_0_C) / (1 - (vapourPressureHpa / pressureHpa) * (1 - 0.622));
}

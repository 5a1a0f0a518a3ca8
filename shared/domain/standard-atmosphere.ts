/**
 * ISO 2533:1975 standard atmosphere (= ICAO Doc 7488/3; = U.S. Standard Atmosphere 1976 up to 32 km), from
 * −5 000 to 80 000 geopotential metres. Constants are the ISO ones, not CODATA, so that the printed tables come
 * out: R* = 8.31432 J mol⁻¹ K⁻¹, M = 0.0289644 kg mol⁻¹ (docs/references.md §1).
 */

/** Sea-level standard pressure, Pa (ISO 2533). */
export const STANDARD_PRESSURE_PA = 101_325;
/** Sea-level standard temperature, K (ISO 2533). */
export const STANDARD_TEMPERATURE_K = 288.15;
/** Standard acceleration of gravity, m s⁻² (ISO 2533). */
export const STANDARD_GRAVITY = 9.80665;
/** Universal gas constant as used by ISO 2533 / USSA 1976, J mol⁻¹ K⁻¹. */
export const GAS_CONSTANT_ISO = 8.31432;
/** Molar mass of dry air, ISO 2533, kg mol⁻¹. */
export const MOLAR_MASS_AIR = 0.0289644;
/** Specific gas constant of dry air, R* over M, J kg⁻¹ K⁻¹ (≈ 287.05287). */
export const SPECIFIC_GAS_CONSTANT_AIR = GAS_CONSTANT_ISO / MOLAR_MASS_AIR;
/** Earth radius for geopotential altitude, m (ISO 2533). */
export const EARTH_RADIUS_M = 6_356_766;

const MIN_ALTITUDE_M = -5000;
const MAX_ALTITUDE_M = 80_000;

// Layer bases (geopotential m′) and temperature gradients (K per m′), ISO 2533.
const LAYER_DEFINITIONS: [number, number][] = [
  [0, -0.0065],
  [11_000, 0],
  [20_000, 0.001],
  [32_000, 0.0028],
  [47_000, 0],
  [51_000, -0.0028],
  [71_000, -0.002],
];

interface Layer {
  baseM: number;
  lapseKPerM: number;
  baseTemperatureK: number;
  basePressurePa: number;
}

const LAYERS: Layer[] = buildLayers();

function buildLayers(): Layer[] {
  const layers: Layer[] = [];
  let temperature = STANDARD_TEMPERATURE_K;
  let pressure = STANDARD_PRESSURE_PA;
  LAYER_DEFINITIONS.forEach(([baseM, lapseKPerM], i) => {
    if (i > 0) {
      const below = layers[i - 1];
      pressure = pressureInLayer(below, baseM);
      temperature = below.baseTemperatureK + below.lapseKPerM * (baseM - below.baseM);
    }
    layers.push({ baseM, lapseKPerM, baseTemperatureK: temperature, basePressurePa: pressure });
  });
  return layers;
}

function pressureInLayer(layer: Layer, altitudeM: number): number {
  const dh = altitudeM - layer.baseM;
  const g = STANDARD_GRAVITY;
  const r = SPECIFIC_GAS_CONSTANT_AIR;
  if (layer.lapseKPerM === 0) return layer.basePressurePa * Math.exp((-g * dh) / (r * layer.baseTemperatureK));
  const temperature = layer.baseTemperatureK + layer.lapseKPerM * dh;
  return layer.basePressurePa * (temperature / layer.baseTemperatureK) ** (-g / (layer.lapseKPerM * r));
}

function layerAt(altitudeM: number): Layer {
  if (!(altitudeM >= MIN_ALTITUDE_M && altitudeM <= MAX_ALTITUDE_M)) {
    throw new RangeError(`geopotential altitude ${altitudeM} m is outside the standard atmosphere (−5000 to 80000 m)`);
  }
  let layer = LAYERS[0];
  for (const candidate of LAYERS) if (altitudeM >= candidate.baseM) layer = candidate;
  return layer;
}

/** Standard temperature, K, at a geopotential altitude in m′ (−5 000 to 80 000). */
export function standardTemperatureK(geopotentialAltitudeM: number): number {
  const layer = layerAt(geopotentialAltitudeM);
  return layer.baseTemperatureK + layer.lapseKPerM * (geopotentialAltitudeM - layer.baseM);
}

/** Standard pressure, hPa, at a geopotential altitude in m′ (−5 000 to 80 000). */
export function standardPressureHpa(geopotentialAltitudeM: number): number {
  return pressureInLayer(layerAt(geopotentialAltitudeM), geopotentialAltitudeM) / 100;
}

/** Standard density, kg m⁻³, at a geopotential altitude in m′ (−5 000 to 80 000): ρ = p/(R·T). */
export function standardDensityKgM3(geopotentialAltitudeM: number): number {
  return (standardPressureHpa(geopotentialAltitudeM) * 100) / (SPECIFIC_GAS_CONSTANT_AIR * standardTemperatureK(geopotentialAltitudeM));
}

/** Pressure altitude: the geopotential altitude (m′) where the standard atmosphere has this pressure (hPa, ~0.0105 to ~1776). */
export function pressureAltitudeM(pressureHpa: number): number {
  const pressurePa = pressureHpa * 100;
  const top = pressureInLayer(LAYERS[LAYERS.length - 1], MAX_ALTITUDE_M);
  const bottom = pressureInLayer(LAYERS[0], MIN_ALTITUDE_M);
  if (!(pressurePa <= bottom && pressurePa >= top)) {
    throw new RangeError(`pressure ${pressureHpa} hPa is outside the standard atmosphere (−5000 to 80000 m)`);
  }
  let layer = LAYERS[0];
  for (const candidate of LAYERS) if (pressurePa <= candidate.basePressurePa) layer = candidate;
  const g = STANDARD_GRAVITY;
  const r = SPECIFIC_GAS_CONSTANT_AIR;
  if (layer.lapseKPerM === 0) return layer.baseM + ((r * layer.baseTemperatureK) / g) * Math.log(layer.basePressurePa / pressurePa);
  const ratio = (pressurePa / layer.basePressurePa) ** ((-layer.lapseKPerM * r) / g);
  return layer.baseM + (layer.baseTemperatureK / layer.lapseKPerM) * (ratio - 1);
}

/** Geometric height (m) → geopotential altitude (m′): H = r·h/(r + h), r = 6 356 766 m. */
export function geopotentialFromGeometricM(geometricHeightM: number): number {
  return (EARTH_RADIUS_M * geometricHeightM) / (EARTH_RADIUS_M + geometricHeightM);
}

/** Geopotential altitude (m′) → geometric height (m): h = r·H/(r − H). */
export function geometricFromGeopotentialM(geopotentialAltitudeM: number): number {
  return (EARTH_RADIUS_M * geopotentialAltitudeM) / (EARTH_RADIUS_M - geopotentialAltitudeM);
}

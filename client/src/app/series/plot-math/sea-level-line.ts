import { reduceToSeaLevelHpa } from '@shared/domain/sea-level-reduction';

import type { PlotPoint } from './plot-points';

/** What a reduction to mean sea level assumed, for the sentence beside the plot. */
export interface SeaLevelAssumptions {
  /** Barometer height above mean sea level, m (the station's barometer height, else its elevation). */
  heightM: number;
  /** Station temperature, °C, the same for every point: the archive holds none. */
  temperatureC: number;
  /** Vapour pressure, hPa, the same for every point. */
  vapourPressureHpa: number;
}

/**
 * The points reduced to mean sea level by the WMO-No. 8 method (docs/references.md §4) with one temperature
 * and vapour pressure for all; the range and the uncertainty scale by the same factor as the value.
 */
export function reduceLineToSeaLevel(points: readonly PlotPoint[], assumptions: SeaLevelAssumptions): PlotPoint[] {
  const reduce = (stationPressureHpa: number) =>
    reduceToSeaLevelHpa({ stationPressureHpa, elevationM: assumptions.heightM, temperatureC: assumptions.temperatureC, vapourPressureHpa: assumptions.vapourPressureHpa });
  return points.map((point) => {
    const reduced = reduce(point.pressureHpa);
    const factor = reduced / point.pressureHpa;
    return {
      ...point,
      pressureHpa: reduced,
      minHpa: reduce(point.minHpa),
      maxHpa: reduce(point.maxHpa),
      uncertaintyHpa: point.uncertaintyHpa === null ? null : point.uncertaintyHpa * factor,
    };
  });
}

/** The height a reduction uses: the barometer's, else the station's elevation, else null (no reduction possible). */
export function reductionHeightM(station: { barometerHeightM: number | null; elevationM: number | null }): number | null {
  return station.barometerHeightM ?? station.elevationM;
}

/** The sentence that says what the reduction assumed. */
export function seaLevelAssumptionText(assumptions: SeaLevelAssumptions, heightSource: 'barometer' | 'station'): string {
  const height = `${assumptions.heightM} m (the ${heightSource === 'barometer' ? 'barometer height' : 'station elevation'} on record)`;
  return (
    `Reduced to mean sea level by the WMO-No. 8 method from a height of ${height}, assuming a station temperature of ` +
    `${assumptions.temperatureC} °C and a vapour pressure of ${assumptions.vapourPressureHpa} hPa at every point (the archive holds no temperature or humidity).`
  );
}

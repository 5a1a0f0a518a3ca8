import type { CoverageMonth, StationCoverage } from '@shared/api/series-query';
import type { Db } from '../db/database';
import * as stationsService from '../stations/stations.service';
import * as coverageRepository from './coverage.repository';
import { currentSeriesVersion } from './series.service';

/** What exists for a station: its months with data and the charts (scans) of each month by status. */
export async function getStationCoverage(db: Db, stationId: string): Promise<StationCoverage> {
  await stationsService.getStation(db, stationId);
  const { version, builtAt } = await currentSeriesVersion(db, stationId);
  const dataMonths = await coverageRepository.readDataMonths(db, stationId);
  const chartRows = await coverageRepository.readChartMonths(db, stationId);
  const ends = await coverageRepository.readSeriesEnds(db, stationId);

  const months = new Map<string, CoverageMonth>();
  const monthOf = (month: string): CoverageMonth => {
    let entry = months.get(month);
    if (!entry) {
      entry = { month, pointCount: 0, flaggedShare: 0, minHpa: null, maxHpa: null, chartCount: 0, chartStates: {} };
      months.set(month, entry);
    }
    return entry;
  };
  for (const row of dataMonths) {
    Object.assign(monthOf(row.month), {
      pointCount: row.pointCount,
      flaggedShare: row.pointCount === 0 ? 0 : row.flaggedCount / row.pointCount,
      minHpa: row.minHpa,
      maxHpa: row.maxHpa,
    });
  }
  const chartStates: Record<string, number> = {};
  let chartCount = 0;
  for (const row of chartRows) {
    chartStates[row.status] = (chartStates[row.status] ?? 0) + row.count;
    chartCount += row.count;
    if (row.month === null) continue;
    const entry = monthOf(row.month);
    entry.chartCount += row.count;
    entry.chartStates[row.status] = (entry.chartStates[row.status] ?? 0) + row.count;
  }
  return {
    stationId,
    version,
    builtAt,
    first: ends.first ? new Date(ends.first).toISOString() : null,
    last: ends.last ? new Date(ends.last).toISOString() : null,
    pointCount: dataMonths.reduce((sum, row) => sum + row.pointCount, 0),
    chartCount,
    chartStates,
    months: [...months.values()].sort((a, b) => (a.month < b.month ? -1 : 1)),
  };
}

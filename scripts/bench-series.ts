/**
 * `npm run bench:series`: a generated 100-year hourly series of one station (876 000 points on 5 218
 * weekly ink lines, invented values) in a throwaway PostgreSQL, built into the materialized series by the
 * same build the series job runs, then timed through the service call GET /api/series/query makes:
 * p95 of repeated warm calls, and PostgreSQL's EXPLAIN ANALYZE execution time of the query.
 * Bars: one year at the hourly step p95 < 30 ms; 100 years at the daily step p95 < 150 ms.
 */
import { sql } from 'kysely';
import type { SeriesStep } from '@shared/api/series-query';
import type { Db } from '../server/db/database';
import type { SeriesQuery } from '../server/series/parse-series-query';
import { buildPendingSeries } from '../server/series/series-build';
import { bucketsJsonStatement } from '../server/series/series-read.repository';
import * as seriesService from '../server/series/series.service';
import { explainMs, percentile, printTable, runBenchmark, timeRuns, withBenchDatabase } from './lib/bench-kit';

const RUNS = 30;
const WARM_UPS = 3;
const YEARS = 100;
const FIRST_YEAR = 1900;

/** One station, weekly scans and ink lines, and an hourly point for every hour of YEARS years, in SQL. */
export async function loadSeries(db: Db): Promise<string> {
  const { id: personId } = await db
    .insertInto('person')
    .values({ email: 'bench@isallo.test', display_name: 'Bench Volunteer', password_hash: 'x' } as never)
    .returning('id')
    .executeTakeFirstOrThrow();
  const { id: stationId } = await db
    .insertInto('station')
    .values({ code: 'BSR', name: 'Bench Series Station', time_zone: 'UTC', latitude: 58.5, longitude: 6.25, elevation_m: 40 })
    .returning('id')
    .executeTakeFirstOrThrow();
  await sql`
    insert into chart_form (name, pressure_unit, pressure_min, pressure_max, drum_hours, mm_per_hour, mm_per_unit, pen_arm_radius_mm,
                            grid_pressure_step, label_pressure_step, grid_hours_step, label_hours_step)
    values ('Bench weekly', 'hPa', 950, 1050, 168, 1.5, 0.9, 150, 1, 10, 2, 24)`.execute(db);
  const hours = YEARS * 8760;
  const weeks = Math.ceil(hours / 168);
  // One scan and one approved ink line per week: only approved lines of live scans make a station series.
  await sql`
    insert into scan (sha256, storage_key, media_type, size_bytes, width_px, height_px, station_id, chart_form_id, chart_start, status, original_name, uploaded_by, derivative_state)
    select lpad(to_hex(w), 64, '0'), 'masters/' || w || '.png', 'image/png', 1, 7000, 2600, ${stationId},
      (select id from chart_form limit 1), timestamptz '${sql.raw(`${FIRST_YEAR}`)}-01-01 00:00Z' + make_interval(hours => w * 168), 'approved', 'w' || w || '.png', ${personId}, 'ready'
    from generate_series(0, ${weeks - 1}) w`.execute(db);
  await sql`
    insert into pin_set (scan_id, created_by, pins, model, rms_hpa, rms_minutes, fit)
    select id, ${personId}, '[]', 'affine', 0, 0, '{}' from scan`.execute(db);
  await sql`
    insert into ink_line (scan_id, pin_set_id, author_id, status, knots)
    select s.id, p.id, ${personId}, 'approved', '[]' from scan s join pin_set p on p.scan_id = s.id`.execute(db);
  // A seasonal wave, a synoptic wave and a little noise; every 97th point interpolated, every 1009th suspect.
  await sql`
    insert into series_point (ink_line_id, station_id, time, pressure_hpa, uncertainty_hpa, flag)
    select l.id, ${stationId}, s.chart_start + make_interval(hours => h),
      1013 + 8 * sin(2 * pi() * (w * 168 + h) / 8766.0) + 12 * sin(2 * pi() * (w * 168 + h) / 97.0) + random() - 0.5,
      0.15,
      case when (w * 168 + h) % 1009 = 0 then 'suspect' when (w * 168 + h) % 97 = 0 then 'interpolated' else 'ok' end
    from ink_line l join scan s on s.id = l.scan_id,
      lateral (select ((extract(epoch from s.chart_start) - extract(epoch from timestamptz '${sql.raw(`${FIRST_YEAR}`)}-01-01 00:00Z')) / 604800)::int as w) week,
      generate_series(0, 167) h
    where w * 168 + h < ${hours}`.execute(db);
  await sql`
    insert into series_change (station_id, ink_line_id, change, reason)
    select ${stationId}, id, 'added', 'bench' from ink_line`.execute(db);
  return stationId;
}

async function timeP95(run: () => Promise<unknown>): Promise<{ p95: number; median: number }> {
  const times = await timeRuns(run, WARM_UPS, RUNS);
  return { p95: percentile(times, 0.95), median: percentile(times, 0.5) };
}

interface Case {
  name: string;
  step: Exclude<SeriesStep, 'raw'>;
  fromYear: number;
  toYear: number;
  barMs: number | null;
}

async function main(): Promise<void> {
  await withBenchDatabase('series', async (db) => {
    let started = Date.now();
    const stationId = await loadSeries(db);
    const { count } = await db.selectFrom('series_point').select((eb) => eb.fn.countAll<number>().as('count')).executeTakeFirstOrThrow();
    console.log(`Loaded ${Number(count).toLocaleString('en')} stored points in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
    started = Date.now();
    const built = await buildPendingSeries(db, stationId);
    console.log(`Built the station series (${built?.pointCount.toLocaleString('en')} points, version ${built?.version}) in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
    // A series that lost its points times empty queries: refuse to print figures for it.
    if (built?.pointCount !== Number(count)) throw new Error(`The built series holds ${built?.pointCount ?? 0} points, not the ${count} loaded: the figures would time an empty series.`);
    await sql`vacuum analyze`.execute(db);

    const cases: Case[] = [
      { name: 'one year, hourly', step: 'hourly', fromYear: 1950, toYear: 1950, barMs: 30 },
      { name: '100 years, daily', step: 'daily', fromYear: FIRST_YEAR, toYear: FIRST_YEAR + YEARS - 1, barMs: 150 },
      { name: '100 years, monthly', step: 'monthly', fromYear: FIRST_YEAR, toYear: FIRST_YEAR + YEARS - 1, barMs: null },
      { name: 'ten years, hourly', step: 'hourly', fromYear: 1950, toYear: 1959, barMs: null },
    ];
    const station = (await seriesService.getQueryStations(db, [stationId]))[0];
    const rows: string[][] = [];
    let isOver = false;
    for (const one of cases) {
      const query: SeriesQuery = {
        stationIds: [stationId],
        fromMs: Date.UTC(one.fromYear, 0, 1),
        toMs: Date.UTC(one.toYear + 1, 0, 1) - 1,
        step: one.step,
        aggregate: 'mean',
        flags: null,
        format: 'json',
        withProvenance: false,
      };
      const { p95, median } = await timeP95(() => seriesService.queryStationSeriesJson(db, station, query));
      const series = await seriesService.queryStationSeries(db, station, query);
      const explained = await explainMs(db, bucketsJsonStatement({ stationId, fromMs: query.fromMs, toMs: query.toMs, flags: null }, one.step, 'mean').compile(db));
      const isUnder = one.barMs === null || p95 < one.barMs;
      if (!isUnder) isOver = true;
      rows.push([one.name, series.points.length.toLocaleString('en'), median.toFixed(1), p95.toFixed(1), explained.toFixed(1), one.barMs === null ? '–' : `${isUnder ? 'yes' : 'NO'} (< ${one.barMs})`]);
    }
    const header = ['query', 'buckets', 'server ms (median)', 'server ms (p95)', 'EXPLAIN ANALYZE ms', 'bar'];
    console.log('');
    printTable(header, rows);
    console.log(`\nserver time = the service call that writes the JSON answer (${RUNS} warm runs); EXPLAIN ANALYZE = the query that writes the buckets' JSON.`);
    console.log(isOver ? 'A query is over its bar.' : 'Every query is under its bar.');
    process.exitCode = isOver ? 1 : 0;
  });
}

if (require.main === module) runBenchmark(main);

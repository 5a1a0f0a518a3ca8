import type { DeskLine, DeskSection, DeskSummary, NextChartResult, ProgressGroup, StationTracing, TracePriority, TracePriorityInput, TracingProgressRow } from '@shared/api/desk';
import type { Page, PageQuery } from '@shared/api/paging';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { findInkLinesRequired } from '../review/ink-line-state.repository';
import * as scansRepository from '../scans/scans.repository';
import * as stationsService from '../stations/stations.service';
import { claimNextChart, countQueued, findOpenClaim, giveBackClaim } from './chart-claims';
import * as deskRepository from './desk.repository';

export async function getDeskSummary(db: Db, personId: string): Promise<DeskSummary> {
  const [counts, claim, queueCount] = await Promise.all([deskRepository.countOwnLines(db, personId), findOpenClaim(db, personId), countQueued(db, personId)]);
  return { draftCount: counts.draft, returnedCount: counts.returned, waitingCount: counts.handed_in, approvedCount: counts.approved, queueCount, claim };
}

export async function listDeskLines(db: Db, personId: string, section: DeskSection, query: PageQuery): Promise<Page<DeskLine>> {
  const { items, total } = await deskRepository.listDeskLines(db, personId, section, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function takeNextChart(db: Db, personId: string): Promise<NextChartResult> {
  return { claim: await claimNextChart(db, personId) };
}

export async function giveBackChart(db: Db, scanId: string, personId: string): Promise<void> {
  await giveBackClaim(db, scanId, personId);
}

export async function listProgress(db: Db, group: ProgressGroup, query: PageQuery): Promise<Page<TracingProgressRow>> {
  const { items, total } = await deskRepository.listProgress(db, group, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getStationTracing(db: Db, stationId: string): Promise<StationTracing> {
  await stationsService.getStation(db, stationId);
  return { stationId, inkLinesRequired: await findInkLinesRequired(db, stationId) };
}

export async function setStationTracing(db: Db, stationId: string, inkLinesRequired: 1 | 2): Promise<StationTracing> {
  await stationsService.getStation(db, stationId);
  await deskRepository.upsertStationTracing(db, stationId, inkLinesRequired);
  return { stationId, inkLinesRequired };
}

/** Sets a priority; the station or scan it names must exist (a box is any text the catalogue uses). */
export async function setTracePriority(db: Db, input: TracePriorityInput, personId: string): Promise<TracePriority> {
  if (input.scope === 'station') await stationsService.getStation(db, input.stationId as string);
  if (input.scope === 'scan' && !(await scansRepository.findScanFile(db, input.scanId as string))) {
    throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
  }
  return deskRepository.upsertTracePriority(db, input, personId);
}

export async function listTracePriorities(db: Db, query: PageQuery): Promise<Page<TracePriority>> {
  const { items, total } = await deskRepository.listTracePriorities(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

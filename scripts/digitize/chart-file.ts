import { normalizeInstant, parseInstantMs, readInstant } from '@shared/api/parse-instant';
import { parseChartFormInput } from '@shared/api/parse-chart-form';
import type { ChartForm } from '@shared/domain/chart-form';

/** A pin on a printed grid crossing: scan pixel, the instant of its time line and the pressure of its line. */
export interface ChartFilePin {
  xPx: number;
  yPx: number;
  time: string;
  pressure: number;
}

/** A time mark: the true instant the observer made it, and optionally where its foot is on the scan. */
export interface ChartFileTimeMark {
  time: string;
  xPx?: number;
  yPx?: number;
}

/** A check reading: barometer pressure (hPa, station level) at a true instant. */
export interface ChartFileCheckReading {
  time: string;
  pressureHpa: number;
}

/** What `npm run digitize` reads beside a scan (see chart.schema.json). */
export interface ChartFile {
  form: ChartForm;
  chartStart: string;
  chartOn?: string;
  chartOff?: string;
  pins: ChartFilePin[];
  timeMarks: ChartFileTimeMark[];
  checkReadings: ChartFileCheckReading[];
  ink: { colour?: string; seed?: { xPx: number; yPx: number } };
}

const HEX_COLOUR = /^#[0-9a-fA-F]{6}$/;
type Problems = string[];

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

function isFiniteNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

function checkInstant(value: unknown, path: string, problems: Problems, required = true): void {
  if (value === undefined && !required) return;
  const reading = readInstant(value);
  if (!reading.ok) problems.push(`${path}: ${reading.problem}`);
}

function checkNumber(value: unknown, path: string, problems: Problems, required = true): void {
  if (value === undefined && !required) return;
  if (!isFiniteNumber(value)) problems.push(`${path}: must be a number`);
}

/** The form is checked as the API checks a new chart form (parseChartFormInput), with paths under `form.`. */
function readForm(value: unknown, problems: Problems): ChartForm | null {
  if (!isRecord(value)) {
    problems.push('form: must be an object with the chart form fields');
    return null;
  }
  const parsed = parseChartFormInput(value);
  if (parsed.ok) return parsed.value;
  for (const [field, message] of Object.entries(parsed.details)) problems.push(`form.${field}: ${message}`);
  return null;
}

function checkList(value: unknown, path: string, problems: Problems, each: (item: Record<string, unknown>, itemPath: string) => void, minItems = 0): void {
  if (value === undefined && minItems === 0) return;
  if (!Array.isArray(value)) {
    problems.push(`${path}: must be a list`);
    return;
  }
  if (value.length < minItems) problems.push(`${path}: needs at least ${minItems} entries, has ${value.length}`);
  value.forEach((item: unknown, i: number) => {
    const itemPath = `${path}[${i}]`;
    if (!isRecord(item)) problems.push(`${itemPath}: must be an object`);
    else each(item, itemPath);
  });
}

/**
 * Checks a parsed chart.json. Problems name the field's path, e.g. `pins[2].time: must be an ISO 8601 instant…`.
 */
export function parseChartFile(x: unknown): { ok: true; value: ChartFile } | { ok: false; problems: string[] } {
  const problems: Problems = [];
  if (!isRecord(x)) return { ok: false, problems: ['(root): must be a JSON object'] };
  const form = readForm(x['form'], problems);
  checkInstant(x['chartStart'], 'chartStart', problems);
  checkInstant(x['chartOn'], 'chartOn', problems, false);
  checkInstant(x['chartOff'], 'chartOff', problems, false);
  checkList(
    x['pins'],
    'pins',
    problems,
    (pin, path) => {
      checkNumber(pin['xPx'], `${path}.xPx`, problems);
      checkNumber(pin['yPx'], `${path}.yPx`, problems);
      checkInstant(pin['time'], `${path}.time`, problems);
      checkNumber(pin['pressure'], `${path}.pressure`, problems);
    },
    3,
  );
  checkList(x['timeMarks'], 'timeMarks', problems, (mark, path) => {
    checkInstant(mark['time'], `${path}.time`, problems);
    checkNumber(mark['xPx'], `${path}.xPx`, problems, false);
    checkNumber(mark['yPx'], `${path}.yPx`, problems, false);
    if ((mark['xPx'] === undefined) !== (mark['yPx'] === undefined)) problems.push(`${path}: give both xPx and yPx, or neither`);
  });
  checkList(x['checkReadings'], 'checkReadings', problems, (reading, path) => {
    checkInstant(reading['time'], `${path}.time`, problems);
    checkNumber(reading['pressureHpa'], `${path}.pressureHpa`, problems);
  });
  const ink = x['ink'];
  if (ink !== undefined) {
    if (!isRecord(ink)) problems.push('ink: must be an object');
    else {
      if (ink['colour'] !== undefined && (typeof ink['colour'] !== 'string' || !HEX_COLOUR.test(ink['colour']))) {
        problems.push('ink.colour: must be a colour like #3b2c86');
      }
      if (ink['seed'] !== undefined) {
        if (!isRecord(ink['seed'])) problems.push('ink.seed: must be an object with xPx and yPx');
        else {
          checkNumber(ink['seed']['xPx'], 'ink.seed.xPx', problems);
          checkNumber(ink['seed']['yPx'], 'ink.seed.yPx', problems);
        }
      }
    }
  }
  if (problems.length === 0 && typeof x['chartOn'] === 'string' && typeof x['chartOff'] === 'string' && (parseInstantMs(x['chartOff']) ?? 0) <= (parseInstantMs(x['chartOn']) ?? 0)) {
    problems.push('chartOff: must be after chartOn');
  }
  if (problems.length > 0 || !form) return { ok: false, problems };
  // Every instant leaves as a full ISO 8601 UTC string, so that the digitizer's Date.parse reads each the same way.
  const utc = (value: unknown) => normalizeInstant(value) as string;
  const withUtcTime = <T extends { time: string }>(items: unknown): T[] => ((items as T[] | undefined) ?? []).map((item) => ({ ...item, time: utc(item.time) }));
  return {
    ok: true,
    value: {
      form,
      chartStart: utc(x['chartStart']),
      chartOn: x['chartOn'] === undefined ? undefined : utc(x['chartOn']),
      chartOff: x['chartOff'] === undefined ? undefined : utc(x['chartOff']),
      pins: withUtcTime<ChartFilePin>(x['pins']),
      timeMarks: withUtcTime<ChartFileTimeMark>(x['timeMarks']),
      checkReadings: withUtcTime<ChartFileCheckReading>(x['checkReadings']),
      ink: (ink as ChartFile['ink'] | undefined) ?? {},
    },
  };
}

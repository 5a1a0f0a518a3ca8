/**
 * npm run bench [-- --quick] [--only=<part of a case name>] [--fast (accuracy only, one run)] : digitizes a suite of generated charts (invented data) and prints accuracy,
 * speed and memory against the bars. Each case runs in its own process so its peak RSS is its own.
 */
import { spawnSync } from 'node:child_process';
import { mkdir, readFile, rm } from 'node:fs/promises';
import { cpus, tmpdir, totalmem } from 'node:os';
import { join } from 'node:path';
import type { RegularPoint } from '@shared/domain/resample';
import type { ClockMark } from '@shared/domain/clock-correction';
import { paperHoursFor } from '../fixtures/generator/chart-scene';
import { generateChart, type GenerateChartOptions, writeGeneratedChart } from '../fixtures/generator/generate-chart';
import { GENERATED_DAILY_FORM } from '../fixtures/generator/daily-form';
import { crossingTimeMs, parseTruthCsv, scoreSeries, windowError } from './digitize/truth-comparison';

interface BenchCase {
  name: string;
  options: GenerateChartOptions;
  /** RMSE bar for this case, hPa. */
  rmseBarHpa: number;
  isClean?: boolean;
  isLarge?: boolean;
  /** Its speed ratio is shown but not held to the bar. */
  isSpeedInfoOnly?: boolean;
  /** A jump row: bar on the jump's time error, minutes (the ±30 min error bars come with it). */
  jumpTimeBarMinutes?: number;
}

const placement = { rotationDeg: 1.2, scale: 0.985, offsetXMm: 2.5, offsetYMm: -1.5 };
// Every real scan carries sensor grain; a case that asks for no noise gets this much (grey levels, σ).
const SCANNER_GRAIN = 1.5;
const OLD_CASES: BenchCase[] = [
  // A scanner always adds some grain; without it a synthetic PNG decodes unrealistically fast (see the flat row).
  { name: 'clean 300 dpi, scanner grain', options: { seed: 7, dpi: 300, faults: { noiseSigma: SCANNER_GRAIN } }, rmseBarHpa: 0.15, isClean: true },
  { name: 'flat synthetic PNG (speed: info)', options: { seed: 7, dpi: 300 }, rmseBarHpa: 0.15, isClean: true, isSpeedInfoOnly: true },
  { name: 'crooked scan, JPEG q60', options: { seed: 8, dpi: 300, placement, faults: { blurSigmaPx: 0.8, noiseSigma: 5, jpegQuality: 60 } }, rmseBarHpa: 0.35 },
  { name: 'faded ink, stains', options: { seed: 9, dpi: 300, faults: { fadedInk: 0.6, stains: 4, fingerprints: 3, noiseSigma: 4 } }, rmseBarHpa: 0.35 },
  { name: 'second line, pen gaps', options: { seed: 10, dpi: 300, faults: { secondLine: true, penGaps: 3, noiseSigma: SCANNER_GRAIN } }, rmseBarHpa: 0.35 },
  { name: 'grey-scale, blur, noise', options: { seed: 11, dpi: 300, faults: { greyscale: true, blurSigmaPx: 1, noiseSigma: 6 } }, rmseBarHpa: 0.35 },
  {
    name: 'clock and instrument error',
    options: {
      seed: 12,
      dpi: 300,
      faults: { noiseSigma: SCANNER_GRAIN },
      instrument: { clockOffsetMinutes: 20, clockDriftMinutesPerDay: 6, instrumentOffsetHpa: 1.5 },
    },
    rmseBarHpa: 0.35,
  },
  { name: 'off-scale low', options: { seed: 13, dpi: 300, faults: { offScale: true, noiseSigma: SCANNER_GRAIN } }, rmseBarHpa: 0.35 },
  { name: '20 MP scan, JPEG q85', options: { seed: 14, dpi: 650, faults: { noiseSigma: 3, jpegQuality: 85 } }, rmseBarHpa: 0.35, isLarge: true },
];

// Fronts: the jump as a ramp of 5–60 minutes and 1–8 hPa, rises and falls, on weekly (300 dpi) and daily charts.
const WEEKLY_JUMP_BAR_MINUTES = 3;
const DAILY_JUMP_BAR_MINUTES = 1;
const grain = { noiseSigma: SCANNER_GRAIN };
const JUMP_CASES: BenchCase[] = [
  { name: 'jump weekly: rise 5.5 hPa in 30 min', options: { seed: 21, dpi: 300, faults: grain, story: { jump: { hpa: 5.5, rampMinutes: 30 } } } },
  { name: 'jump weekly: rise 2.5 hPa in 15 min', options: { seed: 22, dpi: 300, faults: grain, story: { jump: { hpa: 2.5, rampMinutes: 15 } } } },
  { name: 'jump weekly: rise 8 hPa in 5 min', options: { seed: 23, dpi: 300, faults: grain, story: { jump: { hpa: 8, rampMinutes: 5 } } } },
  { name: 'jump weekly: fall 4 hPa in 15 min', options: { seed: 24, dpi: 300, faults: grain, story: { jump: { hpa: -4, rampMinutes: 15 } } } },
  { name: 'jump weekly: rise 6 hPa in 60 min', options: { seed: 25, dpi: 300, faults: grain, story: { jump: { hpa: 6, rampMinutes: 60 } } } },
  {
    name: 'jump weekly: rise 3 hPa in 15 min, 40 min after a time mark, crooked JPEG',
    options: {
      seed: 26,
      dpi: 300,
      placement,
      faults: { blurSigmaPx: 0.7, noiseSigma: 4, jpegQuality: 70 },
      story: { jump: { hpa: 3, rampMinutes: 15 }, timeMarkBeforeJumpMinutes: 40 },
    },
  },
  { name: 'jump daily: rise 5 hPa in 5 min', options: { seed: 31, dpi: 300, form: GENERATED_DAILY_FORM, faults: grain, story: { jump: { hpa: 5, rampMinutes: 5 } } } },
  { name: 'jump daily: fall 1 hPa in 5 min', options: { seed: 32, dpi: 300, form: GENERATED_DAILY_FORM, faults: grain, story: { jump: { hpa: -1, rampMinutes: 5 } } } },
  { name: 'jump daily: rise 3 hPa in 15 min', options: { seed: 33, dpi: 300, form: GENERATED_DAILY_FORM, faults: grain, story: { jump: { hpa: 3, rampMinutes: 15 } } } },
  { name: 'jump daily: fall 7 hPa in 30 min', options: { seed: 34, dpi: 300, form: GENERATED_DAILY_FORM, faults: grain, story: { jump: { hpa: -7, rampMinutes: 30 } } } },
  {
    name: 'jump daily: rise 4 hPa in 15 min, 30 min before a time mark, rotated',
    options: {
      seed: 35,
      dpi: 300,
      form: GENERATED_DAILY_FORM,
      placement: { rotationDeg: -0.8, scale: 1.01 },
      faults: { noiseSigma: 3, jpegQuality: 80 },
      story: { jump: { hpa: 4, rampMinutes: 15 }, timeMarkBeforeJumpMinutes: -30 },
    },
  },
].map((c) => ({
  ...c,
  rmseBarHpa: 0.15,
  jumpTimeBarMinutes: c.options.form === GENERATED_DAILY_FORM ? DAILY_JUMP_BAR_MINUTES : WEEKLY_JUMP_BAR_MINUTES,
}));

// Ink in the grid's own hue family, faded 30–70 % along the line (stains on some).
const fade = { fadedInk: 0.7, fadedInkMin: 0.3 };
const BLUE_GRID = { grid: '#8fb3df', label: '#5f86bf' };
const GREEN_GRID = { grid: '#8cc79a', label: '#4f9a62' };
const ORANGE_GRID = { grid: '#e8a15c', label: '#c9742e' };
const COLOUR_CASES: BenchCase[] = [
  {
    name: 'blue ink on blue grid, faded, stains, daily 400 dpi',
    options: { seed: 41, dpi: 400, form: GENERATED_DAILY_FORM, palette: BLUE_GRID, inkColour: '#4a3fb0', faults: { ...fade, stains: 3, noiseSigma: 3 } },
  },
  {
    name: 'blue ink on blue grid, faded, weekly, seed click only',
    options: { seed: 42, dpi: 300, palette: BLUE_GRID, inkColour: '#2f4f9f', inkHint: 'seed', faults: { ...fade, noiseSigma: 3 } },
  },
  {
    name: 'green ink on green grid, faded, weekly JPEG q75',
    options: { seed: 43, dpi: 300, palette: GREEN_GRID, inkColour: '#1f6b3a', faults: { ...fade, noiseSigma: 3, jpegQuality: 75 } },
  },
  {
    name: 'red ink on orange grid, faded, crooked, daily',
    options: { seed: 44, dpi: 300, form: GENERATED_DAILY_FORM, placement, palette: ORANGE_GRID, inkColour: '#b8312b', faults: { ...fade, blurSigmaPx: 0.6, noiseSigma: 4 } },
  },
  {
    name: 'red ink on orange grid, faded, pen gaps, weekly, no ink hint',
    options: { seed: 45, dpi: 300, palette: ORANGE_GRID, inkColour: '#c0392b', inkHint: 'none', faults: { ...fade, penGaps: 2, noiseSigma: 3 } },
  },
].map((c) => ({ ...c, rmseBarHpa: 0.15 }) as BenchCase);

const CASES: BenchCase[] = [...OLD_CASES, ...JUMP_CASES, ...COLOUR_CASES];
// Pipeline ÷ decode bar (issue 10: the whole pipeline within 1.5 × the decode of the same file).
const RATIO_BAR = 1.5;
const JUMP_WINDOW_MINUTES = 30;
const JUMP_RMS_BAR_HPA = 0.3;
const JUMP_MAX_BAR_HPA = 1.0;
// Old rows may not get worse than the figures recorded before issue 10's changes by more than this.
const REGRESSION_HPA = 0.01;
const BASELINE_PATH = 'scripts/bench-baseline.json';

const HOUR_MS = 3_600_000;
const REPEATS = 5;

function median(values: number[]): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}

function cell(value: number, digits: number): string {
  return Number.isFinite(value) ? value.toFixed(digits) : '–';
}

// --fast: one timed run, no warm-up (accuracy only; the speed columns are then not comparable).
const IS_FAST = process.argv.includes('--fast');

async function runCase(benchCase: BenchCase, directory: string) {
  const chart = await generateChart(benchCase.options);
  const base = join(directory, benchCase.name.replace(/[^a-z0-9]+/gi, '-'));
  const scanPath = await writeGeneratedChart(base, chart);
  const outPath = `${base}.result.json`;
  const child = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/digitize/bench-case.ts', scanPath, `${base}.chart.json`, outPath, String(IS_FAST ? 1 : REPEATS), String(IS_FAST ? 0 : 5)], {
    encoding: 'utf8',
    maxBuffer: 1 << 24,
  });
  if (child.status !== 0) throw new Error(`${benchCase.name}: ${child.stderr}`);
  const timing = JSON.parse(child.stdout.trim().split('\n').pop() as string);
  const result = JSON.parse(await readFile(outPath, 'utf8')) as {
    series: RegularPoint[];
    samples: [number, number][];
    matchedMarks: ClockMark[];
    contrastMode: string;
    spans: { kind: string }[];
  };
  const truth = parseTruthCsv(chart.truthCsv);
  const score = scoreSeries(result.series, truth);
  const samples = result.samples.map(([timeMs, pressureHpa]) => ({ timeMs, pressureHpa }));
  const story = chart.scene.story;
  const jumpMs = chart.chartStartMs + story.jumpHours * HOUR_MS;
  // The jump's time on the line: where it crosses the truth's level at the middle of the rise (or fall).
  const searchMs = (story.jumpRampMinutes / 2 + JUMP_WINDOW_MINUTES) * 60_000;
  const foundJumpMs = crossingTimeMs(samples, story.pressureHpaAt(story.jumpHours), story.jumpHpa >= 0 ? 1 : -1, jumpMs, searchMs);
  const jumpErrorMinutes = foundJumpMs === null ? NaN : Math.abs(foundJumpMs - jumpMs) / 60_000;
  // The line against the exact story, every minute within ±30 min of the jump's foot and top.
  const halfRampMs = (story.jumpRampMinutes / 2) * 60_000;
  const near = windowError(
    samples,
    (timeMs) => story.pressureHpaAt((timeMs - chart.chartStartMs) / HOUR_MS),
    jumpMs - halfRampMs - JUMP_WINDOW_MINUTES * 60_000,
    jumpMs + halfRampMs + JUMP_WINDOW_MINUTES * 60_000,
    60_000,
  );
  // Time marks: where the follower found each foot on the chart against where the drum put it.
  const markErrors = result.matchedMarks
    .filter((m) => m.kind === 'time_mark')
    .map((m) => {
      const trueHours = (m.trueTimeMs - chart.chartStartMs) / HOUR_MS;
      const expectedChartMs = chart.chartStartMs + paperHoursFor(trueHours, benchCase.options.instrument ?? {}) * HOUR_MS;
      return Math.abs(m.chartTimeMs - expectedChartMs) / 60_000;
    });
  const timeErrors = [jumpErrorMinutes, ...markErrors].filter(Number.isFinite);
  return {
    timing,
    score,
    near,
    jumpErrorMinutes,
    medianTimeErrorMinutes: median(timeErrors),
    marks: markErrors.length,
    contrastMode: result.contrastMode,
    jumpSpans: result.spans.filter((s) => s.kind === 'jump').length,
  };
}

interface BaselineRow {
  rmseHpa: number;
  maxErrorHpa: number;
}

async function readBaseline(): Promise<Record<string, BaselineRow>> {
  try {
    return JSON.parse(await readFile(BASELINE_PATH, 'utf8')) as Record<string, BaselineRow>;
  } catch {
    return {};
  }
}

async function main(): Promise<void> {
  const quick = process.argv.includes('--quick');
  const only = process.argv.find((a) => a.startsWith('--only='))?.slice('--only='.length).toLowerCase();
  const directory = join(tmpdir(), `isallo-bench-${process.pid}`);
  await mkdir(directory, { recursive: true });
  // --only=a|b runs the cases whose names hold any of the parts; --only=old runs the rows recorded before issue 10.
  const parts = only?.split('|');
  const matches = (c: BenchCase) => parts === undefined || parts.some((part) => (part === 'old' ? OLD_CASES.includes(c) : c.name.toLowerCase().includes(part)));
  const cases = CASES.filter((c) => !(quick && c.isLarge) && matches(c));
  if (cases.length === 0) throw new Error(`no bench case matches --only=${only}`);
  const baseline = await readBaseline();
  const rows: string[][] = [];
  const failures: string[] = [];
  try {
    for (const benchCase of cases) {
      const r = await runCase(benchCase, directory);
      const megapixels = r.timing.pixels / 1e6;
      const ratio = r.timing.pipelineMs / r.timing.decodeMs;
      const before = baseline[benchCase.name];
      const checks: [boolean, string][] = [
        [r.score.rmseHpa <= benchCase.rmseBarHpa, `RMSE ${cell(r.score.rmseHpa, 3)} > ${benchCase.rmseBarHpa}`],
        [r.score.inkedRecovered >= 0.99, `recovered ${cell(100 * r.score.inkedRecovered, 1)} % < 99 %`],
        [Number.isNaN(r.score.gapsFlagged) || r.score.gapsFlagged >= 0.99, `gaps flagged ${cell(100 * r.score.gapsFlagged, 0)} %`],
        [ratio <= RATIO_BAR || benchCase.isSpeedInfoOnly === true, `pipeline/decode ${cell(ratio, 2)} > ${RATIO_BAR}`],
      ];
      if (before) {
        checks.push([
          !(r.score.rmseHpa > before.rmseHpa + REGRESSION_HPA),
          `RMSE ${cell(r.score.rmseHpa, 3)} worse than before (${before.rmseHpa}) by more than ${REGRESSION_HPA}`,
        ]);
      }
      if (benchCase.jumpTimeBarMinutes !== undefined) {
        checks.push(
          [r.jumpErrorMinutes <= benchCase.jumpTimeBarMinutes, `jump time error ${cell(r.jumpErrorMinutes, 1)} min > ${benchCase.jumpTimeBarMinutes}`],
          [r.near.rmsHpa <= JUMP_RMS_BAR_HPA, `±30 min RMS ${cell(r.near.rmsHpa, 2)} > ${JUMP_RMS_BAR_HPA}`],
          [r.near.maxErrorHpa <= JUMP_MAX_BAR_HPA, `±30 min max ${cell(r.near.maxErrorHpa, 2)} > ${JUMP_MAX_BAR_HPA}`],
        );
      }
      if (benchCase.isClean) checks.push([r.medianTimeErrorMinutes <= 5, `median time error ${cell(r.medianTimeErrorMinutes, 1)} min > 5`]);
      if (benchCase.isLarge) checks.push([r.timing.peakRssMb <= 500, `peak RSS ${cell(r.timing.peakRssMb, 0)} MB > 500`]);
      const failed = checks.filter(([ok]) => !ok).map(([, why]) => why);
      failures.push(...failed.map((why) => `${benchCase.name}: ${why}`));
      rows.push([
        benchCase.name,
        cell(megapixels, 1),
        cell(r.score.rmseHpa, 3),
        before ? `${r.score.rmseHpa - before.rmseHpa >= 0 ? '+' : ''}${cell(r.score.rmseHpa - before.rmseHpa, 3)}` : '',
        cell(r.score.maxErrorHpa, 2),
        `${cell(r.near.rmsHpa, 2)} / ${cell(r.near.maxErrorHpa, 2)}`,
        cell(r.jumpErrorMinutes, 1),
        `${cell(r.medianTimeErrorMinutes, 1)} (${r.marks + 1})`,
        cell(100 * r.score.inkedRecovered, 1),
        cell(100 * r.score.gapsFlagged, 0),
        r.contrastMode,
        cell(r.timing.decodeMs, 0),
        cell(r.timing.pipelineMs, 0),
        cell(ratio, 2),
        cell(r.timing.peakRssMb, 0),
        failed.length === 0 ? 'pass' : 'FAIL',
      ]);
      process.stderr.write(`${benchCase.name}: done\n`);
    }
  } finally {
    await rm(directory, { recursive: true, force: true });
  }
  const header = [
    'case',
    'MP',
    'RMSE hPa',
    'Δ before',
    'max hPa',
    '±30 min RMS / max hPa',
    'jump Δt min',
    'median Δt min (n)',
    'inked %',
    'gaps flagged %',
    'ink model',
    'decode ms',
    'pipeline ms',
    'ratio',
    'peak RSS MB',
    'bars',
  ];
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (r: string[]) => `| ${r.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
  const out = [line(header), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...rows.map(line)];
  process.stdout.write(`${out.join('\n')}\n`);
  process.stdout.write(
    `machine: ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, ${(totalmem() / 2 ** 30).toFixed(0)} GB, Node ${process.version}; ` +
      `decode and pipeline are medians of ${REPEATS} runs after six untimed ones (V8 warm); ratio = pipeline (read + decode + registration + ink + corrections + resample + CSV) ÷ sharp decode-to-raw of the same file; ` +
      `Δ before = RMSE minus ${BASELINE_PATH}; ±30 min = every minute from 30 min before the jump's foot to 30 min after its top, against the exact invented pressure; ` +
      `jump Δt = when the line crosses the middle of the jump\n`,
  );
  if (failures.length > 0) {
    process.stdout.write(`bars missed:\n  ${failures.join('\n  ')}\n`);
    process.exitCode = 1;
  } else process.stdout.write('all bars met\n');
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exit(1);
});

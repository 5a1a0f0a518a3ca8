/**
 * One bench case in its own process, so that its peak memory is its own:
 *   tsx scripts/digitize/bench-case.ts <scan> <chart.json> <series-out.json> <repeats> [<warm-up runs>]
 * Prints one JSON line: the first (cold) pipeline time, medians of decode and of warm pipeline runs, and the
 * peak RSS after the first run.
 */
import { readFile, writeFile } from 'node:fs/promises';
import sharp from 'sharp';
import { parseChartFile } from './chart-file';
import { digitizeChart, type DigitizeResult } from './digitize-chart';
import { loadScan } from './load-scan';
import { formatSeriesCsv } from './series-csv';

const WARM_UP_RUNS = 5;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}

async function main(): Promise<void> {
  const [scanPath, chartPath, outPath, repeatsText, warmUpText] = process.argv.slice(2);
  const repeats = Math.max(1, Number(repeatsText ?? '3'));
  const warmUpRuns = warmUpText === undefined ? WARM_UP_RUNS : Math.max(0, Number(warmUpText));
  const parsed = parseChartFile(JSON.parse(await readFile(chartPath, 'utf8')));
  if (!parsed.ok) throw new Error(parsed.problems.join('; '));
  const chart = parsed.value;

  const runPipeline = async (): Promise<{ ms: number; result: DigitizeResult; csv: string; pixels: number }> => {
    const started = performance.now();
    const scan = await loadScan(scanPath);
    const result = digitizeChart(scan.image, chart);
    const csv = formatSeriesCsv(result.series);
    return { ms: performance.now() - started, result, csv, pixels: scan.image.width * scan.image.height };
  };
  const first = await runPipeline();
  const peakRssMb = process.resourceUsage().maxRSS / 1024;
  // Untimed runs first: the first few mostly measure V8 compiling the hot loops, which a server does once.
  for (let i = 0; i < warmUpRuns; i++) await runPipeline();
  const pipelineMs: number[] = [];
  const decodeMs: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const started = performance.now();
    const file = await readFile(scanPath);
    await sharp(file, { limitInputPixels: false }).raw().toBuffer();
    decodeMs.push(performance.now() - started);
    pipelineMs.push((await runPipeline()).ms);
  }
  const { result } = first;
  await writeFile(
    outPath,
    JSON.stringify({
      series: result.series,
      samples: result.samples.map((s) => [s.timeMs, s.pressureHpa]),
      matchedMarks: result.matchedMarks,
      spans: result.trace.spans,
      contrastMode: result.trace.contrastMode,
      clockMethod: result.clock?.method ?? 'none',
      instrumentMethod: result.instrument?.method ?? 'none',
    }),
  );
  process.stdout.write(
    JSON.stringify({
      pixels: first.pixels,
      firstPipelineMs: first.ms,
      pipelineMs: median(pipelineMs),
      decodeMs: median(decodeMs),
      peakRssMb,
      csvBytes: first.csv.length,
    }) + '\n',
  );
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exit(1);
});

/**
 * npm run digitize -- <scan.png|jpg|tif|pdf> --chart <chart.json> --out <series.csv> [--step <minutes>]
 * Registers the scan with the chart file's pins, follows the ink, applies the clock and instrument corrections
 * from time marks and check readings, and writes a regular series: time,pressure_hpa,flag,uncertainty_hpa.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { parseChartFile } from './digitize/chart-file';
import { digitizeChart } from './digitize/digitize-chart';
import { loadScan } from './digitize/load-scan';
import { formatSeriesCsv } from './digitize/series-csv';

function readArgs(argv: string[]): { scan?: string; chart?: string; out?: string; step?: string } {
  const args: { scan?: string; chart?: string; out?: string; step?: string } = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--chart') args.chart = argv[++i];
    else if (a === '--out') args.out = argv[++i];
    else if (a === '--step') args.step = argv[++i];
    else if (!a.startsWith('--') && args.scan === undefined) args.scan = a;
    else throw new Error(`unexpected argument ${a}`);
  }
  return args;
}

async function main(): Promise<void> {
  const args = readArgs(process.argv.slice(2));
  if (!args.scan || !args.chart || !args.out) {
    throw new Error('usage: npm run digitize -- <scan> --chart <chart.json> --out <series.csv> [--step <minutes>]');
  }
  const parsed = parseChartFile(JSON.parse(await readFile(args.chart, 'utf8')));
  if (!parsed.ok) throw new Error(`${args.chart} is not a usable chart file:\n  ${parsed.problems.join('\n  ')}`);
  const stepMinutes = args.step === undefined ? 60 : Number(args.step);
  if (!(stepMinutes > 0)) throw new Error('--step must be a positive number of minutes');
  const started = performance.now();
  const scan = await loadScan(args.scan);
  const result = digitizeChart(scan.image, parsed.value, { stepMinutes });
  // A series without a line is not a result: say why and write nothing.
  if (result.trace.problem !== null) throw new Error(`${args.scan}: ${result.trace.problem} No series written.`);
  await writeFile(args.out, formatSeriesCsv(result.series));
  const flags = new Map<string, number>();
  for (const p of result.series) flags.set(p.flag, (flags.get(p.flag) ?? 0) + 1);
  const summary = [...flags].map(([flag, n]) => `${n} ${flag}`).join(', ');
  process.stdout.write(
    `${args.out}: ${result.series.length} points (${summary}); registration ${result.registration.model}, ` +
      `rms ${result.registration.rmsHpa.toFixed(2)} hPa / ${result.registration.rmsMinutes.toFixed(1)} min; ` +
      `ink ${result.trace.contrastMode} (${result.trace.contrastReason}), ${Math.round(100 * result.trace.coverage)} % of the span, line ${result.trace.lineWidthPx.toFixed(1)} px, ${result.trace.timeMarks.length} time marks found; ` +
      `clock ${result.clock?.method ?? 'none'}, instrument ${result.instrument?.method ?? 'none'}; ` +
      `image from ${scan.source}; ${(performance.now() - started).toFixed(0)} ms\n`,
  );
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});

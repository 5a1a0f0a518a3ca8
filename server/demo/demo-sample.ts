import fs from 'node:fs/promises';
import path from 'node:path';
import type { PinInput } from '@shared/api/ink-lines';
import { type ChartForm, checkChartForm } from '@shared/domain/chart-form';

/** The generated weekly sample in fixtures/samples: image, its chart description and the true series. */
export interface DemoSample {
  imagePath: string;
  form: ChartForm;
  chartStart: string;
  pins: PinInput[];
  /** Inked stretches of the true series: UTC epoch ms and hPa. */
  truth: { timeMs: number; pressureHpa: number }[];
}

async function readIfExists(filePath: string): Promise<string | null> {
  try {
    return await fs.readFile(filePath, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

/** Reads `time,pressure_hpa,inked` rows, keeping the inked ones. */
function parseTruthCsv(csv: string): DemoSample['truth'] {
  const [header, ...lines] = csv.trim().split(/\r?\n/);
  const columns = header.split(',');
  const timeIndex = columns.indexOf('time');
  const pressureIndex = columns.indexOf('pressure_hpa');
  const inkedIndex = columns.indexOf('inked');
  return lines
    .map((line) => line.split(','))
    .filter((cells) => inkedIndex < 0 || cells[inkedIndex] === '1')
    .map((cells) => ({ timeMs: Date.parse(cells[timeIndex]), pressureHpa: Number(cells[pressureIndex]) }))
    .filter((row) => Number.isFinite(row.timeMs) && Number.isFinite(row.pressureHpa));
}

/**
 * The sample `samples/<name>.{png,chart.json,truth.csv}` under fixturesDir, or null when the image is missing.
 * A missing or unusable chart.json gives null as well, since without its form and pins nothing fits.
 */
export async function readDemoSample(fixturesDir: string, name = 'demo-weekly'): Promise<DemoSample | null> {
  const base = path.join(fixturesDir, 'samples', name);
  const imagePath = `${base}.png`;
  const chartJson = await readIfExists(`${base}.chart.json`);
  if (chartJson === null || (await readIfExists(imagePath)) === null) return null;
  const chart = JSON.parse(chartJson) as { form?: ChartForm; chartStart?: string; pins?: PinInput[] };
  if (!chart.form || Object.keys(checkChartForm(chart.form)).length > 0 || typeof chart.chartStart !== 'string') return null;
  const truthCsv = await readIfExists(`${base}.truth.csv`);
  return {
    imagePath,
    form: chart.form,
    chartStart: chart.chartStart,
    pins: chart.pins ?? [],
    truth: truthCsv ? parseTruthCsv(truthCsv) : [],
  };
}

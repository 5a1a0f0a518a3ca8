import { execFile } from 'node:child_process';
import path from 'node:path';
import type { PdfInfo } from './pdf-tool';

export type { PdfInfo, PdfPageInfo } from './pdf-tool';

const TOOL = path.join(__dirname, 'pdf-tool.ts');
/** A page of a scanned chart renders in seconds; a minute means a hostile or broken file. */
const TIMEOUT_MS = 120_000;
/** The child's heap: enough for a 300 dpi A2 page, small enough that a bomb dies there and not here. */
const HEAP_MB = 1536;

function runTool(args: string[]): Promise<string> {
  return new Promise((resolve, reject) => {
    execFile(
      process.execPath,
      [`--max-old-space-size=${HEAP_MB}`, '--import', 'tsx', TOOL, ...args],
      { timeout: TIMEOUT_MS, maxBuffer: 16 * 1024 * 1024, cwd: path.resolve(__dirname, '..', '..') },
      (error, stdout, stderr) => (error ? reject(new Error(`pdf-tool ${args[0]} failed: ${stderr || error.message}`)) : resolve(stdout)),
    );
  });
}

/** Pages of a PDF (pixel size and dpi of each page's raster), or why it cannot be a master. */
export async function readPdfInfo(filePath: string): Promise<PdfInfo> {
  return JSON.parse(await runTool(['info', filePath])) as PdfInfo;
}

/** Writes page `pageIndex` (from 0) of a PDF as a PNG raster. */
export async function renderPdfPage(filePath: string, pageIndex: number, outPath: string): Promise<void> {
  await runTool(['render', filePath, String(pageIndex), outPath]);
}

import { execFile } from 'node:child_process';
import { resolve } from 'node:path';
import { promisify } from 'node:util';

const ROOT = resolve(__dirname, '../..');

// pdfjs-dist is ESM only and jest runs CommonJS, so the text is read in a child node process.
const READ_PDF = `
const { readFileSync } = await import('node:fs');
const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
const data = new Uint8Array(readFileSync(process.argv[1]));
const document = await pdfjs.getDocument({ data, isEvalSupported: false, useSystemFonts: false }).promise;
const pages = [];
for (let n = 1; n <= document.numPages; n++) {
  const content = await (await document.getPage(n)).getTextContent();
  pages.push(content.items.map((item) => item.str ?? '').join(' ').replace(/\\s+/g, ' '));
}
process.stdout.write(JSON.stringify({ pageCount: document.numPages, pages }));
`;

/** The page count and the text of each page of a PDF file (pdfjs-dist's text layer, whitespace folded). */
export async function readPdfText(filePath: string): Promise<{ pageCount: number; pages: string[] }> {
  const { stdout } = await promisify(execFile)(process.execPath, ['--input-type=module', '-e', READ_PDF, filePath], { cwd: ROOT, maxBuffer: 10_000_000 });
  return JSON.parse(stdout);
}

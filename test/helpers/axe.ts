import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Page } from 'playwright-core';

const ROOT = resolve(__dirname, '../..');
const AXE = readFileSync(join(ROOT, 'node_modules/axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: string;
  help: string;
  targets: string[];
}

/** axe-core's serious and critical violations on the page (WCAG 2 A and AA rules), as "rule: help — targets" lines. */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  // Evaluated through the debugging protocol: the app's Content-Security-Policy refuses inline scripts.
  await page.evaluate(AXE);
  const violations = await page.evaluate(async (): Promise<AxeViolation[]> => {
    type AxeResult = { violations: { id: string; impact: string; help: string; nodes: { target: string[] }[] }[] };
    const axe = (window as unknown as { axe: { run: (context: unknown, options: unknown) => Promise<AxeResult> } }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] } });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help} — ${v.targets.join(', ')}`);
}

import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';

/**
 * The rule sets scanned: axe-core's tags for WCAG 2.0, 2.1 and 2.2 at levels A and AA,
 * plus its best-practice rules (axe-core rule descriptions, tag list in its API docs).
 */
export const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'];

/**
 * Runs axe on the page as it stands and returns one line per serious or critical
 * violation ("page: rule-id (impact) at target; target"), printing them as it goes.
 */
export async function seriousViolations(page: Page, label: string): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(AXE_TAGS).analyze();
  const lines = results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${label}: ${v.id} (${v.impact}) — ${v.help}${v.nodes.map((n) => `\n    at ${n.target.join(' ')}  ${n.html.slice(0, 140)}`).join('')}`);
  for (const line of lines) console.error(line);
  return lines;
}

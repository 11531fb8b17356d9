import fs from 'node:fs';
import type { Page } from 'playwright-core';

/**
 * axe-core (Deque's rules engine for WCAG 2.x) run inside the page. The source goes in by
 * page.evaluate, which the page's Content-Security-Policy does not govern, so the app keeps
 * its strict policy under test. Serious and critical WCAG 2 A/AA violations fail a spec.
 */
const AXE_SOURCE = fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

interface AxeNode {
  target: string[];
  html: string;
}
interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: AxeNode[];
}

const RUN_AXE = `window.axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] }, resultTypes: ['violations'] })
  .then((result) => result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target.map(String), html: n.html.slice(0, 160) })) })))`;

/** One line per serious or critical violation: the rule, what it asks, the first few elements. */
export async function accessibilityViolations(page: Page): Promise<string[]> {
  const loaded = await page.evaluate('typeof window.axe');
  if (loaded !== 'object') await page.evaluate(AXE_SOURCE);
  const violations = (await page.evaluate(RUN_AXE)) as AxeViolation[];
  return violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => `${violation.id} (${violation.impact}): ${violation.help} — ${violation.nodes.slice(0, 3).map((node) => `${node.target.join(' ')} ${node.html}`).join(' | ')}`);
}

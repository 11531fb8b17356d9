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

/**
 * Waits (up to 2 s) until no finite CSS transition or animation is running. axe reads
 * colours as they are at that instant: just after a click, a button's ripple still lies
 * over it, and measured then its label fails the contrast rule. One transition may start
 * another (a ripple grows, then fades), hence the loop. Endless animations (a progress
 * bar, a spinner) are left running.
 */
const SETTLE_ANIMATIONS = `(async () => {
  const deadline = Date.now() + 2000;
  const finite = (animation) => Number.isFinite(animation.effect?.getComputedTiming().endTime ?? Infinity);
  for (;;) {
    const running = document.getAnimations().filter(finite);
    if (!running.length || Date.now() > deadline) return;
    await Promise.race([Promise.all(running.map((animation) => animation.finished.catch(() => undefined))), new Promise((resolve) => setTimeout(resolve, 250))]);
    await new Promise((resolve) => requestAnimationFrame(() => resolve()));
  }
})()`;

/** One line per serious or critical violation: the rule, what it asks, the first few elements. */
export async function accessibilityViolations(page: Page): Promise<string[]> {
  await page.evaluate(SETTLE_ANIMATIONS);
  const loaded = await page.evaluate('typeof window.axe');
  if (loaded !== 'object') await page.evaluate(AXE_SOURCE);
  const violations = (await page.evaluate(RUN_AXE)) as AxeViolation[];
  return violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => `${violation.id} (${violation.impact}): ${violation.help} — ${violation.nodes.slice(0, 3).map((node) => `${node.target.join(' ')} ${node.html}`).join(' | ')}`);
}

/** Accessibility checks for the browser tests: axe-core's WCAG 2.1 A and AA rules on the page as it stands. */
import { AxeBuilder } from '@axe-core/playwright';
import type { Result } from 'axe-core';
import { expect, type Page } from '@playwright/test';

/** The rule sets checked: WCAG 2.0 A and AA, and what WCAG 2.1 adds at AA. */
export const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21aa'];

/** The impacts that fail a test; minor and moderate findings are left to people to weigh. */
const FAILING = new Set(['serious', 'critical']);

/** One line per violation and one per element it was found on, to read in the test's failure message. */
export function describeViolations(violations: Result[]): string {
  return violations
    .map((v) => {
      const where = v.nodes.map((n) => `    at ${n.target.join(' ')}${n.failureSummary ? `: ${oneLine(n)}` : ''}`);
      return [`  ${v.id} (${v.impact}, ${v.nodes.length}×): ${v.help}`, ...where].join('\n');
    })
    .join('\n');
}

/** axe's summary of what to fix, on one line (it lists checks on lines of their own). */
function oneLine(node: Result['nodes'][number]): string {
  return (node.failureSummary ?? '').replace(/\s*\n\s*/g, ' ').slice(0, 220);
}

/** Runs axe on the page and fails, naming each finding, if any is serious or critical. */
export async function expectAccessible(page: Page, screen: string): Promise<void> {
  const results = await new AxeBuilder({ page }).withTags(AXE_TAGS).analyze();
  const failing = results.violations.filter((v) => FAILING.has(v.impact ?? ''));
  expect(
    failing.length,
    `serious or critical accessibility findings on ${screen}:\n${describeViolations(failing)}`,
  ).toBe(0);
}

import assert from 'node:assert/strict';
import axe from 'axe-core';
import type { Page } from 'playwright-core';

/** The impacts that fail a check: what stops someone from using the page, not what slows them. */
const FAILING: ReadonlySet<string> = new Set(['serious', 'critical']);

/** One violation of an axe rule, with where it was found, in lines a person can read. */
export interface AccessibilityProblem {
  readonly rule: string;
  readonly impact: string;
  readonly help: string;
  /** CSS selectors of the elements, with axe's summary of what is wrong with the first. */
  readonly nodes: readonly string[];
  readonly summary: string;
}

/**
 * Runs axe-core on the page as it is now and returns its serious and critical violations.
 * axe's script goes in through the browser's debugging protocol (page.evaluate), which the
 * console's content security policy does not stop, unlike a script tag would be.
 */
export async function accessibilityProblems(page: Page): Promise<AccessibilityProblem[]> {
  await page.evaluate(axe.source);
  const violations = await page.evaluate(async () => {
    const { violations } = await window.axe.run(document, { resultTypes: ['violations'] });
    return violations.map((violation) => ({
      rule: violation.id,
      impact: violation.impact ?? 'unknown',
      help: violation.help,
      nodes: violation.nodes.map((node) => node.target.join(' ')),
      summary: violation.nodes[0]?.failureSummary ?? '',
    }));
  });
  return violations.filter((violation) => FAILING.has(violation.impact));
}

/**
 * The problems as a list for a failed assertion: rule, impact, what it asks, where.
 * @param problems What {@link accessibilityProblems} found.
 */
export function describeProblems(problems: readonly AccessibilityProblem[]): string {
  return problems
    .map((problem) => {
      const where = problem.nodes.slice(0, 5).join('\n      ');
      const more = problem.nodes.length > 5 ? `\n      … and ${problem.nodes.length - 5} more` : '';
      const why = problem.summary.replace(/\s+/g, ' ').trim();
      return `  ${problem.rule} (${problem.impact}): ${problem.help}\n    ${why}\n      ${where}${more}`;
    })
    .join('\n');
}

/**
 * Fails when axe finds serious or critical violations on the page, listing each.
 * @param page The page to check, as it is now.
 * @param what The screen's name, for the message.
 */
export async function assertAccessible(page: Page, what: string): Promise<void> {
  const problems = await accessibilityProblems(page);
  assert.equal(
    problems.length,
    0,
    `${what}: ${problems.length} serious or critical accessibility problems\n${describeProblems(problems)}`,
  );
}

declare global {
  interface Window {
    axe: typeof axe;
  }
}

import { expect } from 'vitest';
import type { Page } from 'playwright-core';
import { AxeBuilder } from '@axe-core/playwright';

const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'];

/** axe-core's serious and critical findings on the page as it is now, one line each (empty = clean). */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

/** Fails the test with the findings, naming the page, when axe reports anything serious or critical. */
export async function expectAxeClean(page: Page, name: string): Promise<void> {
  expect(await seriousAxeViolations(page), `axe on ${name}`).toEqual([]);
}

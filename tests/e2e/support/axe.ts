/** Axe on the current page: the serious and critical WCAG 2.1 A/AA violations, in a form that reads well in a failed expect. */
import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';

export async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }));
}

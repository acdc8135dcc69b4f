// axe-core, the general-purpose accessibility checker, run in a page: the serious and critical violations it finds.
// axe is injected into the page, so the page's browser profile must bypass the app's content policy (bypassCSP).
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

export const axeSource = createRequire(import.meta.url).resolve('axe-core/axe.min.js');

export interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

/** The serious and critical violations axe finds on the page as it is now, one line each. */
export async function seriousViolations(page: Page): Promise<string[]> {
  // Contrast is measured on the page at rest: wait for its own signal that no animation (a tab sliding in) runs.
  await page.waitForFunction(() =>
    document.getAnimations().every((animation) => animation.playState !== 'running'),
  );
  await page.addScriptTag({ path: axeSource });
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as { axe: { run(context: Document): Promise<{ violations: Violation[] }> } }
    ).axe;
    return (await axe.run(document)).violations;
  });
  return violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map(
      (violation) =>
        `${violation.id} (${violation.impact}): ${violation.help} at ${violation.nodes.map((n) => n.target.join(' ')).join(', ')}`,
    );
}

import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

const axeScript = createRequire(import.meta.url).resolve('axe-core/axe.min.js');

/**
 * Elements the checker is wrong about, each with the reason. Add one only for
 * a false positive of a rule on that element, never to hide a defect.
 */
const NOT_CHECKED: { selector: string; why: string }[] = [];

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  helpUrl: string;
  nodes: { target: string[]; summary: string }[];
}

/** The page has stopped loading what it shows: no spinner turns, no list is being fetched again and no finite animation is under way. */
async function settled(page: Page): Promise<void> {
  await page.waitForLoadState('load');
  await page.locator('.animate-spin').first().waitFor({ state: 'detached' });
  // a list fetched again is shown faded (aria-busy) until its rows arrive
  await page.locator('[aria-busy="true"]').first().waitFor({ state: 'detached' });
  // A colour caught half-way through a fade would be judged on a mix of two colours.
  await page.evaluate(() =>
    Promise.all(
      document
        .getAnimations()
        .filter((a) => a.effect?.getComputedTiming().iterations !== Infinity)
        .map((a) => a.finished.catch(() => undefined)),
    ),
  );
}

/** Runs axe-core in the page as it is now and returns its violations, every rule that is on by default. */
async function violations(page: Page): Promise<Violation[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ path: axeScript });
  return page.evaluate(
    async (notChecked) => {
      const axe = (window as unknown as { axe: typeof import('axe-core') }).axe;
      const results = await axe.run({ exclude: notChecked.map((s) => [s]) } as never, { resultTypes: ['violations'] });
      return results.violations.map((v) => ({
        id: v.id,
        impact: v.impact ?? null,
        help: v.help,
        helpUrl: v.helpUrl,
        nodes: v.nodes.map((n) => ({ target: n.target.map(String), summary: n.failureSummary ?? '' })),
      }));
    },
    NOT_CHECKED.map((n) => n.selector),
  );
}

/** One line per rule, then each element it found with what axe says is wrong there. */
function describe(where: string, found: Violation[]): string {
  const lines = [`${found.length} accessibility rule(s) broken on ${where}:`];
  for (const v of found) {
    lines.push(`- ${v.id} [${v.impact ?? 'no impact given'}]: ${v.help} (${v.helpUrl})`);
    for (const n of v.nodes)
      lines.push(
        `    at ${n.target.join(' >>> ')}`,
        ...n.summary
          .split('\n')
          .filter(Boolean)
          .map((s) => `      ${s.trim()}`),
      );
  }
  return lines.join('\n');
}

/**
 * Checks the page as it stands once it has settled and throws, naming every
 * violation (rule id, impact, the element's selector, the help text), if
 * axe-core finds any.
 */
export async function expectAccessible(page: Page, what: string): Promise<void> {
  // colours are judged in their final state: a transition caught half-way (a button turning on as a recompute answers) is not what a reader sees
  await page.evaluate(() => {
    if (document.getElementById('a11y-no-motion')) return;
    const style = document.createElement('style');
    style.id = 'a11y-no-motion';
    style.textContent = '*, *::before, *::after { transition: none !important; animation: none !important; }';
    document.head.append(style);
  });
  await settled(page);
  const found = await violations(page);
  if (found.length) throw new Error(describe(`${what} (${new URL(page.url()).pathname})`, found));
}

import type { Locator } from 'playwright-core';
import { expect } from 'vitest';

/*
 * Waiting assertions over playwright-core locators (playwright-core ships no
 * test runner assertions): each polls until it holds or the timeout passes.
 */

export async function shows(locator: Locator, timeout = 20_000): Promise<void> {
  await locator.first().waitFor({ state: 'visible', timeout });
}

export async function hasTexts(locator: Locator, texts: string[], timeout = 20_000): Promise<void> {
  await expect.poll(async () => (await locator.allTextContents()).map((t) => t.trim()), { timeout }).toEqual(texts);
}

export async function containsText(locator: Locator, text: string | RegExp, timeout = 20_000): Promise<void> {
  await expect.poll(async () => (await locator.first().textContent()) ?? '', { timeout }).toMatch(typeof text === 'string' ? new RegExp(text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')) : text);
}

export async function countIs(locator: Locator, n: number, timeout = 20_000): Promise<void> {
  await expect.poll(() => locator.count(), { timeout }).toBe(n);
}

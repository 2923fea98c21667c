import type { Locator, Page } from 'playwright-core';
import { BASE_URL } from './browser';

/** The input element behind a data-testid, whether the test id sits on the input or on an antd wrapper. */
export async function inputOf(page: Page, testId: string): Promise<Locator> {
  const el = page.getByTestId(testId).first();
  await el.waitFor();
  const tag = await el.evaluate((e) => e.tagName);
  return tag === 'INPUT' || tag === 'TEXTAREA' ? el : el.locator('input').first();
}

export async function fill(page: Page, testId: string, value: string): Promise<void> {
  const input = await inputOf(page, testId);
  await input.fill(value);
}

/**
 * Picks an option of an antd Select by typing part of its label. A click that lands while the option list re-renders
 * (its query refetching) can be lost, so the pick is checked on the Select itself and tried again (three times at most).
 */
export async function pick(page: Page, testId: string, text: string): Promise<void> {
  const select = page.getByTestId(testId).first();
  for (let attempt = 1; ; attempt++) {
    const input = await inputOf(page, testId);
    await input.click();
    if ((await input.getAttribute('readonly')) === null) await input.fill(text);
    await page.locator('.ant-select-dropdown:not(.ant-select-dropdown-hidden) .ant-select-item-option').filter({ hasText: text }).first().click();
    const chosen = select.locator('.ant-select-content-value, .ant-select-selection-item').filter({ hasText: text });
    if ((await chosen.count()) > 0 || attempt >= 3) return;
    await page.keyboard.press('Escape');
  }
}

/** Signs in through the API (for setting up data the test needs). */
export async function apiToken(email: string, password = 'amberline-demo'): Promise<string> {
  const res = await fetch(`${BASE_URL}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  if (!res.ok) throw new Error(`sign-in of ${email} failed: ${res.status}`);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

export async function apiPost<T>(token: string, path: string, body: unknown): Promise<T> {
  const res = await fetch(`${BASE_URL}/api${path}`, { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` }, body: JSON.stringify(body) });
  const data = await res.json();
  if (!res.ok) throw new Error(`POST ${path}: ${res.status} ${JSON.stringify(data)}`);
  return data as T;
}

export async function apiSend<T>(token: string, method: 'GET' | 'PATCH', path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${BASE_URL}/api${path}`, {
    method,
    headers: { authorization: `Bearer ${token}`, ...(body !== undefined ? { 'content-type': 'application/json' } : {}) },
    ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
  });
  const data = await res.json();
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${JSON.stringify(data)}`);
  return data as T;
}

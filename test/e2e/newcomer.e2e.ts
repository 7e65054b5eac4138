// A newcomer's first hour: the window never scrolls past the app, visiting every view leaves the
// project unchanged, and a number field keeps what the user typed beside the reason it is refused.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openPage, useBrowser } from './chromium';

const VIEWS = ['plant', 'sharing', 'synchronizing', 'transients', 'trainer', 'commissioning', 'report'] as const;

/** The project's save state in words ("not saved to a file", "unsaved changes", "saved") and whether it is marked dirty. */
async function projectState(page: Page): Promise<{ text: string; dirty: boolean }> {
  const state = page.getByTestId('project-state');
  return { text: ((await state.textContent()) ?? '').trim(), dirty: ((await state.getAttribute('class')) ?? '').includes('is-dirty') };
}

/** Waits until two reads of `read` a quarter second apart agree, and returns that value. */
async function settled<T>(read: () => Promise<T>): Promise<T> {
  let last = JSON.stringify(await read());
  for (let i = 0; i < 40; i++) {
    await new Promise((r) => setTimeout(r, 250));
    const now = JSON.stringify(await read());
    if (now === last) return JSON.parse(now) as T;
    last = now;
  }
  throw new Error('the value never settled');
}

describe('a newcomer at 1440 × 900', () => {
  const browser = useBrowser();

  it('never scrolls the window past the app: top bar and caution stay on screen in every view', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.getByTestId('rated-table').waitFor();
    for (const id of VIEWS) {
      await page.getByTestId(`nav-${id}`).click();
      await expect.poll(() => page.getByTestId(`nav-${id}`).getAttribute('aria-current')).toBe('page');
      await page.waitForTimeout(300);
      const m = await page.evaluate(() => ({
        scroll: document.documentElement.scrollHeight,
        height: window.innerHeight,
        cautionBottom: document.querySelector('[data-test="caution"]')?.getBoundingClientRect().bottom ?? Infinity,
      }));
      expect(m.scroll, `${id}: page height`).toBeLessThanOrEqual(m.height);
      expect(m.cautionBottom, `${id}: caution inside the window`).toBeLessThanOrEqual(m.height);
      // Scrolling the window does nothing: the top bar stays at the top.
      await page.mouse.wheel(0, 2000);
      expect(await page.evaluate(() => window.scrollY), `${id}: window scroll`).toBe(0);
    }
    expect(errors).toEqual([]);
  });

  it('visiting every view never changes the project (demo, and a new project)', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    const before = await settled(() => projectState(page));
    expect(before.dirty).toBe(false);
    for (const id of VIEWS) {
      await page.getByTestId(`nav-${id}`).click();
      await page.waitForTimeout(400);
      expect(await settled(() => projectState(page)), `after opening ${id}`).toEqual(before);
    }
    // A new project: visiting every view leaves it as it started.
    await page.getByTestId('file-new').click();
    await expect.poll(() => page.getByTestId('project-name').textContent()).toContain('Untitled');
    const fresh = await settled(() => projectState(page));
    expect(fresh.dirty).toBe(false);
    for (const id of VIEWS) {
      await page.getByTestId(`nav-${id}`).click();
      await page.waitForTimeout(400);
      expect(await settled(() => projectState(page)), `new project, after opening ${id}`).toEqual(fresh);
    }
    expect(errors).toEqual([]);
  });

  it('a number field keeps the text typed into it and shows the reason, also after leaving the field', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.getByTestId('rated-table').waitFor();
    const field = page.getByTestId('field-sets[0].ratedKW');
    await field.click();
    await field.press('End');
    await field.pressSequentially('x');
    const typed = await field.inputValue();
    expect(typed).toMatch(/x$/);
    const reason = page.locator('#issue-sets-0-ratedKW');
    await expect.poll(() => reason.textContent()).toMatch(/number/);
    await page.getByTestId('field-sets[0].ratedKVA').click();
    expect(await field.inputValue()).toBe(typed);
    expect(await reason.textContent()).toMatch(/number/);
    // The same in the Transients scenario editor.
    await page.getByTestId('nav-transients').click();
    const length = page.getByTestId('scenario-duration');
    await length.click();
    await length.press('End');
    await length.pressSequentially('e');
    const lengthText = await length.inputValue();
    expect(lengthText).toMatch(/e$/);
    await page.getByTestId('scenario-name').click();
    expect(await length.inputValue()).toBe(lengthText);
    await expect.poll(() => page.getByTestId('scenario-editor').textContent()).toMatch(/number/);
    expect(errors).toEqual([]);
  });

  it('switches the theme (system, light, dark) and keeps the choice after a reload', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    await page.emulateMedia({ colorScheme: 'light' });
    await page.getByTestId('rated-table').waitFor();
    const theme = () => page.evaluate(() => ({ mode: document.documentElement.dataset.theme, bg: getComputedStyle(document.body).backgroundColor }));
    expect((await theme()).mode).toBe('light');
    const lightBg = (await theme()).bg;
    await page.getByTestId('theme-choice').selectOption('dark');
    expect((await theme()).mode).toBe('dark');
    expect((await theme()).bg).not.toBe(lightBg);
    await page.reload();
    await page.getByTestId('rated-table').waitFor();
    expect((await theme()).mode).toBe('dark');
    expect(await page.getByTestId('theme-choice').inputValue()).toBe('dark');
    // System follows the system's setting.
    await page.getByTestId('theme-choice').selectOption('system');
    expect((await theme()).mode).toBe('light');
    await page.emulateMedia({ colorScheme: 'dark' });
    await expect.poll(async () => (await theme()).mode).toBe('dark');
    expect(errors).toEqual([]);
  });
});

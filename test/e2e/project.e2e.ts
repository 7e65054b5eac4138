/**
 * Project files in the browser preview (Chromium): a project dropped on the window opens,
 * an edit marks the title, the autosaved copy survives a reload and is restored, and Save
 * As downloads a file that opens again with the same content.
 */
import { describe, expect, inject, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { parseProject } from '../../electron/project';
import { ARTIFACTS, openPage, useBrowser } from './chromium';
import { projectText } from '../helpers/projects';

/** Drops a file on the window as a user would drag one from the file manager. */
async function dropFile(page: Page, fileName: string, text: string): Promise<void> {
  await page.evaluate(
    ({ fileName, text }) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], fileName, { type: 'application/json' }));
      for (const type of ['dragenter', 'dragover', 'drop']) {
        window.dispatchEvent(new DragEvent(type, { dataTransfer: dt, bubbles: true, cancelable: true }));
      }
    },
    { fileName, text },
  );
}

describe('project files in the browser preview', () => {
  const browser = useBrowser();

  it('opens a dropped project, marks unsaved changes, restores them after a reload and downloads Save As', async () => {
    const { page, errors } = await openPage(browser(), inject('previewUrl'));
    // Save As downloads here (no save picker), as in browsers without the File System Access API.
    await page.addInitScript(() => {
      delete (window as unknown as Record<string, unknown>).showSaveFilePicker;
    });
    await page.reload();
    await page.getByTestId('file-bar').waitFor();
    await expect.poll(() => page.getByTestId('project-state').textContent()).toContain('not saved to a file');
    await expect.poll(() => page.getByTestId('project-name').textContent()).toBe('Kestrel Ford Water Treatment Works (demo)');

    await dropFile(page, 'kestrel.droopline.json', projectText({ name: 'Kestrel Ford study' }));
    await expect.poll(() => page.getByTestId('project-name').textContent()).toBe('Kestrel Ford study');
    expect(await page.getByTestId('project-notice').textContent()).toContain('Opened "kestrel.droopline.json"');
    expect(await page.title()).toBe('kestrel.droopline.json — Droopline');

    // An edit: rename the project.
    await page.getByTestId('project-name').click();
    await page.getByTestId('project-name-input').fill('Kestrel Ford study, stage 2');
    await page.getByTestId('project-name-input').press('Enter');
    await expect.poll(() => page.title()).toBe('● kestrel.droopline.json — Droopline');
    expect(await page.getByTestId('project-state').textContent()).toContain('unsaved changes');
    await page.screenshot({ path: join(ARTIFACTS, 'project-unsaved.png') });

    // The recovery copy is written a moment after the edit; a reload stands in for a crash.
    await expect.poll(() => page.evaluate(() => localStorage.getItem('droopline.recovery') !== null), { timeout: 10_000 }).toBe(true);
    page.on('dialog', (d) => void d.accept());
    await page.reload();
    await page.getByTestId('restore-prompt').waitFor();
    await page.screenshot({ path: join(ARTIFACTS, 'project-restore.png') });
    await page.getByTestId('restore-accept').click();
    await expect.poll(() => page.getByTestId('project-name').textContent()).toBe('Kestrel Ford study, stage 2');
    expect(await page.title()).toBe('● kestrel.droopline.json — Droopline');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('file-save-as').click()]);
    expect(download.suggestedFilename()).toBe('Kestrel Ford study, stage 2.droopline.json');
    const saved = readFileSync((await download.path())!, 'utf8');
    const reopened = parseProject(saved).project;
    expect(reopened.name).toBe('Kestrel Ford study, stage 2');
    expect(reopened.scenarios).toEqual(parseProject(projectText()).project.scenarios);
    await expect.poll(() => page.getByTestId('project-state').textContent()).toContain('saved');
    expect(await page.evaluate(() => localStorage.getItem('droopline.recovery'))).toBeNull();
    expect(errors).toEqual([]);
  });
});

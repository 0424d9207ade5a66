// Visit log in a real browser, offline: create a visit and readings with the server stopped, survive a reload
// (including a half-typed reading) and a cold restart; export, erase, restore and get the same data back;
// notes holding HTML or script show as plain text; a damaged backup changes nothing.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { appForFile, freshProfileDir, openBrowser, removeDir, screenshot, waitForServiceWorkerControl } from './harness';

const app = appForFile(4331);
const { origin } = app;
const hostileNotes = 'Checked <script>window.__rodsidePwned = 1</script> and <b>bold</b> & <img src=x onerror="window.__rodsidePwned=2">';
const scratch = freshProfileDir();
let visitPath = '';

afterAll(() => {
  removeDir(scratch);
});

async function rows(page: Page, phase: 'as-found' | 'as-left'): Promise<string[]> {
  return page.locator(`[data-testid="readings-${phase}"] [data-testid="reading-row"]`).allTextContents();
}

async function download(page: Page, click: () => Promise<void>, name: string): Promise<string> {
  const [dl] = await Promise.all([page.waitForEvent('download'), click()]);
  const path = join(scratch, name);
  await dl.saveAs(path);
  return readFileSync(path, 'utf8');
}

describe('visit log offline', () => {
  it('creates a visit and readings with the network cut and the server stopped', async () => {
    const session = (app.session = await openBrowser(app.profile));
    const { page } = session;
    await page.goto(origin + '/visits');
    await waitForServiceWorkerControl(page);
    await expect.poll(() => page.locator('[data-testid="visit-item"]').count()).toBeGreaterThan(0);
    await session.context.setOffline(true);
    await app.stopServer();

    await page.goto(origin + '/visits/new');
    await page.locator('#visit-engineer').fill('Browser-test engineer');
    await page.locator('#visit-site').fill('Shielded room 3');
    // Reload mid-entry: the visit form comes back as typed.
    await page.waitForTimeout(300);
    await page.reload();
    await expect.poll(() => page.locator('#visit-site').inputValue()).toBe('Shielded room 3');
    expect(await page.locator('#visit-engineer').inputValue()).toBe('Browser-test engineer');
    await expect.poll(() => page.getByText('Restored the input you had not saved yet.').count()).toBe(1);
    await page.locator('#visit-notes').fill(hostileNotes);
    await page.getByRole('button', { name: 'Create visit' }).click();
    await expect.poll(() => new URL(page.url()).pathname).toMatch(/^\/visits\/visit-/);
    visitPath = new URL(page.url()).pathname;

    await page.locator('#reading-type').selectOption('multiplier-voltage');
    await page.locator('#reading-value').fill('1900');
    await expect.poll(() => page.locator('[data-testid="reading-preview"]').textContent()).toMatch(/Expected: 1750 V.*baseline.*✓ pass/);
    await page.getByRole('button', { name: 'Save reading' }).click();
    await expect.poll(() => rows(page, 'as-found')).toEqual([expect.stringMatching(/Multiplier voltage \(as set for the wanted gain\).*1900 V.*✓ pass.*1750 V \(baseline\)/)]);

    // A bad value gets a message naming the field and the range, and is not saved.
    await page.locator('#reading-type').selectOption('vacuum-fore');
    await page.locator('#reading-unit').selectOption('Torr');
    await page.locator('#reading-value').fill('abc');
    await page.getByRole('button', { name: 'Save reading' }).click();
    await expect.poll(() => page.locator('.field-error').first().textContent()).toMatch(/Fore-vacuum must be a number between 7\.501e-9 and 900\.1 Torr, written like 2\.5 or 2\.5e-5; “abc” is not a number/);
    await page.locator('#reading-value').fill('0.0018');
    await page.locator('input[name="reading-phase"][value="as-left"]').check();
    await page.getByRole('button', { name: 'Save reading' }).click();
    await expect.poll(() => rows(page, 'as-left')).toEqual([expect.stringMatching(/Fore-vacuum.*0\.0018 Torr.*(pass|borderline|fail)/)]);

    // Half-typed reading, not saved.
    await page.locator('#reading-type').selectOption('emission-current');
    await page.locator('#reading-value').fill('33.7');
    await page.waitForTimeout(300);
    await screenshot(page, 'visit-offline');
    const text = await page.locator('main').textContent();
    expect(text).not.toMatch(/NaN|undefined/);
  });

  it('keeps everything, including the half-typed reading, across a reload', async () => {
    const { page } = app.session!;
    await page.reload();
    await expect.poll(() => rows(page, 'as-found')).toHaveLength(1);
    expect(await rows(page, 'as-left')).toHaveLength(1);
    await expect.poll(() => page.locator('#reading-value').inputValue()).toBe('33.7');
    expect(await page.locator('#reading-type').inputValue()).toBe('emission-current');
  });

  it('shows notes with HTML and script as plain text', async () => {
    const { page } = app.session!;
    expect(await page.locator('[data-testid="visit-notes"]').textContent()).toBe(hostileNotes);
    expect(await page.locator('[data-testid="visit-notes"] script, [data-testid="visit-notes"] b, [data-testid="visit-notes"] img').count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { __rodsidePwned?: number }).__rodsidePwned)).toBeUndefined();
    await page.goto(origin + visitPath + '/report');
    await expect.poll(() => page.locator('[data-testid="visit-report"] .notes').first().textContent()).toBe(hostileNotes);
    expect(await page.locator('[data-testid="visit-report"] script').count()).toBe(0);
  });

  it('renders the visit after a cold restart on the same profile, still offline', async () => {
    await app.session!.close();
    const session = (app.session = await openBrowser(app.profile));
    await session.context.setOffline(true);
    const { page } = session;
    await page.goto(origin + visitPath);
    await expect.poll(() => rows(page, 'as-found')).toEqual([expect.stringMatching(/1900 V.*✓ pass/)]);
    await page.goto(origin + '/visits');
    // The trends are one tap away, and drawn when opened.
    await page.locator('[data-testid="trend-fold"] summary').click();
    await expect.poll(() => page.locator('[data-testid="trend-panel"]').count()).toBe(1);
  });

  it('export → erase → restore gives the same data back; a damaged file changes nothing', async () => {
    const { page } = app.session!;
    await page.goto(origin + '/visits');
    await openBackup(page);
    const first = await download(page, () => page.getByRole('button', { name: 'Download backup' }).click(), 'first.json');
    const firstDoc = JSON.parse(first);
    expect(firstDoc.format).toBe('rodside-backup');
    expect(firstDoc.data.visits.some((v: { notes: string }) => v.notes === hostileNotes)).toBe(true);

    await page.locator('summary', { hasText: 'Erase this device' }).click();
    await page.getByRole('button', { name: 'Erase everything on this device' }).click();
    await page.getByRole('button', { name: 'Yes, erase everything' }).click();
    await expect.poll(() => page.locator('[data-testid="visit-item"]').count()).toBe(0);

    // A truncated copy is refused and nothing changes.
    const broken = join(scratch, 'broken.json');
    writeFileSync(broken, first.slice(0, Math.floor(first.length / 2)));
    await page.locator('#backup-file').setInputFiles(broken);
    await expect.poll(() => page.locator('[data-testid="backup-problem"]').textContent()).toMatch(/nothing on this device was changed.*not valid JSON/);
    // The refusal says its sentence once.
    expect(((await page.locator('[data-testid="backup-problem"]').textContent()) ?? '').match(/was not restored/g)).toHaveLength(1);

    await page.locator('#backup-file').setInputFiles(join(scratch, 'first.json'));
    // Erasing keeps one record (the demo is marked as seen so it does not come back): it is the one unchanged.
    const total = Object.values(firstDoc.data as Record<string, unknown[]>).reduce((n, l) => n + l.length, 0);
    await expect.poll(() => page.locator('[data-testid="restore-result"]').textContent()).toContain(`${total - 1} added, 0 updated, 1 unchanged`);

    await page.goto(origin + visitPath);
    await expect.poll(() => rows(page, 'as-found')).toEqual([expect.stringMatching(/1900 V.*✓ pass/)]);
    await page.goto(origin + '/visits');
    await openBackup(page);
    const second = await download(page, () => page.getByRole('button', { name: 'Download backup' }).click(), 'second.json');
    expect(JSON.parse(second).data).toEqual(firstDoc.data);
    await screenshot(page, 'visits-restored');
  });

  it('no page errors and no requests off the device', () => {
    expect(app.session!.pageErrors).toEqual([]);
    expect(app.session!.foreignRequests).toEqual([]);
  });
});

/** Backup and export sit behind a disclosure on the visit list: open it (once) before using them. */
async function openBackup(page: Page): Promise<void> {
  const fold = page.locator('[data-testid="backup-fold"]');
  if (!(await fold.evaluate((d) => (d as HTMLDetailsElement).open))) await fold.locator('> summary').click();
}

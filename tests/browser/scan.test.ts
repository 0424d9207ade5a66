// Scan area in a real browser, offline: after the first visit the service worker serves everything; with the
// server stopped, paste the demo scan, find its peaks, fit one in the worker until the verdict, note a fitted value
// into the instrument's visit and find it in the visit log.
import { describe, expect, it } from 'vitest';
import { DEMO_SCAN_TEXT } from '../../src/spectrum';
import { appForFile, firstVisit, offlineOnKestrel, openBrowser, screenshot } from './harness';

const app = appForFile(4371);
const { origin } = app;

describe('Scan area offline', () => {
  it('pastes the demo scan, finds the peaks, fits one to a verdict and notes the result into a visit', async () => {
    const session = (app.session = await openBrowser(app.profile, { viewport: { width: 390, height: 844 } }));
    const { page } = session;
    await firstVisit(page, origin);
    // Offline from here: network cut and the server stopped.
    await offlineOnKestrel(app);

    await page.goto(origin + '/scan');
    await expect.poll(() => page.locator('h1').textContent()).toBe('Scan · measured peaks');
    await page.locator('#scan-text').fill(DEMO_SCAN_TEXT);
    await page.locator('#scan-formula').fill('C4F9');
    await expect.poll(() => page.locator('[data-testid="peak-choose"]').count(), { timeout: 30_000 }).toBeGreaterThan(0);
    const centroids = (await page.locator('[data-testid="peak-choose"]').allTextContents()).map(Number);
    // C4F9⁺ at 218.98508 (¹⁹F 18.998403163 u, AME2016; electron mass CODATA 2018).
    const main = centroids.findIndex((c) => Math.abs(c - 218.98508) < 0.05);
    expect(main).toBeGreaterThanOrEqual(0);
    await expect.poll(() => page.locator('[data-testid="ratio-table"]').textContent()).toMatch(/expected 4\.3 %/);
    await page.locator('[data-testid="peak-choose"]').nth(main).click();
    await page.locator('[data-testid="fit-run"]').click();
    await expect.poll(() => page.locator('[data-testid="fit-verdict"]').textContent(), { timeout: 120_000 })
      .toMatch(/^(Explained by the operating point|Not explained by the operating point): \S/);
    expect(await page.locator('main').textContent()).not.toMatch(/NaN/);
    await screenshot(page, 'scan-verdict');

    await page.locator('[data-testid="fit-offset"] button').click();
    await expect.poll(() => page.locator('.toast').textContent()).toMatch(/^Noted in the visit of \d{4}-\d{2}-\d{2}\./);

    await page.goto(origin + '/visits');
    await page.locator('main a[href^="/visits/visit-"]').first().click();
    await expect.poll(() => page.locator('main').textContent(), { timeout: 30_000 }).toMatch(/Fitted m\/z offset of the measured peak/);
  });
});

// Scan area in a real browser, offline: after the first visit the service worker serves everything; with the
// server stopped, paste the demo scan, find its peaks, fit one in the worker until the verdict, note a fitted value
// into the instrument's visit and find it in the visit log.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PreviewServer } from 'vite';
import { DEMO_SCAN_TEXT } from '../../src/spectrum';
import { distDir, freshProfileDir, openBrowser, removeDir, screenshot, startPreview, stopPreview, waitForServiceWorkerControl, type Session, testPort } from './harness';

const PORT = testPort(4371);
const origin = `http://127.0.0.1:${PORT}`;
let server: PreviewServer | null = null;
const profile = freshProfileDir();
let session: Session | null = null;

beforeAll(async () => {
  server = await startPreview(distDir, PORT);
});
afterAll(async () => {
  await session?.close().catch(() => undefined);
  await stopPreview(server).catch(() => undefined);
  removeDir(profile);
});

describe('Scan area offline', () => {
  it('pastes the demo scan, finds the peaks, fits one to a verdict and notes the result into a visit', async () => {
    session = await openBrowser(profile, { viewport: { width: 390, height: 844 } });
    const { page } = session;
    await page.goto(origin + '/');
    await waitForServiceWorkerControl(page);
    await page.waitForFunction(() => /\(demo\)/.test(document.querySelector('[data-testid="current-instrument"]')?.textContent ?? ''), undefined, { timeout: 30_000 });
    await page.locator('.picker select').selectOption('demo-gcms-kestrel');

    // Offline from here: network cut and the server stopped.
    await session.context.setOffline(true);
    await stopPreview(server);
    server = null;

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

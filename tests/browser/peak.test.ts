// Peak simulation in a real browser, offline: the run happens in a Web Worker, so the page keeps handling input
// while it computes; a newer input cancels the stale run and the result that lands belongs to the newest input.
import { describe, expect, it } from 'vitest';
import { appForFile, firstVisit, offlineOnKestrel, openBrowser, screenshot } from './harness';

const app = appForFile(4341);
const { origin } = app;

describe('peak simulation keeps the page responsive', () => {
  it('handles typing while a simulation runs, cancels the stale run and shows the newest result', async () => {
    const session = (app.session = await openBrowser(app.profile));
    const { page } = session;
    await firstVisit(page, origin);
    await offlineOnKestrel(app);

    await page.goto(origin + '/peak');
    await page.getByTestId('peak-transmission').waitFor({ timeout: 60_000 });

    // Record, for every input event, whether a simulation was in progress when the page handled it.
    await page.evaluate(() => {
      const w = window as unknown as { inputsDuringRun: boolean[] };
      w.inputsDuringRun = [];
      document.addEventListener('input', () => {
        w.inputsDuringRun.push(!!document.querySelector('progress[aria-label="Simulation progress"]'));
      }, true);
    });

    // The settings are folded to one line under the instrument: open them.
    await page.locator('[data-testid="peak-fold"] .fold-toggle').click();
    // A slow setting: low ion energy (many RF cycles) at high resolution.
    await page.locator('#peak-resolution').fill('3000');
    await page.locator('#peak-axial').fill('0.5');
    await page.locator('progress[aria-label="Simulation progress"]').waitFor({ timeout: 30_000 });
    // While it runs, the engineer changes the m/z, one key at a time.
    await page.locator('#peak-mz').fill('');
    await page.locator('#peak-mz').pressSequentially('502');
    expect(await page.locator('#peak-mz').inputValue()).toBe('502');
    const during = await page.evaluate(() => (window as unknown as { inputsDuringRun: boolean[] }).inputsDuringRun);
    // At least one keystroke was handled while a run was in progress: the main thread was free.
    expect(during.some(Boolean)).toBe(true);

    // The result that lands is the one for m/z 502, not a stale one.
    await expect.poll(() => page.getByTestId('peak-transmission').textContent(), { timeout: 120_000 }).toMatch(/at m\/z 50[12]\./);
    await expect.poll(() => page.locator('progress[aria-label="Simulation progress"]').count(), { timeout: 120_000 }).toBe(0);
    expect(await page.getByTestId('peak-r50').textContent()).toMatch(/\d/);
    await screenshot(page, 'peak-after-input');
    expect(session.foreignRequests).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });
});

// Readings that cannot mislead: plausible ranges refused where typed, an exponent typed with key presses only,
// the RF convention chosen at the probe, a convention slip flagged, and readings corrected without being lost.
import { beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { appForFile, openBrowser, screenshot } from './harness';

const app = appForFile(4361);
const { origin } = app;

beforeAll(async () => {
  app.session = await openBrowser(app.profile, { viewport: { width: 390, height: 844 } });
});

const nodeId = (page: Page) => page.locator('[data-testid="walk-node"]').getAttribute('data-node-id');
async function atNode(page: Page, id: string) {
  await expect.poll(() => nodeId(page), { timeout: 15_000 }).toBe(id);
}
async function pick(page: Page, label: string | RegExp) {
  await page.getByRole('button', { name: label }).click();
}
async function confirmGate(page: Page) {
  await page.getByRole('radio', { name: /Field service engineer/ }).check();
  for (const box of await page.getByRole('checkbox').all()) await box.check();
  await pick(page, 'Confirmed — continue');
}
async function measure(page: Page, value: string, inputs: Record<string, string> = {}) {
  for (const [k, v] of Object.entries(inputs)) await page.locator(`#in-${k}`).fill(v);
  await page.locator('#walk-value').fill(value);
  await pick(page, 'Record reading and continue');
}

/** Type into a field and leave it (Tab), as an engineer would; returns the message tied to it, if any. */
async function typeAndLeave(page: Page, id: string, text: string): Promise<string | null> {
  const field = page.locator(`#${id}`);
  await field.fill(text);
  await field.press('Tab');
  await expect.poll(() => field.getAttribute('aria-invalid')).toBe('true');
  const described = (await field.getAttribute('aria-describedby')) ?? '';
  const errorId = described.split(' ').find((x) => x.endsWith('-error'));
  expect(errorId).toBeTruthy();
  return page.locator(`#${errorId}`).textContent();
}

describe('readings', () => {
  it('refuses 1e308 and −5 at the pressure step, takes an exponent typed key by key, and catches a convention slip at the RF step', async () => {
    const page = app.session!.page;
    await page.goto(origin + '/diagnose');
    await expect.poll(() => page.locator('#walk-instrument option[value="demo-lcms-heron"]').count(), { timeout: 15_000 }).toBe(1);
    await page.locator('#walk-instrument').selectOption('demo-lcms-heron');
    await pick(page, /Start a walk/);
    await atNode(page, 'E1');
    await confirmGate(page);
    await atNode(page, 'E2');

    // Plausible range (vacuum-high: 1e-10 Pa to 1.2e5 Pa, i.e. 1e-12 to 1200 mbar), refused on leaving the field.
    expect(await typeAndLeave(page, 'walk-value', '1e308')).toBe('Analyser pressure (as found) must be between 1e-12 and 1200 mbar; 1e308 mbar is above that.');
    expect(await typeAndLeave(page, 'walk-value', '-5')).toBe('Analyser pressure (as found) must be between 1e-12 and 1200 mbar; -5 mbar is below that.');
    await pick(page, 'Record reading and continue');
    await atNode(page, 'E2');
    // One message for the field, no second copy below the button.
    expect(await page.getByText(/must be between 1e-12 and 1200 mbar/).count()).toBe(1);
    expect(await page.locator('[role="alert"]').filter({ hasText: /must be/ }).count()).toBe(0);

    // A phone's text keyboard: key presses only, exponent and minus included.
    const field = page.locator('#walk-value');
    expect(await field.getAttribute('inputmode')).toBe('text');
    await field.fill('');
    await field.pressSequentially('2.5e-5');
    await field.press('Tab');
    await expect.poll(() => field.getAttribute('aria-invalid')).toBe('false');
    expect(await field.inputValue()).toBe('2.5e-5');
    await pick(page, 'Record reading and continue');
    await atNode(page, 'E3');

    await pick(page, 'Vented or cleaned');
    await pick(page, 'Suddenly');
    await atNode(page, 'E5');
    await page.getByRole('checkbox', { name: 'No signal at all' }).check();
    await pick(page, /Continue with 1 symptom/);
    await pick(page, /Start “No signal at all”/);
    await atNode(page, 'NS1');
    await pick(page, 'Nothing anywhere');
    await atNode(page, 'NS2');
    await pick(page, /No carrier flow here .* matches the baseline/);
    await atNode(page, 'NS3');
    await pick(page, /Electrospray or APCI/);
    await atNode(page, 'NS3A1');
    await measure(page, '0.3', { setPoint: '0.3' });
    await atNode(page, 'NS3A2');
    await pick(page, 'All at set point');
    await atNode(page, 'NS3A3');
    await pick(page, 'Stable spray, emitter clear');
    await atNode(page, 'NS3A4');
    await measure(page, '2', { baseline: '2' });
    await atNode(page, 'NS4');
    await pick(page, 'Output present');
    await atNode(page, 'NS5-G');
    await confirmGate(page);
    await atNode(page, 'NS5');

    // Heron: r0 4.0 mm, 1.2 MHz, read-back peak-to-peak per rod. m/z 69 needs V0p = 100.91 V × (4.0/4.5)² × 1.2²
    // = 114.82 V (V ∝ r0²f², q = 4eV/(m r0²Ω²), Dawson 1976), so 229.6 V peak-to-peak (p-p = 2 × 0-p for a sine).
    await expect.poll(() => page.locator('[data-testid="expected-value"]').textContent()).toMatch(/Expected: 229\.6 V/);
    expect(await page.locator('[data-testid="expected-convention"]').textContent()).toBe('peak-to-peak, one rod to ground');
    // The meter read 114.8 V zero-to-peak: against peak-to-peak that is off by 2, the size of a convention slip.
    await page.locator('#walk-value').fill('114.8');
    await expect.poll(() => page.locator('[data-testid="live-verdict"]').textContent()).toMatch(/⇄ check the convention/);
    expect(await page.locator('[data-testid="convention-hint"]').textContent()).toMatch(/factor of 2[\s\S]*read as zero-to-peak, one rod to ground it\s+would match/);
    await screenshot(page, 'readings-convention-slip');
    // One tap: the reading was zero-to-peak. Expected now shows in that convention, and the reading matches.
    await page.getByRole('button', { name: 'zero-to-peak', exact: true }).click();
    await expect.poll(() => page.locator('[data-testid="expected-value"]').textContent()).toMatch(/Expected: 114\.8 V/);
    expect(await page.locator('[data-testid="expected-convention"]').textContent()).toBe('zero-to-peak, one rod to ground');
    await expect.poll(() => page.locator('[data-testid="live-verdict"]').textContent()).toMatch(/✓ pass/);
    await pick(page, 'Record reading and continue');
    await atNode(page, 'NS5b');
    expect(app.session!.pageErrors).toEqual([]);
  });

  it('the leak check refuses 1e308 and −5 heights with plain messages and forms no ratio from them', async () => {
    const page = app.session!.page;
    await page.goto(origin + '/diagnose/leak-check');
    await page.locator('#leak-m32').fill('258');
    expect(await typeAndLeave(page, 'leak-m28', '1e308')).toBe('Height at m/z 28 must be between 0 and 1e15; 1e308 is above that.');
    expect(await page.locator('[data-testid="leak-indication"]').count()).toBe(0);
    expect(await typeAndLeave(page, 'leak-m28', '-5')).toBe('Height at m/z 28 must be between 0 and 1e15; -5 is below that.');
    expect(await page.locator('[data-testid="leak-indication"]').count()).toBe(0);
    expect(await page.locator('main').textContent()).not.toMatch(/NaN|InputRangeError|m28 =/);
    const m28 = page.locator('#leak-m28');
    await m28.fill('');
    await m28.pressSequentially('1.0e3');
    await expect.poll(() => page.locator('main').textContent()).toMatch(/Air leak|Not air|nitrogen/i);
    expect(app.session!.pageErrors).toEqual([]);
  });

  it('a reading is edited with its history kept, and a deleted reading comes back with Undo', async () => {
    const page = app.session!.page;
    await page.goto(origin + '/visits/new');
    await page.locator('#visit-engineer').fill('Readings test');
    await page.locator('#visit-site').fill('Bench 2');
    await page.getByRole('button', { name: 'Create visit' }).click();
    await expect.poll(() => new URL(page.url()).pathname).toMatch(/^\/visits\/visit-/);

    await page.locator('#reading-type').selectOption('vacuum-high');
    await page.locator('#reading-unit').selectOption('mbar');
    // The visit value refuses an impossible pressure on leaving the field, with the same rule as the walk.
    expect(await typeAndLeave(page, 'reading-value', '1e308')).toBe('High vacuum (analyser) must be between 1e-12 and 1200 mbar; 1e308 mbar is above that.');
    const value = page.locator('#reading-value');
    expect(await value.getAttribute('inputmode')).toBe('text');
    await value.fill('');
    await value.pressSequentially('2e-5');
    await page.getByRole('button', { name: 'Save reading' }).click();
    const rows = () => page.locator('[data-testid="readings-as-found"] [data-testid="reading-row"]').allTextContents();
    await expect.poll(rows).toEqual([expect.stringMatching(/High vacuum \(analyser\).*2e-5 mbar/)]);

    // Edit: the corrected value shows, the earlier one stays visible with its times.
    await page.getByRole('button', { name: 'Edit High vacuum (analyser)' }).click();
    const edit = page.locator('[data-testid="reading-edit"]');
    const corrected = edit.getByLabel('Corrected value');
    await corrected.fill('');
    await corrected.pressSequentially('3e-5');
    await edit.getByLabel(/Note/).fill('misread the exponent digit');
    await edit.getByRole('button', { name: 'Save the change' }).click();
    await expect.poll(rows).toEqual([expect.stringMatching(/3e-5 mbar\s*Earlier: 2e-5 mbar.*recorded \d{4}-\d\d-\d\d \d\d:\d\d, replaced \d{4}-\d\d-\d\d \d\d:\d\d/)]);
    await screenshot(page, 'readings-history');
    // The history survives a reload (it is in the store, not just on screen).
    await page.reload();
    await expect.poll(() => page.locator('[data-testid="reading-history"]').textContent()).toMatch(/Earlier: 2e-5 mbar/);

    // Delete, then Undo: the same reading, history and all, comes back.
    await page.getByRole('button', { name: 'Delete High vacuum (analyser)' }).click();
    await expect.poll(rows).toEqual([]);
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(rows).toEqual([expect.stringMatching(/3e-5 mbar\s*Earlier: 2e-5 mbar/)]);
    expect(app.session!.pageErrors).toEqual([]);
  });
});

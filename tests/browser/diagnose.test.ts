// Diagnose offline: on a demo instrument, with the network cut and the server stopped, walk the shared entry
// and the whole no-signal tree to an action, resuming after a reload and after a cold restart on the same profile.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';
import type { PreviewServer } from 'vite';
import { distDir, freshProfileDir, openBrowser, removeDir, screenshot, startPreview, stopPreview, waitForServiceWorkerControl, type Session, testPort } from './harness';

const PORT = testPort(4337);
const origin = `http://127.0.0.1:${PORT}`;
let server: PreviewServer | null = null;
const profile = freshProfileDir();
let session: Session | null = null;
const foreign: string[] = [];

beforeAll(async () => {
  server = await startPreview(distDir, PORT);
});
afterAll(async () => {
  if (session) foreign.push(...session.foreignRequests);
  await session?.close().catch(() => undefined);
  await stopPreview(server).catch(() => undefined);
  removeDir(profile);
});

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/** Serious or critical accessibility problems inside the screen (axe-core, WCAG 2 A/AA rules). */
async function axeProblems(page: Page): Promise<string[]> {
  await page.evaluate(axeSource);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: unknown, opts: unknown) => Promise<{ violations: { id: string; impact: string; nodes: unknown[] }[] }> } }).axe;
    const r = await axe.run({ include: [['main']] }, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] } });
    return r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.nodes.length})`);
  });
}

const nodeId = (page: Page) => page.locator('[data-testid="walk-node"]').getAttribute('data-node-id');

async function atNode(page: Page, id: string) {
  await expect.poll(() => nodeId(page), { timeout: 15_000 }).toBe(id);
}

/** The screen says the walk is kept in the database (saves are asynchronous). */
async function kept(page: Page) {
  await expect.poll(() => page.locator('[data-testid="save-state"]').textContent(), { timeout: 15_000 }).toMatch(/kept on this device/);
}

async function pick(page: Page, label: string | RegExp) {
  await page.getByRole('button', { name: label }).click();
}

async function measure(page: Page, value: string, inputs: Record<string, string> = {}) {
  for (const [k, v] of Object.entries(inputs)) await page.locator(`#in-${k}`).fill(v);
  await page.locator('#walk-value').fill(value);
  // Where no expected value can be computed the engineer gives the verdict.
  const manual = page.getByRole('radio', { name: 'Pass', exact: true });
  if (await manual.count()) await manual.check();
  await pick(page, 'Record reading and continue');
}

async function confirmGate(page: Page) {
  await page.getByRole('radio', { name: /Field service engineer/ }).check();
  for (const box of await page.getByRole('checkbox').all()) await box.check();
  await pick(page, 'Confirmed — continue');
}

describe('diagnose offline', () => {
  it('walks the no-signal tree offline on a demo instrument, resuming after reload and cold restart', async () => {
    session = await openBrowser(profile);
    let page = session.page;
    await page.goto(origin + '/diagnose');
    await waitForServiceWorkerControl(page);
    await page.locator('#walk-instrument').selectOption('demo-gcms-kestrel');

    // Offline from here on: network cut, server stopped.
    await session.context.setOffline(true);
    await stopPreview(server);
    server = null;
    await page.reload();
    await expect.poll(() => page.locator('#walk-instrument').inputValue()).toBe('demo-gcms-kestrel');

    await pick(page, /Start a walk/);
    await atNode(page, 'E1');
    expect(await page.locator('[data-testid="safety-card"]').count()).toBeGreaterThan(0);
    expect(await axeProblems(page)).toEqual([]);
    await confirmGate(page);
    await atNode(page, 'E2');
    await measure(page, '2e-5');
    await atNode(page, 'E3');
    await pick(page, 'Vented or cleaned');
    await pick(page, 'Suddenly');
    await atNode(page, 'E5');
    await page.getByRole('checkbox', { name: 'No signal at all' }).check();
    await page.getByRole('checkbox', { name: /Vacuum fault/ }).check();
    await page.getByRole('checkbox', { name: /Vacuum fault/ }).uncheck();
    await pick(page, /Continue with 1 symptom/);
    await pick(page, /Start “No signal at all”/);

    await atNode(page, 'NS1');
    await pick(page, 'Nothing anywhere');
    await atNode(page, 'NS2');
    // Expected ion-gauge reading from 1 mL/min helium at 200 L/s: 8.44e-5 mbar true × 0.18 ≈ 1.5e-5 mbar (p = Q/S_eff, O'Hanlon, A User's Guide to Vacuum Technology, 3rd ed., 2003; He 0.18 from the CRC Handbook Bayard–Alpert table).
    await expect.poll(() => page.locator('[data-testid="expected"]').textContent()).toMatch(/Expected: 1\.520?×10⁻⁵ mbar/);
    await page.locator('#walk-value').fill('1.4e-5');
    await expect.poll(() => page.locator('[data-testid="live-verdict"]').textContent()).toMatch(/✓ pass/);
    // Mean free path at the pressure read, for this instrument's rods (kinetic theory, air).
    await expect.poll(() => page.locator('[data-testid="derived"]').textContent()).toMatch(/Mean free path at the pressure read: 4\.7\d* m/);
    expect(await axeProblems(page)).toEqual([]);
    await pick(page, 'Record reading and continue');
    await atNode(page, 'NS3');
    await pick(page, /Electron ionisation/);
    await atNode(page, 'NS3E1');
    await measure(page, '49', { setPoint: '50' });
    await atNode(page, 'NS3E3');

    // Back undoes the emission reading; the reading stays, withdrawn.
    await pick(page, '← Back');
    await atNode(page, 'NS3E1');
    expect(await page.locator('#walk-value').inputValue()).toBe('49');
    await measure(page, '50', { setPoint: '50' });
    await atNode(page, 'NS3E3');

    // Reload in the middle of the walk, once the screen says the step is kept: it resumes at the same step.
    await kept(page);
    await page.reload();
    await atNode(page, 'NS3E3');
    await expect.poll(() => page.locator('[data-testid="resumed"]').count()).toBe(1);

    await pick(page, 'All plausible');
    await atNode(page, 'NS4');
    await pick(page, 'Output present');
    await atNode(page, 'NS5-G');
    await confirmGate(page);
    await atNode(page, 'NS5');
    // Kestrel: r0 4.5 mm, 1.0 MHz, zero-to-peak per rod: m/z 69 needs 100.91 V (V0p = 0.072218·M·r0²·f² at the q = 0.706 apex, Dawson 1976, with CODATA 2018 constants; computed).
    await expect.poll(() => page.locator('[data-testid="expected"]').textContent()).toMatch(/Expected: 100\.9 V/);
    await measure(page, '100.9', { mz: '69' });
    await atNode(page, 'NS5b');
    // Proportional check (V ∝ m/z, Dawson 1976): 100.9 V × 219/69 = 320.248 V.
    await page.locator('#in-rfFirst').fill('100.9');
    await expect.poll(() => page.locator('[data-testid="expected"]').textContent()).toMatch(/Expected: 320\.2 V/);
    await measure(page, '320', { mz: '219' });
    await atNode(page, 'NS6');
    await pick(page, 'No signal even wide open');
    await pick(page, 'All consistent; single quadrupole or residual gas analyser');
    await atNode(page, 'NS9');
    await expect.poll(() => page.locator('[data-testid="closing"]').textContent()).toMatch(/re-measure and record/i);

    // Cold restart on the same profile, still offline: the walk is where we left it.
    await kept(page);
    foreign.push(...session.foreignRequests);
    await session.close();
    session = await openBrowser(profile);
    await session.context.setOffline(true);
    page = session.page;
    await page.goto(origin + '/diagnose');
    await atNode(page, 'NS9');

    await page.locator('#left-quantity').fill('Total ion signal, full scan');
    await page.locator('#left-value').fill('12000');
    await page.locator('#left-unit').selectOption('counts/s');
    await pick(page, 'Record as-left reading');
    await expect.poll(() => page.getByText('1 as-left reading recorded here.').count()).toBe(1);
    await screenshot(page, 'diagnose-leaf');
    await pick(page, 'Finish this walk');
    const table = page.locator('[data-testid="walk-readings"]');
    await expect.poll(() => table.textContent()).toMatch(/withdrawn by Back/);
    const text = (await table.textContent()) ?? '';
    expect(text).toMatch(/Emission current/);
    expect(text).toMatch(/✓ pass/);
    expect(text).toMatch(/as-left/);
    expect(text).not.toMatch(/NaN/);
    await screenshot(page, 'diagnose-summary');
    // The walk's readings go into the instrument's visit log (six: the withdrawn one stays out).
    await pick(page, 'Add 6 readings to the visit log');
    await expect.poll(() => page.getByRole('button', { name: 'Readings are in the visit log' }).count()).toBe(1);
    await kept(page);
    // The visit log shows the readings and lists the walk under the same visit.
    await page.goto(origin + '/visits');
    await page.locator('[data-testid="visit-item"]').first().click();
    await expect.poll(() => page.locator('[data-testid="reading-row"]').count()).toBe(6);
    await expect.poll(() => page.locator('main').textContent()).toMatch(/Diagnosis walks[\s\S]*no-signal — finished/);

    foreign.push(...session.foreignRequests);
    expect(session.pageErrors).toEqual([]);
    expect(foreign).toEqual([]);
  });

  it('the leak check panel works offline and keeps what was typed', async () => {
    const page = session!.page;
    await page.goto(origin + '/diagnose/leak-check');
    await page.locator('#leak-m28').fill('1000');
    await page.locator('#leak-m32').fill('258');
    await page.locator('#leak-m40').fill('17');
    await expect.poll(() => page.locator('[data-testid="leak-indication"]').textContent()).toMatch(/Air leak/);
    await page.locator('#leak-volume').fill('10');
    await page.locator('#leak-rise').fill('0 1e-3\n25 1.25e-3\n50 1.5e-3\n75 1.75e-3\n100 2e-3');
    // Rate of rise Q = V·Δp/Δt: 10 L × 1e-3 mbar / 100 s = 1e-4 mbar·L/s (O'Hanlon 2003).
    await expect.poll(() => page.locator('[data-testid="rate-of-rise"]').textContent()).toMatch(/Q = 1(\.00)?×10⁻⁴ mbar·L\/s[\s\S]*linear/);
    await page.reload();
    await expect.poll(() => page.locator('#leak-m32').inputValue()).toBe('258');
    await expect.poll(() => page.locator('[data-testid="leak-indication"]').textContent()).toMatch(/Air leak/);
  });
});

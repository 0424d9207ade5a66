// Bench and Stability in a real browser, offline: every area renders from the service worker with the server
// stopped; the stability chart draws; a tap near an operating point shows its values; axe-core finds no
// serious or critical violation on any screen; a 390 × 844 screenshot of every screen goes to test-artifacts/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { appForFile, firstVisit, offlineOnKestrel, openBrowser, projectRoot, screenshot } from './harness';

const app = appForFile(4321);
const { origin } = app;

const screens: [path: string, name: string][] = [
  ['/', 'overview'],
  ['/bench', 'bench-voltages'],
  ['/bench/vacuum', 'bench-vacuum'],
  ['/stability', 'stability-diagram'],
  ['/stability/resolution', 'stability-resolution'],
  ['/peak', 'peak'],
  ['/diagnose', 'diagnose'],
  ['/visits', 'visits'],
  ['/instruments', 'instruments'],
  ['/safety', 'safety'],
];

beforeAll(async () => {
  const session = (app.session = await openBrowser(app.profile, { viewport: { width: 390, height: 844 } }));
  await firstVisit(session.page, origin);
  // The app's CSP forbids inline scripts; let axe-core in through the DevTools protocol (test only).
  const cdp = await session.context.newCDPSession(session.page);
  await cdp.send('Page.setBypassCSP', { enabled: true });
  // From here on the demo Kestrel (r0 4.5 mm, 1 MHz, read-backs 0-p per rod) is the instrument in front of us,
  // with no network and no server.
  await offlineOnKestrel(app);
});

async function axeSeriousOrCritical(): Promise<string[]> {
  const page = app.session!.page;
  await page.addScriptTag({ path: join(projectRoot, 'node_modules/axe-core/axe.min.js') });
  return page.evaluate(async () => {
    type AxeResult = { passes: unknown[]; violations: { id: string; impact: string; nodes: { target: string[] }[] }[] };
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<AxeResult> } }).axe;
    const r = await axe.run(document, { resultTypes: ['violations'] });
    // A run that checked nothing would pass silently: insist that rules actually ran.
    if (r.passes.length === 0) return ['axe ran no passing rules: the page was empty or axe did not load'];
    return r.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => `${v.id} (${v.impact}): ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(', ')}`);
  });
}

async function canvasInkedPixels(selector: string): Promise<number> {
  return app.session!.page.evaluate((sel) => {
    const canvas = document.querySelector(`${sel} canvas`) as HTMLCanvasElement | null;
    if (!canvas) return -1;
    const ctx = canvas.getContext('2d');
    if (!ctx) return -2;
    const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
    let inked = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i] !== 0) inked++;
    return inked;
  }, selector);
}

describe('Bench and Stability, offline on a phone-sized screen', () => {
  it('the resolution planner gets the transmission cost from the peak worker, offline', async () => {
    const page = app.session!.page;
    await page.goto(origin + '/stability/resolution');
    // The setting for a target resolution, with its transmission cost, is one tap away.
    await page.locator('[data-testid="reverse-fold"] summary').click();
    const loss = page.locator('[data-testid="transmission-loss"]');
    await expect.poll(() => loss.textContent(), { timeout: 30_000 }).toMatch(/Resolving to m\/Δm 1000 costs \d+(\.\d+)? % of the ions/);
    const target = Number((await page.locator('[data-testid="transmission-target"] .result-value').textContent())!.replace(' %', ''));
    expect(target).toBeGreaterThan(0);
    expect(target).toBeLessThan(100);
  });

  it('every area renders offline with a heading, no page errors, and no serious or critical axe violations', async () => {
    const page = app.session!.page;
    const problems: string[] = [];
    for (const [path, name] of screens) {
      await page.goto(origin + path);
      await expect.poll(() => page.locator('main h1').first().textContent(), { timeout: 10_000 }).toMatch(/\S/);
      if (path === '/bench') await expect.poll(() => page.locator('[data-testid="expected-card"]').count()).toBeGreaterThan(0);
      if (path === '/stability') await expect.poll(() => canvasInkedPixels('[data-testid="stability-chart"]')).toBeGreaterThan(1000);
      if (path === '/stability/resolution') {
        await page.locator('summary', { hasText: 'Scan planning' }).click();
        await expect.poll(() => page.locator('[data-testid="scan-plan"]').count()).toBe(1);
      }
      await screenshot(page, `bench-suite-${name}`);
      const violations = await axeSeriousOrCritical();
      if (violations.length) problems.push(`${path}: ${violations.join(' | ')}`);
      expect(await page.locator('body').textContent()).not.toMatch(/NaN/);
    }
    expect(problems).toEqual([]);
    expect(app.session!.pageErrors).toEqual([]);
    expect(app.session!.foreignRequests).toEqual([]);
  });

  it('at 360 px wide nothing on the Bench and Stability screens runs off the side', async () => {
    const page = app.session!.page;
    await page.setViewportSize({ width: 360, height: 780 });
    try {
      for (const path of ['/bench', '/bench/vacuum', '/stability', '/stability/resolution']) {
        await page.goto(origin + path);
        await expect.poll(() => page.locator('main h1').first().textContent()).toMatch(/\S/);
        await page.waitForTimeout(300);
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        expect(overflow, `${path} overflows by ${overflow} px`).toBeLessThanOrEqual(0);
      }
    } finally {
      await page.setViewportSize({ width: 390, height: 844 });
    }
  });

  it('the expected voltages for Kestrel show m/z 69 at 100.91 V 0-p and 16.936 V DC with the HV caution', async () => {
    const page = app.session!.page;
    await page.goto(origin + '/bench');
    const card69 = page.locator('[data-testid="expected-card"][data-mz="69"]');
    await expect.poll(() => card69.locator('[data-testid="rf-readback"] .result-value').textContent()).toBe('100.91 V 0-p');
    expect(await card69.locator('[data-testid="dc-readback"] .result-value').textContent()).toBe('16.936 V DC');
    // The caution line's full card is one tap away.
    await page.locator('[data-testid="hv-short"] summary').click();
    expect(await page.locator('[data-testid="hv-caution"]').textContent()).toMatch(/maker's procedures/);
    // One tap notes the value in the instrument's current visit, offline.
    await card69.locator('[data-testid="rf-readback"] button').click();
    await expect.poll(() => page.locator('.toast').textContent()).toMatch(/^Noted in the visit of \d{4}-\d{2}-\d{2}\./);
    // The vacuum check is one tap away in the Bench area's own navigation.
    await page.getByRole('link', { name: 'Vacuum check' }).click();
    await expect.poll(() => page.url()).toBe(origin + '/bench/vacuum');
    await expect.poll(() => page.locator('[data-testid="vacuum-verdict"]').textContent()).toMatch(/^[✓~✗] (pass|borderline|fail)/);
  });

  it('the stability chart draws; a tap near the set m/z point shows a, q, β_x, β_y and the nearest edge', async () => {
    const page = app.session!.page;
    await page.goto(origin + '/stability');
    await expect.poll(() => canvasInkedPixels('[data-testid="stability-chart"]')).toBeGreaterThan(1000);
    const over = page.locator('[data-testid="stability-chart"] .u-over');
    const panel = page.locator('[data-testid="point-panel"]');
    const tapNear = async (mz: number) => {
      await expect.poll(() => over.getAttribute('data-points')).toMatch(new RegExp(`"mz":${mz}[,}]`));
      const points = JSON.parse((await over.getAttribute('data-points'))!) as { mz: number; x: number; y: number }[];
      const p = points.find((pt) => pt.mz === mz)!;
      await over.scrollIntoViewIfNeeded();
      const box = (await over.boundingBox())!;
      // A fingertip lands off-centre: 12 px right and 10 px down of the point still selects it.
      await page.mouse.click(box.x + p.x + 12, box.y + p.y + 10);
    };
    // Whole region: m/z 219 sits far left of the band (small q), cut by the y edge on the high-mass side.
    await tapNear(219);
    await expect.poll(() => panel.locator('h2').textContent()).toMatch(/m\/z 219: ✗ does not pass/);
    expect(await panel.locator('[data-testid="panel-by"] .result-value').textContent()).toMatch(/unstable in y/);
    // Apex close-up separates 68, 69 and 70; the set m/z 69 passes.
    await page.locator('[data-testid="zoom-apex"]').click();
    await expect.poll(() => canvasInkedPixels('[data-testid="stability-chart"]')).toBeGreaterThan(1000);
    await tapNear(69);
    await expect.poll(() => panel.locator('h2').textContent()).toMatch(/m\/z 69: ✓ passes/);
    expect(Number(await panel.locator('[data-testid="panel-q"] .result-value').textContent())).toBeCloseTo(0.706, 2);
    expect(Number(await panel.locator('[data-testid="panel-a"] .result-value').textContent())).toBeGreaterThan(0.2);
    expect(await panel.locator('[data-testid="panel-bx"] .result-value').textContent()).toMatch(/^0\.\d+/);
    expect(await panel.locator('[data-testid="panel-by"] .result-value').textContent()).toMatch(/^0\.\d+/);
    expect(await panel.locator('[data-testid="panel-edge"] .result-value').textContent()).toMatch(/edge .*inside by Δa/);
    await screenshot(page, 'bench-suite-stability-apex');
  });
});

// Phone first, at 390 × 844 CSS px, offline: on every area the answer the engineer came for sits in the first
// screen, and no page runs past 2.5 screens with its disclosures closed — in the ordinary look and in field mode.
// In the ordinary look each page's text uses at most 6 fonts (size × weight × style) of the type scale.
// Field mode also gets 56 px touch targets, results at 20 px or more, text at 7:1 contrast or better, and no serious
// or critical axe-core finding. Screenshots of every area in both modes go to test-artifacts/.
// Contrast: WCAG 2.1 relative luminance and contrast ratio (W3C, Web Content Accessibility Guidelines 2.1, 2018,
// definitions "relative luminance" and "contrast ratio"); 7:1 is the enhanced level of success criterion 1.4.6.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { appForFile, artifactsDir, firstVisit, offlineOnKestrel, openBrowser, projectRoot } from './harness';

const app = appForFile(4361);
const { origin } = app;
const SCREEN = { width: 390, height: 844 };
const MAX_HEIGHT = 2110; // 2.5 screens of 844 px
/** Sizes × weights × styles of visible text per page in the ordinary look: the type scale's 4 sizes, 2 weights. */
const MAX_FONTS = 6;
const heights: Record<string, Record<string, number>> = { normal: {}, field: {} };

interface Area {
  path: string;
  name: string;
  /** The element that holds the answer: its bottom edge must be inside the first screen. */
  answer?: string;
  /** Wait for this before measuring (the answer drawn, a computation landed). */
  ready?: (page: Page) => Promise<unknown>;
}

async function canvasInked(page: Page, selector: string): Promise<number> {
  return page.evaluate((sel) => {
    const canvas = document.querySelector(`${sel} canvas`) as HTMLCanvasElement | null;
    const ctx = canvas?.getContext('2d');
    if (!canvas || !ctx || canvas.width === 0) return 0;
    const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
    let inked = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i] !== 0) inked++;
    return inked;
  }, selector);
}

const areas: Area[] = [
  { path: '/', name: 'overview' },
  {
    path: '/bench', name: 'bench', answer: '[data-testid="expected-card"]:first-child [data-testid="dc-readback"]',
    ready: (page) => expect.poll(() => page.locator('[data-testid="expected-card"]').count()).toBeGreaterThan(0),
  },
  // The gauge reading is typed afresh on each visit: its field comes first, the verdict right after.
  { path: '/bench/vacuum', name: 'bench-vacuum' },
  {
    path: '/stability', name: 'stability', answer: '[data-testid="stability-chart"] canvas',
    ready: (page) => expect.poll(() => canvasInked(page, '[data-testid="stability-chart"]')).toBeGreaterThan(1000),
  },
  {
    path: '/stability/resolution', name: 'stability-resolution', answer: '[data-testid="res-rule"]',
    ready: (page) => expect.poll(() => page.locator('[data-testid="res-exact"]').count()).toBe(1),
  },
  {
    path: '/peak', name: 'peak', answer: '[data-testid="peak-chart"] canvas',
    ready: async (page) => {
      await page.locator('[data-testid="peak-chart"] canvas').waitFor({ timeout: 120_000 });
      await expect.poll(() => canvasInked(page, '[data-testid="peak-chart"]'), { timeout: 60_000 }).toBeGreaterThan(500);
    },
  },
  // No scan kept yet: the paste field and the demo button come first.
  { path: '/scan', name: 'scan' },
  { path: '/scan/masses', name: 'scan-masses', answer: '[data-testid="masses-mz"]' },
  { path: '/scan/mass-axis', name: 'scan-mass-axis' },
  { path: '/diagnose', name: 'diagnose' },
  { path: '/visits', name: 'visits', answer: 'main a[href="/visits/new"]' },
  { path: '/instruments', name: 'instruments' },
  { path: '/safety', name: 'safety' },
];

beforeAll(async () => {
  const session = (app.session = await openBrowser(app.profile, { viewport: SCREEN }));
  await firstVisit(session.page, origin);
  // The app's CSP forbids inline scripts; let axe-core in through the DevTools protocol (test only).
  const cdp = await session.context.newCDPSession(session.page);
  await cdp.send('Page.setBypassCSP', { enabled: true });
  await offlineOnKestrel(app);
});

afterAll(async () => {
  // The page heights measured, for the record.
  mkdirSync(artifactsDir, { recursive: true });
  writeFileSync(join(artifactsDir, 'phone-heights.json'), JSON.stringify(heights, null, 2));
});

async function open(page: Page, area: Area): Promise<void> {
  await page.goto(origin + area.path);
  await expect.poll(() => page.locator('main h1').first().textContent(), { timeout: 15_000 }).toMatch(/\S/);
  if (area.ready) await area.ready(page);
  if (area.answer) await page.locator(area.answer).first().waitFor({ timeout: 30_000 });
  // Layout settles (fonts, charts sized to their cards) before anything is measured.
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
}

/** Page height with every disclosure closed, and the answer's bottom edge, at the top of the page. */
async function measure(page: Page, answer?: string): Promise<{ height: number; answerBottom: number | null; visibleBottom: number }> {
  return page.evaluate((sel) => {
    for (const d of document.querySelectorAll('details[open]')) (d as HTMLDetailsElement).open = false;
    window.scrollTo(0, 0);
    const el = sel ? document.querySelector(sel) : null;
    // The phone's bottom bar covers the foot of the screen: what sits under it is not visible either.
    const bar = document.querySelector('.bottombar');
    const barTop = bar && getComputedStyle(bar).display !== 'none' ? bar.getBoundingClientRect().top : window.innerHeight;
    return {
      height: Math.ceil(document.documentElement.scrollHeight),
      answerBottom: el ? el.getBoundingClientRect().bottom : null,
      visibleBottom: Math.min(window.innerHeight, barTop),
    };
  }, answer);
}

async function shoot(page: Page, name: string): Promise<void> {
  mkdirSync(artifactsDir, { recursive: true });
  await page.evaluate(() => window.scrollTo(0, 0));
  // The first screen, as the engineer sees it on opening the page.
  await page.screenshot({ path: join(artifactsDir, `${name}.png`), fullPage: false });
}

async function setFieldMode(page: Page, on: boolean): Promise<void> {
  const toggle = page.getByRole('button', { name: /Field mode: gloves & bright light/ });
  if ((await toggle.getAttribute('aria-pressed')) !== String(on)) await toggle.click();
  await expect.poll(() => page.evaluate(() => document.documentElement.hasAttribute('data-field-mode'))).toBe(on);
}

/** Visible interactive elements shorter than 56 px (the control's own box, or the label around a checkbox). */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const small: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>('button, a[href], input, select, summary, textarea')) {
      if (el.closest('[hidden], details:not([open]) > :not(summary)')) continue;
      const style = getComputedStyle(el);
      if (style.visibility === 'hidden' || style.display === 'none') continue;
      let box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0 || box.right <= 0) continue; // not shown (e.g. the skip link off-screen)
      const type = (el as HTMLInputElement).type;
      if (el.tagName === 'INPUT' && (type === 'checkbox' || type === 'radio')) {
        const label = el.closest('label');
        if (label) box = label.getBoundingClientRect();
      }
      if (box.height < 55.5) small.push(`${el.tagName.toLowerCase()}${el.id ? '#' + el.id : ''} "${(el.textContent || el.getAttribute('aria-label') || '').trim().slice(0, 40)}" ${box.height.toFixed(1)} px`);
    }
    return small;
  });
}

/**
 * The fonts a page's visible text is drawn in: each size × weight × style is a font the browser looks up and
 * prepares on first use, inside a layout (DEVELOPERS.md, "Few sizes of type"). Returns one line per font, with a
 * few of the elements that use it.
 */
async function fontsDrawn(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const fonts = new Map<string, string[]>();
    const walk = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walk.nextNode(); n; n = walk.nextNode()) {
      const el = n.parentElement;
      if (!el || !n.textContent?.trim() || el.getClientRects().length === 0) continue;
      const cs = getComputedStyle(el);
      if (cs.visibility === 'hidden') continue;
      const key = `${cs.fontSize} ${cs.fontWeight} ${cs.fontStyle}`;
      const users = fonts.get(key) ?? [];
      if (users.length < 3) users.push(`${el.tagName.toLowerCase()}${el.className ? '.' + String(el.className).split(' ')[0] : ''}`);
      fonts.set(key, users);
    }
    return [...fonts.entries()].map(([k, users]) => `${k} (${users.join(', ')})`);
  });
}

/** Result figures (values, verdicts, the big answer lines) set smaller than 20 px. */
async function smallResults(page: Page): Promise<{ count: number; small: string[] }> {
  return page.evaluate(() => {
    const els = [...document.querySelectorAll<HTMLElement>('.result-value, .big, .verdict')].filter((el) => el.getBoundingClientRect().height > 0);
    const small = els.filter((el) => parseFloat(getComputedStyle(el).fontSize) < 20)
      .map((el) => `${el.className} "${(el.textContent ?? '').trim().slice(0, 30)}" ${getComputedStyle(el).fontSize}`);
    return { count: els.length, small };
  });
}

/**
 * Every visible text node's contrast against the background it is drawn on (the first opaque background up the
 * tree), WCAG 2.1 formula; also the borders of inputs against the card they sit on.
 */
async function lowContrast(page: Page, minimum: number): Promise<{ checked: number; low: string[] }> {
  return page.evaluate((min) => {
    const parse = (c: string): [number, number, number, number] | null => {
      const m = c.match(/rgba?\(([^)]+)\)/);
      if (!m) return null;
      const p = m[1].split(/[\s,/]+/).filter(Boolean).map(Number);
      return [p[0], p[1], p[2], p.length > 3 ? p[3] : 1];
    };
    const lum = ([r, g, b]: number[]) => {
      const f = (v: number) => {
        const s = v / 255;
        return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
      };
      return 0.2126 * f(r) + 0.7152 * f(g) + 0.0722 * f(b);
    };
    const ratio = (a: number[], b: number[]) => {
      const [l1, l2] = [lum(a), lum(b)].sort((x, y) => y - x);
      return (l1 + 0.05) / (l2 + 0.05);
    };
    const background = (el: Element | null): number[] => {
      for (let e = el; e; e = e.parentElement) {
        const c = parse(getComputedStyle(e).backgroundColor);
        if (c && c[3] >= 0.99) return c.slice(0, 3);
      }
      return [255, 255, 255];
    };
    const low: string[] = [];
    let checked = 0;
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const el = n.parentElement;
      if (!el || !(n.textContent ?? '').trim()) continue;
      if (el.closest('[hidden], details:not([open]) > :not(summary), .visually-hidden, .skip-link, option, script, style')) continue;
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0) continue;
      const style = getComputedStyle(el);
      if (style.visibility === 'hidden' || Number(style.opacity) < 1) continue;
      const fg = parse(style.color);
      if (!fg) continue;
      checked++;
      const r = ratio(fg.slice(0, 3), background(el));
      if (r < min) low.push(`text "${(n.textContent ?? '').trim().slice(0, 30)}" in ${el.tagName.toLowerCase()}.${el.className}: ${r.toFixed(2)}:1`);
    }
    for (const el of document.querySelectorAll<HTMLElement>('.field input:not([type="range"]), .field select, .field textarea, .fold-toggle')) {
      if (el.closest('[hidden], details:not([open]) > :not(summary)') || el.getBoundingClientRect().height === 0) continue;
      const border = parse(getComputedStyle(el).borderTopColor);
      if (!border) continue;
      checked++;
      const r = ratio(border.slice(0, 3), background(el.parentElement));
      if (r < min) low.push(`border of ${el.tagName.toLowerCase()}#${el.id}: ${r.toFixed(2)}:1`);
    }
    return { checked, low };
  }, minimum);
}

async function axeSeriousOrCritical(page: Page): Promise<string[]> {
  await page.addScriptTag({ path: join(projectRoot, 'node_modules/axe-core/axe.min.js') });
  return page.evaluate(async () => {
    type AxeResult = { passes: { id: string }[]; violations: { id: string; impact: string; nodes: { target: string[] }[] }[] };
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<AxeResult> } }).axe;
    const r = await axe.run(document, { resultTypes: ['violations'] });
    if (r.passes.length === 0) return ['axe ran no passing rules: the page was empty or axe did not load'];
    return r.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => `${v.id} (${v.impact}): ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(', ')}`);
  });
}

describe('phone first at 390 × 844, offline', () => {
  for (const mode of ['normal', 'field'] as const) {
    it(`${mode} look: the answer in the first screen, every page within 2.5 screens`, async () => {
      const page = app.session!.page;
      await setFieldMode(page, mode === 'field');
      const problems: string[] = [];
      for (const area of areas) {
        await open(page, area);
        const { height, answerBottom, visibleBottom } = await measure(page, area.answer);
        heights[mode][area.path] = height;
        if (height > MAX_HEIGHT) problems.push(`${area.path}: page ${height} px tall, above ${MAX_HEIGHT}`);
        if (area.answer) {
          if (answerBottom === null) problems.push(`${area.path}: no answer element ${area.answer}`);
          else if (answerBottom > SCREEN.height) problems.push(`${area.path}: answer ends at ${answerBottom.toFixed(0)} px, below the first screen`);
          else if (answerBottom > visibleBottom) problems.push(`${area.path}: answer ends at ${answerBottom.toFixed(0)} px, under the bottom bar (from ${visibleBottom.toFixed(0)} px)`);
        }
        if (mode === 'normal') {
          const fonts = await fontsDrawn(page);
          if (fonts.length > MAX_FONTS) problems.push(`${area.path}: text in ${fonts.length} fonts, above ${MAX_FONTS}: ${fonts.join('; ')}`);
        }
        await shoot(page, `phone-${mode}-${area.name}`);
        expect(await page.locator('body').textContent()).not.toMatch(/NaN/);
      }
      expect(problems).toEqual([]);
      expect(app.session!.pageErrors).toEqual([]);
      expect(app.session!.foreignRequests).toEqual([]);
    });
  }

  it('field mode: 56 px targets, results at 20 px or more, text at 7:1, no serious or critical axe finding', async () => {
    const page = app.session!.page;
    await setFieldMode(page, true);
    const problems: string[] = [];
    for (const area of areas) {
      await open(page, area);
      await measure(page); // disclosures closed, top of the page
      for (const t of await smallTargets(page)) problems.push(`${area.path}: small target ${t}`);
      const results = await smallResults(page);
      for (const r of results.small) problems.push(`${area.path}: small result ${r}`);
      const contrast = await lowContrast(page, 7);
      expect(contrast.checked, `${area.path}: no text was checked`).toBeGreaterThan(5);
      for (const c of contrast.low) problems.push(`${area.path}: ${c}`);
      for (const v of await axeSeriousOrCritical(page)) problems.push(`${area.path}: axe ${v}`);
    }
    expect(problems).toEqual([]);
    // The main screens do show results, so the size rule above did check something.
    await open(page, areas[1]);
    expect((await smallResults(page)).count).toBeGreaterThan(3);
  });

  it('field mode is kept per device across a reload, and the folded inputs open in place with focus inside', async () => {
    const page = app.session!.page;
    await setFieldMode(page, true);
    await page.reload();
    await expect.poll(() => page.evaluate(() => document.documentElement.hasAttribute('data-field-mode')), { timeout: 15_000 }).toBe(true);
    await page.goto(origin + '/bench');
    const toggle = page.locator('[data-testid="bench-fold"] .fold-toggle');
    await expect.poll(() => toggle.getAttribute('aria-expanded'), { timeout: 15_000 }).toBe('false');
    expect(await toggle.textContent()).toMatch(/m\/z .* change/);
    await toggle.click();
    await expect.poll(() => toggle.getAttribute('aria-expanded')).toBe('true');
    await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('bench-mz');
    // A bad value keeps the fields open with its message beside it.
    await page.locator('#bench-mz').fill('abc');
    await expect.poll(() => page.locator('.field-error').first().textContent()).toMatch(/m\/z/);
    await page.reload();
    await expect.poll(() => page.locator('[data-testid="bench-fold"] .fold-toggle').getAttribute('aria-expanded'), { timeout: 15_000 }).toBe('true');
    await page.locator('#bench-mz').fill('69, 219, 502');
    await setFieldMode(page, false);
    await page.reload();
    await expect.poll(() => page.evaluate(() => document.documentElement.hasAttribute('data-field-mode')), { timeout: 15_000 }).toBe(false);
  });
});

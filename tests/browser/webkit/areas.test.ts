// WebKit (the engine of iPhone and iPad browsers): every area renders with its heading and without the
// "could not be loaded" notice, the stability chart draws, and the instrument picker in the top bar is legible
// in both themes. The browser runs under the C locale, where navigator.language is "C", a tag Intl refuses.
import { describe, expect, it } from 'vitest';
import { waitFor, WebKitSession, webkitAppForFile } from './driver';

const app = webkitAppForFile(4510, 4560);
const { origin } = app;

const screens: [path: string, heading: RegExp][] = [
  ['/', /^Overview$/],
  ['/bench', /^Bench · expected voltages$/],
  ['/bench/vacuum', /^Bench · vacuum check$/],
  ['/stability', /^Stability · diagram$/],
  ['/stability/resolution', /^Stability · resolution planner$/],
  ['/peak', /^Peak · simulated shape and transmission$/],
  ['/diagnose', /^Diagnose$/],
  ['/visits', /^Visits$/],
  ['/instruments', /^Instruments$/],
  ['/safety', /^Safety & about$/],
];

async function pageState(s: WebKitSession): Promise<{ heading: string; failed: boolean; loading: boolean }> {
  return s.run(
    `const h = document.querySelector('main h1');
     const text = document.querySelector('main')?.textContent || '';
     return { heading: h ? h.textContent.trim() : '', failed: /could not be loaded/.test(text), loading: /^Loading /.test(text.trim()) };`,
  );
}

/** Pixels with any ink on the first canvas inside `selector` (-1: no canvas yet). */
function inkedPixels(s: WebKitSession, selector: string): Promise<number> {
  return s.run<number>(
    `const c = document.querySelector(arguments[0] + ' canvas');
     if (!c || !c.width || !c.height) return -1;
     const d = c.getContext('2d').getImageData(0, 0, c.width, c.height).data;
     let n = 0;
     for (let i = 3; i < d.length; i += 4) if (d[i] !== 0) n++;
     return n;`,
    selector,
  );
}

describe('WebKit: every area', () => {
  it('runs under a language tag that Intl refuses (navigator.language is "C")', async () => {
    const s = app.session!;
    await s.goto('about:blank');
    const probe = await s.run<{ language: string; refused: boolean }>(
      `let refused = false;
       try { new Intl.NumberFormat(navigator.language); } catch (e) { refused = e instanceof RangeError; }
       return { language: navigator.language, refused };`,
    );
    expect(probe).toEqual({ language: 'C', refused: true });
  });

  it.each(screens)('%s renders its heading and no "could not be loaded" notice', async (path, heading) => {
    const s = app.session!;
    await s.goto(origin + path);
    const state = await waitFor(`${path} to finish loading`, async () => {
      const st = await pageState(s);
      return st.failed || (st.heading && !st.loading) ? st : undefined;
    });
    expect(state.failed).toBe(false);
    expect(state.heading).toMatch(heading);
    await s.appReady();
    // Numbers on screen never read NaN or undefined.
    const text = await s.run<string>(`return document.querySelector('main').textContent;`);
    expect(text).not.toMatch(/\bNaN\b|\bundefined\b/);
  });

  it('draws the stability chart on a canvas', async () => {
    const s = app.session!;
    await s.goto(origin + '/stability');
    let n = -1;
    const inked = await waitFor('the stability chart to draw', async () => {
      n = await inkedPixels(s, '[data-testid="stability-chart"]');
      return n > 1000 ? n : false;
    }).catch(async (err) => {
      throw new Error(`${String(err)}; ${n} inked pixels; url ${await s.currentUrl()}; heading ${await s.run('return document.querySelector("main h1")?.textContent')}`);
    });
    expect(inked).toBeGreaterThan(1000);
    await s.screenshot('webkit-stability');
  });
});

/** WCAG 2.x contrast ratio of two CSS rgb()/rgba() colours (the second must be opaque). */
function contrast(fg: string, bg: string): number {
  const parse = (c: string) => {
    const m = c.match(/rgba?\(([^)]+)\)/);
    if (!m) throw new Error(`not an rgb colour: ${c}`);
    const [r, g, b, a = 1] = m[1].split(/[ ,/]+/).filter(Boolean).map(Number);
    return { rgb: [r, g, b], a };
  };
  const lum = (rgb: number[]) => {
    const [r, g, b] = rgb.map((v) => {
      const s = v / 255;
      return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * r + 0.7152 * g + 0.0722 * b;
  };
  const f = parse(fg);
  const b = parse(bg);
  if (b.a !== 1) throw new Error(`background ${bg} is not opaque: the field would show whatever the browser paints under it`);
  const L1 = lum(f.rgb);
  const L2 = lum(b.rgb);
  return (Math.max(L1, L2) + 0.05) / (Math.min(L1, L2) + 0.05);
}

async function pickerLooks(s: WebKitSession) {
  await waitFor('the instrument picker', () => s.run<boolean>(`return !!document.querySelector('.picker select option');`));
  return s.run<{ appearance: string; color: string; background: string; optionColor: string; optionBackground: string; dark: boolean }>(
    `const sel = document.querySelector('.picker select');
     const st = getComputedStyle(sel);
     const op = getComputedStyle(sel.querySelector('option'));
     return { appearance: st.getPropertyValue('appearance') || st.getPropertyValue('-webkit-appearance'), color: st.color,
       background: st.backgroundColor, optionColor: op.color, optionBackground: op.backgroundColor,
       dark: matchMedia('(prefers-color-scheme: dark)').matches };`,
  );
}

describe('WebKit: the instrument picker in the top bar', () => {
  // Contrast: WCAG 2.1, success criterion 1.4.3 (contrast minimum), 4.5:1 for body text.
  async function legiblePicker(s: WebKitSession, dark: boolean): Promise<void> {
    await s.goto(origin + '/');
    const looks = await pickerLooks(s);
    await s.screenshot(dark ? 'webkit-picker-dark' : 'webkit-picker-light');
    expect(looks.dark).toBe(dark);
    expect(looks.appearance).toBe('none');
    expect(contrast(looks.color, looks.background)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(looks.optionColor, looks.optionBackground)).toBeGreaterThanOrEqual(4.5);
  }

  it('is drawn by our CSS (not the native field) with legible text, light theme', async () => {
    await legiblePicker(app.session!, false);
  });

  it('the same in the dark theme', async () => {
    // One session per driver: end the light one, start MiniBrowser again in dark mode.
    await app.session?.close();
    app.session = null;
    app.session = await WebKitSession.open(app.driver!, { dark: true });
    await legiblePicker(app.session, true);
  });
});

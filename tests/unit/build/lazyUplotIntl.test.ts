// The build step that keeps uPlot from building Intl formatters when its module loads (scripts/lazyUplotIntl.ts),
// run on the uPlot this project installs: evaluating the transformed module builds no Intl formatter, and the
// formatter it builds on first use formats as before.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterEach, describe, expect, it } from 'vitest';
import { lazyIntl, lazyUplotIntl, UPLOT_MODULE } from '../../../scripts/lazyUplotIntl.mjs';

const uplotFile = createRequire(import.meta.url).resolve('uplot/dist/uPlot.esm.js');
const original = readFileSync(uplotFile, 'utf8');

describe('lazy Intl in uPlot', () => {
  const realIntl = { NumberFormat: Intl.NumberFormat, DateTimeFormat: Intl.DateTimeFormat };
  afterEach(() => {
    Intl.NumberFormat = realIntl.NumberFormat;
    Intl.DateTimeFormat = realIntl.DateTimeFormat;
  });

  function countIntl(): { built: string[] } {
    const log = { built: [] as string[] };
    const wrap = <T extends new (...a: never[]) => object>(name: string, C: T): T =>
      new Proxy(C, { construct: (target, args) => (log.built.push(name), Reflect.construct(target, args)), apply: (target, self, args) => (log.built.push(name), Reflect.apply(target as unknown as (...a: unknown[]) => unknown, self, args)) });
    Intl.NumberFormat = wrap('NumberFormat', realIntl.NumberFormat);
    Intl.DateTimeFormat = wrap('DateTimeFormat', realIntl.DateTimeFormat);
    return log;
  }

  async function evaluate(code: string): Promise<{ fmtNum: (v: number) => string }> {
    const dir = mkdtempSync(join(tmpdir(), 'uplot-'));
    try {
      const file = join(dir, 'uPlot.mjs');
      writeFileSync(file, code);
      return (await import(/* @vite-ignore */ pathToFileURL(file).href)).default;
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }

  it('the installed uPlot builds Intl formatters at load (the control: what the transform removes)', async () => {
    const log = countIntl();
    await evaluate(original);
    expect(log.built).toEqual(expect.arrayContaining(['NumberFormat', 'DateTimeFormat']));
  });

  it('transformed, it builds none at load and one NumberFormat on the first number it formats', async () => {
    const log = countIntl();
    const uPlot = await evaluate(lazyIntl(original));
    expect(log.built).toEqual([]);
    expect(uPlot.fmtNum(1234.5)).toBe(new realIntl.NumberFormat('en-US').format(1234.5));
    expect(uPlot.fmtNum(0.25)).toBe(new realIntl.NumberFormat('en-US').format(0.25));
    expect(log.built).toEqual(['NumberFormat']);
  });

  it('the build refuses a uPlot whose text it does not recognise, naming the line', () => {
    expect(() => lazyIntl(original.replace('const localTz', 'const localZone'))).toThrow(/localTz.*update scripts\/lazyUplotIntl\.mjs/);
  });

  it('the plugin applies to uPlot’s module only', () => {
    const plugin = lazyUplotIntl();
    const transform = plugin.transform as (code: string, id: string) => { code: string } | null;
    expect(UPLOT_MODULE.test(uplotFile)).toBe(true);
    expect(transform.call({}, 'const x = 1;', '/app/src/main.tsx')).toBeNull();
    expect(transform.call({}, original, uplotFile)!.code).not.toContain('const numFormatter = new Intl');
  });
});

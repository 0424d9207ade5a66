// @vitest-environment happy-dom
// Number and date formatting survive any language tag the device reports. Under the C locale WebKitGTK reports
// navigator.language === 'C'; `new Intl.NumberFormat('C')` throws RangeError (ECMA-402, 9.2.1 CanonicalizeLocaleList:
// a tag that is not a structurally valid BCP 47 language tag, IETF RFC 5646, is a RangeError).
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { afterEach, describe, expect, it } from 'vitest';
import { acceptedTag, deviceLocale, FALLBACK_LOCALE, formatDateTime, formatTime, guardNavigatorLanguage, numberFormat, safeLocale } from '../../../src/ui/locale';

const badTags = ['C', '', 'x-bogus_tag', 'en_US', 'C.UTF-8', ' '];

function reportLanguage(tag: string, languages: string[] = [tag]): void {
  Object.defineProperty(navigator, 'language', { configurable: true, get: () => tag });
  Object.defineProperty(navigator, 'languages', { configurable: true, get: () => languages });
}

afterEach(() => {
  // Own properties shadow the environment's getters: removing them restores the real navigator.
  delete (navigator as unknown as Record<string, unknown>).language;
  delete (navigator as unknown as Record<string, unknown>).languages;
});

let fresh = 0;
/** Evaluate uPlot's module again (its number format is built when the module loads). */
async function loadUplotAfresh(): Promise<{ fmtNum: (v: number) => string }> {
  const file = createRequire(import.meta.url).resolve('uplot/dist/uPlot.esm.js');
  const mod = (await import(/* @vite-ignore */ `${pathToFileURL(file).href}?fresh=${++fresh}`)) as { default: { fmtNum: (v: number) => string } };
  return mod.default;
}

describe('safeLocale', () => {
  it.each(badTags)('refuses %j and falls back to the default locale', (tag) => {
    expect(acceptedTag(tag)).toBe(false);
    expect(safeLocale(tag)).toBe(FALLBACK_LOCALE);
  });

  it('falls back for a missing or non-string tag', () => {
    expect(safeLocale(undefined)).toBe(FALLBACK_LOCALE);
    expect(safeLocale(null)).toBe(FALLBACK_LOCALE);
    expect(safeLocale(42)).toBe(FALLBACK_LOCALE);
  });

  it('keeps a well-formed tag', () => {
    expect(safeLocale('de-DE')).toBe('de-DE');
    expect(safeLocale('en-GB')).toBe('en-GB');
  });

  it('the bad tags really are refused by Intl (so the fallback is needed)', () => {
    for (const tag of ['C', '', 'x-bogus_tag']) expect(() => new Intl.NumberFormat(tag), tag).toThrow(RangeError);
  });
});

describe('formatting under a refused navigator.language', () => {
  it.each(badTags)('navigator.language = %j: numbers and dates still format', (tag) => {
    reportLanguage(tag);
    expect(navigator.language).toBe(tag);
    expect(deviceLocale()).toBe(FALLBACK_LOCALE);
    expect(numberFormat().format(1234.5)).toBe('1,234.5');
    expect(numberFormat({ maximumSignificantDigits: 3 }).format(0.0012345)).toBe('0.00123');
    const d = new Date(Date.UTC(2026, 2, 14, 9, 30));
    const when = formatDateTime(d, { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' });
    expect(when).toBe('Mar 14, 2026');
    expect(formatTime(d, { timeZone: 'UTC', hour: '2-digit', minute: '2-digit', hour12: false })).toBe('09:30');
  });

  it('a good navigator.language is used as given', () => {
    reportLanguage('de-DE');
    expect(deviceLocale()).toBe('de-DE');
    expect(numberFormat().format(1234.5)).toBe('1.234,5');
  });
});

describe('guardNavigatorLanguage (libraries that read navigator.language themselves)', () => {
  it('control: uPlot cannot load while navigator.language is "C"', async () => {
    reportLanguage('C');
    await expect(loadUplotAfresh()).rejects.toThrow(RangeError);
  });

  it.each(badTags)('navigator.language = %j: the guard replaces it, and uPlot loads and formats', async (tag) => {
    reportLanguage(tag, [tag]);
    expect(guardNavigatorLanguage()).toBe(true);
    expect(navigator.language).toBe(FALLBACK_LOCALE);
    expect(navigator.languages).toEqual([FALLBACK_LOCALE]);
    const uPlot = await loadUplotAfresh();
    expect(uPlot.fmtNum(1234.5)).toBe('1,234.5');
  });

  it('keeps the accepted entries of navigator.languages', () => {
    reportLanguage('C', ['C', 'fr-CA', 'x-bogus_tag', 'en-GB']);
    expect(guardNavigatorLanguage()).toBe(true);
    expect(navigator.language).toBe('fr-CA');
    expect(navigator.languages).toEqual(['fr-CA', 'en-GB']);
  });

  it('leaves a well-formed tag alone', () => {
    reportLanguage('pt-BR');
    expect(guardNavigatorLanguage()).toBe(false);
    expect(navigator.language).toBe('pt-BR');
  });
});

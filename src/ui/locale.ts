// The one place that turns the device's language into a locale for Intl. A device can report a tag that Intl
// refuses: a phone or desktop under the C locale gives navigator.language === 'C', and `new Intl.NumberFormat('C')`
// throws RangeError. Every locale-aware formatter goes through `deviceLocale()`, which falls back to a default.

/** Used when the device's language tag is missing or refused by Intl. */
export const FALLBACK_LOCALE = 'en-US';

const verdicts = new Map<string, boolean>();

/**
 * True when Intl accepts `tag` as a language tag (asked once per tag). Every Intl constructor refuses exactly the
 * tags that Intl.getCanonicalLocales refuses (both canonicalise the locale list first: ECMA-402, 9.2.1
 * CanonicalizeLocaleList), and that check is a syntax check: it does not load the browser's locale data, whose
 * first load is a long task on a phone (a formatter is built only where a screen needs one).
 */
export function acceptedTag(tag: unknown): tag is string {
  if (typeof tag !== 'string' || tag.trim() === '') return false;
  let ok = verdicts.get(tag);
  if (ok === undefined) {
    try {
      if (typeof Intl.getCanonicalLocales === 'function') Intl.getCanonicalLocales(tag);
      else new Intl.NumberFormat(tag);
      ok = true;
    } catch {
      // RangeError: not a well-formed BCP 47 language tag (e.g. 'C', 'x-bogus_tag').
      ok = false;
    }
    verdicts.set(tag, ok);
  }
  return ok;
}

/** `tag` when Intl accepts it, else FALLBACK_LOCALE (missing, not a string, empty or refused). */
export function safeLocale(tag: unknown): string {
  return acceptedTag(tag) ? tag : FALLBACK_LOCALE;
}

function reportedLanguage(): unknown {
  return typeof navigator === 'undefined' ? undefined : navigator.language;
}

/** The device's locale, safe to hand to any Intl constructor or toLocaleString. */
export function deviceLocale(): string {
  return safeLocale(reportedLanguage());
}

/** Intl.NumberFormat for the device's locale. */
export function numberFormat(options?: Intl.NumberFormatOptions): Intl.NumberFormat {
  return new Intl.NumberFormat(deviceLocale(), options);
}

/** Date and time as the device's locale writes them. */
export function formatDateTime(d: Date, options?: Intl.DateTimeFormatOptions): string {
  return d.toLocaleString(deviceLocale(), options);
}

/** Time of day as the device's locale writes it. */
export function formatTime(d: Date, options?: Intl.DateTimeFormatOptions): string {
  return d.toLocaleTimeString(deviceLocale(), options);
}

/**
 * Libraries read navigator.language themselves (uPlot builds `new Intl.NumberFormat(navigator.language)` when its
 * module loads). When the device's tag is refused, show them the fallback instead, so they cannot throw.
 * Returns true when the tag was replaced. Must run before such a library is evaluated (see localeGuard.ts).
 */
export function guardNavigatorLanguage(): boolean {
  if (typeof navigator === 'undefined' || acceptedTag(reportedLanguage())) return false;
  const kept = (Array.isArray(navigator.languages) ? navigator.languages : []).filter(acceptedTag);
  const languages = Object.freeze(kept.length ? kept : [FALLBACK_LOCALE]);
  try {
    Object.defineProperty(navigator, 'language', { configurable: true, get: () => languages[0] });
    Object.defineProperty(navigator, 'languages', { configurable: true, get: () => languages });
    return true;
  } catch {
    return false; // a frozen navigator: deviceLocale() still falls back for our own formatting
  }
}

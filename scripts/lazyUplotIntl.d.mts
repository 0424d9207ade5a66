// Types of lazyUplotIntl.mjs (plain JavaScript so vite.config.ts can import it by its file name).
import type { Plugin } from 'vite';

export const UPLOT_MODULE: RegExp;
/** uPlot's module text with its Intl formatters built on first use. Throws when an expected line is missing. */
export function lazyIntl(code: string): string;
export function lazyUplotIntl(): Plugin;

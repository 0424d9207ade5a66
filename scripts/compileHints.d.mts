// Types of compileHints.mjs (plain JavaScript so vite.config.ts can import it by its file name).
import type { Plugin } from 'vite';

export const COMPILE_HINT: string;
/** The chunk text with the compile hint as its first line (unchanged when it already has it). */
export function withCompileHint(code: string): string;
export function compileHints(chunkNames: RegExp): Plugin;

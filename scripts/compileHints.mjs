// Build step: V8 compiles a function the first time it is called, on the main thread, inside whatever task calls
// it. The chart library's first chart is mostly such first calls. A file that starts with the magic comment
// `//# allFunctionsCalledOnLoad` has all its functions compiled when the file is compiled instead (V8's explicit
// compile hints, Chromium 136 and later; other engines read a comment): for a module that is streamed, on a
// background thread. This plugin puts the comment at the top of the output chunks whose names match.

export const COMPILE_HINT = '//# allFunctionsCalledOnLoad';

/**
 * The chunk text with the compile hint as its first line (unchanged when it already has it).
 * @param {string} code
 * @returns {string}
 */
export function withCompileHint(code) {
  return code.startsWith(COMPILE_HINT) ? code : `${COMPILE_HINT}\n${code}`;
}

/**
 * @param {RegExp} chunkNames which output chunks (by their name before the hash) get the hint
 * @returns {import('vite').Plugin}
 */
export function compileHints(chunkNames) {
  return {
    name: 'rodside-compile-hints',
    apply: 'build',
    // The file names' hashes tell the hinted chunks from unhinted ones.
    augmentChunkHash(chunk) {
      return chunkNames.test(chunk.name) ? COMPILE_HINT : undefined;
    },
    // After minification (which drops comments), so the hint reaches the file.
    generateBundle(_options, bundle) {
      for (const chunk of Object.values(bundle)) {
        if (chunk.type === 'chunk' && chunkNames.test(chunk.name)) chunk.code = withCompileHint(chunk.code);
      }
    },
  };
}

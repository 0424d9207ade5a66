// The build step that marks the chart library's chunk for eager compilation (scripts/compileHints.mjs): the magic
// comment is V8's explicit compile hint, which must be the file's first line.
import { describe, expect, it } from 'vitest';
import { COMPILE_HINT, compileHints, withCompileHint } from '../../../scripts/compileHints.mjs';

type Hook = (...args: unknown[]) => unknown;

describe('compile hints', () => {
  it('puts the hint on the first line, once', () => {
    const code = 'var e=!0;export{e as default};';
    const once = withCompileHint(code);
    expect(once.split('\n')[0]).toBe('//# allFunctionsCalledOnLoad');
    expect(once.endsWith(code)).toBe(true);
    expect(withCompileHint(once)).toBe(once);
  });

  it('marks the chunks whose names match, after minification, and changes their file hash', () => {
    const plugin = compileHints(/^uPlot/);
    const bundle = {
      'assets/uPlot.esm-abc.js': { type: 'chunk', name: 'uPlot.esm', code: 'var a=1;' },
      'assets/index-def.js': { type: 'chunk', name: 'index', code: 'var b=2;' },
      'assets/index-xyz.css': { type: 'asset', name: 'uPlot.css', source: '.u{}' },
    };
    (plugin.generateBundle as unknown as Hook).call({}, {}, bundle, false);
    expect(bundle['assets/uPlot.esm-abc.js'].code).toBe(`${COMPILE_HINT}\nvar a=1;`);
    expect(bundle['assets/index-def.js'].code).toBe('var b=2;');
    expect(bundle['assets/index-xyz.css']).toEqual({ type: 'asset', name: 'uPlot.css', source: '.u{}' });
    const augment = plugin.augmentChunkHash as unknown as Hook;
    expect(augment({ name: 'uPlot.esm' })).toBe(COMPILE_HINT);
    expect(augment({ name: 'index' })).toBeUndefined();
  });
});

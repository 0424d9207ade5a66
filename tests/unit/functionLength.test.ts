// A house rule of DEVELOPERS.md, enforced: no function in the store or the records layer runs over 80 lines,
// so persistence stays thin and the pure record rules stay readable one piece at a time.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const root = resolve(__dirname, '../..');
const LIMIT = 80;

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? files(p) : /\.(ts|tsx)$/.test(name) ? [p] : [];
  });
}

/** Every function, arrow, method and accessor in a source text, with its first line and length in lines. */
export function functionSpans(name: string, text: string): { line: number; lines: number }[] {
  const sf = ts.createSourceFile(name, text, ts.ScriptTarget.Latest, true);
  const out: { line: number; lines: number }[] = [];
  const visit = (n: ts.Node): void => {
    if (ts.isFunctionLike(n) && 'body' in n && n.body) {
      const a = sf.getLineAndCharacterOfPosition(n.getStart(sf)).line;
      const b = sf.getLineAndCharacterOfPosition(n.getEnd()).line;
      out.push({ line: a + 1, lines: b - a + 1 });
    }
    ts.forEachChild(n, visit);
  };
  visit(sf);
  return out;
}

describe(`functions in src/store and src/records stay within ${LIMIT} lines`, () => {
  it('measures a function’s length (the checker itself)', () => {
    const body = Array.from({ length: 90 }, (_, i) => `  x += ${i};`).join('\n');
    const spans = functionSpans('x.ts', `export function long(): number {\n  let x = 0;\n${body}\n  return x;\n}\nconst short = () => 1;\n`);
    expect(spans).toEqual([{ line: 1, lines: 94 }, { line: 95, lines: 1 }]);
  });

  it('finds none longer', () => {
    const long: string[] = [];
    for (const dir of ['src/store', 'src/records']) {
      for (const file of files(join(root, dir))) {
        for (const s of functionSpans(file, readFileSync(file, 'utf8'))) {
          if (s.lines > LIMIT) long.push(`${relative(root, file)}:${s.line} is ${s.lines} lines`);
        }
      }
    }
    expect(long).toEqual([]);
  });
});

describe('store modules stay thin', () => {
  it('each store module is under 250 lines, and its index under 150', () => {
    const big: string[] = [];
    for (const file of files(join(root, 'src/store'))) {
      const lines = readFileSync(file, 'utf8').split('\n').length;
      const limit = file.endsWith(join('store', 'index.ts')) ? 150 : 250;
      if (lines >= limit) big.push(`${relative(root, file)} is ${lines} lines (limit ${limit})`);
    }
    expect(big).toEqual([]);
  });
});

// The layer rules of DEVELOPERS.md, enforced: every import in src is checked against the table there, so the
// rules in the guide and the rules the test applies are one and the same.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = resolve(__dirname, '../..');
const src = join(root, 'src');

/** The table between the layer-rules markers: layer → what it may import. */
function rules(): Map<string, Set<string>> {
  const guide = readFileSync(join(root, 'DEVELOPERS.md'), 'utf8');
  const block = /<!-- layer-rules:start -->([\s\S]*?)<!-- layer-rules:end -->/.exec(guide);
  if (!block) throw new Error('DEVELOPERS.md has no layer-rules table');
  const out = new Map<string, Set<string>>();
  for (const line of block[1].split('\n')) {
    const cells = line.split('|').map((c) => c.trim());
    if (cells.length < 4 || cells[1] === 'layer' || cells[1].startsWith('---')) continue;
    out.set(cells[1], new Set(cells[2].startsWith('(') ? [] : cells[2].split(',').map((x) => x.trim())));
  }
  return out;
}

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? files(p) : /\.(ts|tsx)$/.test(name) ? [p] : [];
  });
}

/** The layer of a file in src: its top folder, or "main" for the entry at the top. */
function layerOf(file: string): string {
  const parts = relative(src, file).split(sep);
  return parts.length === 1 ? 'main' : parts[0];
}

/** Every module a file names in import, export … from, import() and side-effect imports. */
function specifiers(text: string): string[] {
  const out: string[] = [];
  const re = /(?:^|[;\s])(?:import|export)\s+(?:type\s+)?(?:[^'";]*?\s+from\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/gm;
  for (let m = re.exec(text); m; m = re.exec(text)) out.push(m[1] ?? m[2]);
  return out;
}

const table = rules();

/** What an import reaches: one of our layers, or a package (by name). */
function target(file: string, spec: string): string {
  if (!spec.startsWith('.')) return spec.startsWith('@') ? spec.split('/').slice(0, 2).join('/') : spec.split('/')[0];
  const path = resolve(dirname(file), spec);
  if (!path.startsWith(src + sep)) return `outside src (${spec})`;
  // A folder (its index) or a file below it belongs to that folder's layer; a file at the top is the entry.
  const parts = relative(src, path).split(sep);
  return parts.length === 1 && !table.has(parts[0]) ? 'main' : parts[0];
}

describe('layers (DEVELOPERS.md table)', () => {
  it('the table names the layers of the rule ui → store/diagnose/worker → records/spectrum → engine', () => {
    expect([...table.keys()].sort()).toEqual(['diagnose', 'engine', 'main', 'records', 'spectrum', 'store', 'ui', 'worker']);
    expect([...table.get('engine')!]).toEqual([]);
    expect([...table.values()].filter((may) => may.has('ui')).length).toBe(1);
  });

  it('every import in src keeps to its layer’s row', () => {
    const wrong: string[] = [];
    const all = files(src);
    expect(all.length).toBeGreaterThan(50);
    for (const file of all) {
      const layer = layerOf(file);
      const may = table.get(layer);
      const where = relative(root, file);
      if (!may) {
        wrong.push(`${where}: folder "${layer}" has no row in the DEVELOPERS.md layer table`);
        continue;
      }
      for (const spec of specifiers(readFileSync(file, 'utf8'))) {
        const to = target(file, spec);
        const ours = table.has(to) || to.startsWith('outside src');
        if (ours && to !== layer && !may.has(to)) wrong.push(`${where}: ${layer} imports ${to} ("${spec}")`);
        if (to === 'idb' && !may.has('idb')) wrong.push(`${where}: ${layer} imports idb (only the store may)`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it('catches a layer reaching up or sideways (the checker itself)', () => {
    const fake = join(src, 'records', 'x.ts');
    expect(target(fake, '../store')).toBe('store');
    expect(table.get('records')!.has(target(fake, '../store'))).toBe(false);
    expect(target(join(src, 'diagnose', 'trees', 'x.ts'), '../../ui/format')).toBe('ui');
    expect(specifiers("import type { A } from '../a';\nexport * from \"./b\";\nconst m = import('../c');\nimport 'd';")).toEqual(['../a', './b', '../c', 'd']);
  });
});

// Prints the gzip size of every JS and CSS file the build produced, per chunk, and the totals.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { gzipSync } from 'node:zlib';

const root = 'dist';
const rows = [];
function walk(dir) {
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) walk(p);
    else if (/\.(js|css)$/.test(name)) {
      const buf = readFileSync(p);
      rows.push({ file: relative(root, p), raw: buf.length, gz: gzipSync(buf, { level: 9 }).length });
    }
  }
}
walk(root);
rows.sort((a, b) => b.gz - a.gz);
const kb = (n) => (n / 1024).toFixed(1).padStart(7) + ' kB';
console.log('\nSize report (gzip -9):');
console.log(`${'file'.padEnd(44)} ${'raw'.padStart(10)} ${'gzip'.padStart(10)}`);
for (const r of rows) console.log(`${r.file.padEnd(44)} ${kb(r.raw).padStart(10)} ${kb(r.gz).padStart(10)}`);
const sum = (ext) => rows.filter((r) => r.file.endsWith(ext) && r.file.startsWith('assets/')).reduce((s, r) => s + r.gz, 0);
console.log(`${'app JS total (assets/*.js)'.padEnd(44)} ${''.padStart(10)} ${kb(sum('.js')).padStart(10)}`);
console.log(`${'app CSS total (assets/*.css)'.padEnd(44)} ${''.padStart(10)} ${kb(sum('.css')).padStart(10)}`);

// Draws Rodside's app icons (our own design: four rod ends seen along the axis, with the ion path between them)
// and writes them as PNG files. Run once after changing the design: node scripts/make-icons.mjs
import { writeFileSync, mkdirSync } from 'node:fs';
import { deflateSync } from 'node:zlib';

const background = [0x1d, 0x3b, 0x3a]; // deep teal
const rod = [0xf2, 0xb1, 0x3c]; // amber
const beam = [0xf4, 0xf1, 0xea]; // paper

function crc32(buf) {
  let c, crc = 0xffffffff;
  for (let n = 0; n < buf.length; n++) {
    c = (crc ^ buf[n]) & 0xff;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    crc = (crc >>> 8) ^ c;
  }
  return (crc ^ 0xffffffff) >>> 0;
}

function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}

function png(size, pixel) {
  const raw = Buffer.alloc((size * 4 + 1) * size);
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0;
    for (let x = 0; x < size; x++) {
      const [r, g, b, a] = pixel(x, y);
      const o = y * (size * 4 + 1) + 1 + x * 4;
      raw[o] = r; raw[o + 1] = g; raw[o + 2] = b; raw[o + 3] = a;
    }
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; ihdr[9] = 6; ihdr[10] = 0; ihdr[11] = 0; ihdr[12] = 0;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Coverage of a pixel by a shape, by 4×4 supersampling (soft edges without a graphics library). */
function coverage(x, y, inside) {
  let n = 0;
  for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) if (inside(x + (i + 0.5) / 4, y + (j + 0.5) / 4)) n++;
  return n / 16;
}

function icon(size, { maskable }) {
  // Maskable icons keep the drawing inside the central 80 % safe zone.
  const scale = maskable ? 0.72 : 0.9;
  const c = size / 2;
  const rodR = size * 0.13 * scale;
  const offset = size * 0.27 * scale;
  const rods = [[c, c - offset], [c, c + offset], [c - offset, c], [c + offset, c]];
  const corner = maskable ? 0 : size * 0.2;
  return png(size, (x, y) => {
    const inBg = coverage(x, y, (px, py) => {
      if (!corner) return true;
      const dx = Math.max(corner - px, 0, px - (size - corner));
      const dy = Math.max(corner - py, 0, py - (size - corner));
      return dx * dx + dy * dy <= corner * corner;
    });
    const inRod = coverage(x, y, (px, py) => rods.some(([rx, ry]) => (px - rx) ** 2 + (py - ry) ** 2 <= rodR * rodR));
    // The beam: a small diamond on the axis (an ion between the rods).
    const d = size * 0.06 * scale;
    const inBeam = coverage(x, y, (px, py) => Math.abs(px - c) + Math.abs(py - c) <= d);
    const mix = (base, top, t) => base.map((v, i) => Math.round(v * (1 - t) + top[i] * t));
    let col = background;
    col = mix(col, rod, inRod);
    col = mix(col, beam, inBeam);
    return [...col, Math.round(255 * inBg)];
  });
}

mkdirSync('public/icons', { recursive: true });
writeFileSync('public/icons/icon-192.png', icon(192, { maskable: false }));
writeFileSync('public/icons/icon-512.png', icon(512, { maskable: false }));
writeFileSync('public/icons/icon-maskable-512.png', icon(512, { maskable: true }));
writeFileSync(
  'public/icons/icon.svg',
  `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><rect width="100" height="100" rx="20" fill="#1d3b3a"/>` +
    `<g fill="#f2b13c"><circle cx="50" cy="25.7" r="11.7"/><circle cx="50" cy="74.3" r="11.7"/><circle cx="25.7" cy="50" r="11.7"/><circle cx="74.3" cy="50" r="11.7"/></g>` +
    `<path d="M50 44.6 55.4 50 50 55.4 44.6 50z" fill="#f4f1ea"/></svg>\n`,
);
console.log('icons written to public/icons');

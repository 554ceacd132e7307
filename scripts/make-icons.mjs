// Renders the app's icons from app/icon.svg: public/favicon.ico (16, 32 and 48 px) and
// public/apple-touch-icon.png (180 px, square and opaque, as home screens round it themselves).
// Needs rsvg-convert (Debian: apt-get install librsvg2-bin). Run: node scripts/make-icons.mjs
import { execFileSync } from 'node:child_process';
import { Buffer } from 'node:buffer';
import { readFileSync, writeFileSync } from 'node:fs';

const svg = readFileSync('app/icon.svg', 'utf8');
const render = (source, size) =>
  execFileSync('rsvg-convert', ['-w', String(size), '-h', String(size)], { input: source });

// An ICO file may hold PNG images: a 6-byte header, a 16-byte entry per image, then the images.
function ico(pngs) {
  const header = Buffer.alloc(6);
  header.writeUInt16LE(0, 0);
  header.writeUInt16LE(1, 2); // 1 = icon
  header.writeUInt16LE(pngs.length, 4);
  let offset = 6 + 16 * pngs.length;
  const entries = pngs.map(({ size, data }) => {
    const e = Buffer.alloc(16);
    e.writeUInt8(size >= 256 ? 0 : size, 0);
    e.writeUInt8(size >= 256 ? 0 : size, 1);
    e.writeUInt16LE(1, 4); // colour planes
    e.writeUInt16LE(32, 6); // bits per pixel
    e.writeUInt32LE(data.length, 8);
    e.writeUInt32LE(offset, 12);
    offset += data.length;
    return e;
  });
  return Buffer.concat([header, ...entries, ...pngs.map((p) => p.data)]);
}

writeFileSync('public/favicon.ico', ico([16, 32, 48].map((size) => ({ size, data: render(svg, size) }))));
const square = svg.replace(/<rect [^>]*\/>/, '<rect width="32" height="32" fill="#16607a"/>');
writeFileSync('public/apple-touch-icon.png', render(square, 180));
console.log('Wrote public/favicon.ico and public/apple-touch-icon.png.');

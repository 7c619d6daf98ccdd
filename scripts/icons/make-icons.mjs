// Draws Tidewarden's icons from scripts/icons/mark.svg (our own drawing) into public/: the favicon (SVG and
// ICO), the app icons (192 and 512 px, the Apple touch icon) and the 1200 x 630 social image. Nothing is
// downloaded; sharp (already a dependency of Next) rasterises. Run: node scripts/icons/make-icons.mjs
import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';

const root = path.resolve(import.meta.dirname, '..', '..');
const out = (name) => path.join(root, 'public', name);
const mark = await fs.readFile(path.join(import.meta.dirname, 'mark.svg'));

const png = (size) => sharp(mark, { density: Math.ceil((72 * size) / 64) * 2 }).resize(size, size).png({ compressionLevel: 9 }).toBuffer();

await fs.mkdir(path.join(root, 'public'), { recursive: true });
await fs.writeFile(out('icon.svg'), mark);
await fs.writeFile(out('icon-192.png'), await png(192));
await fs.writeFile(out('icon-512.png'), await png(512));
// The touch icon is drawn edge to edge: iOS rounds the corners itself.
const square = Buffer.from(mark.toString().replace('rx="14"', 'rx="0"'));
await fs.writeFile(out('apple-touch-icon.png'), await sharp(square, { density: 432 }).resize(180, 180).png().toBuffer());

// favicon.ico: one 32 x 32 PNG inside an ICO directory (PNG entries are valid since Windows Vista).
const ico32 = await png(32);
const header = Buffer.alloc(6 + 16);
header.writeUInt16LE(0, 0); // reserved
header.writeUInt16LE(1, 2); // type: icon
header.writeUInt16LE(1, 4); // one image
header.writeUInt8(32, 6); // width
header.writeUInt8(32, 7); // height
header.writeUInt8(0, 8); // no palette
header.writeUInt8(0, 9);
header.writeUInt16LE(1, 10); // colour planes
header.writeUInt16LE(32, 12); // bits per pixel
header.writeUInt32LE(ico32.length, 14);
header.writeUInt32LE(22, 18); // image data offset
await fs.writeFile(out('favicon.ico'), Buffer.concat([header, ico32]));

// The social image: the mark, the name and what it is for, on the paper colour.
const social = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="630" viewBox="0 0 1200 630">
  <rect width="1200" height="630" fill="#f7f6f2"/>
  <rect x="0" y="560" width="1200" height="70" fill="#1a474b"/>
  <path d="M0 560 C100 520 200 520 300 560 S500 600 600 560 S800 520 900 560 S1100 600 1200 560" fill="#1a474b"/>
  <g transform="translate(110 150) scale(4.4)">${mark.toString().replace(/<\?xml[^>]*>|<svg[^>]*>|<\/svg>|<title>.*?<\/title>|<!--.*?-->/gs, '')}</g>
  <text x="440" y="270" font-family="Inter, DejaVu Sans, sans-serif" font-size="96" font-weight="700" fill="#1a474b">Tidewarden</text>
  <text x="444" y="340" font-family="Inter, DejaVu Sans, sans-serif" font-size="30" fill="#46505b">Sacrificial anodes for hulls and jetties:</text>
  <text x="444" y="388" font-family="Inter, DejaVu Sans, sans-serif" font-size="30" fill="#46505b">design, register, surveys and docking lists.</text>
</svg>`;
await fs.writeFile(out('og-image.png'), await sharp(Buffer.from(social)).png({ compressionLevel: 9 }).toBuffer());

// The web app manifest names the icons above.
const manifest = {
  name: 'Tidewarden',
  short_name: 'Tidewarden',
  description: 'Sacrificial-anode cathodic protection for ship hulls and harbour structures.',
  start_url: '/orgs',
  display: 'standalone',
  background_color: '#f7f6f2',
  theme_color: '#1a474b',
  icons: [
    { src: '/icon-192.png', sizes: '192x192', type: 'image/png' },
    { src: '/icon-512.png', sizes: '512x512', type: 'image/png' },
    { src: '/icon.svg', sizes: 'any', type: 'image/svg+xml' },
  ],
};
await fs.writeFile(out('manifest.webmanifest'), `${JSON.stringify(manifest, null, 2)}\n`);
console.log('icons written to public/');

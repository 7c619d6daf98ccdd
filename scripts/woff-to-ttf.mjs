// `node scripts/woff-to-ttf.mjs node_modules/@fontsource/inter/files/inter-latin-400-normal.woff ...`:
// writes the TrueType font each WOFF (1.0) file wraps into fonts/, as .ttf (how fonts/*.ttf were made). The PDFs use the .ttf copies: fontkit reads a
// WOFF's compressed glyph table again for every glyph it draws, which made the anode list slow.
// WOFF 1.0 (W3C, 2012) is the sfnt's tables, each zlib-compressed or stored: this undoes that.
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

function woffToSfnt(woff) {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 file');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const tag = woff.toString('latin1', at, at + 4);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? zlib.inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new Error(`table ${tag}: ${data.length} bytes, expected ${origLength}`);
    tables.push({ tag, checksum, data });
  }
  // The offset table's binary-search fields (OpenType spec, "Organization of an OpenType font").
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const headerLength = 12 + numTables * 16;
  const total = tables.reduce((sum, t) => sum + Math.ceil(t.data.length / 4) * 4, headerLength);
  const out = Buffer.alloc(total);
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerLength;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    out.write(t.tag, at, 'latin1');
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += Math.ceil(t.data.length / 4) * 4;
  });
  return out;
}

for (const file of process.argv.slice(2)) {
  const target = path.join('fonts', path.basename(file).replace(/\.woff$/, '.ttf'));
  fs.writeFileSync(target, woffToSfnt(fs.readFileSync(file)));
  process.stdout.write(`${target}\n`);
}

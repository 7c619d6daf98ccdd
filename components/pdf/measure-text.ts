/*
 * Text measurement for the planned PDFs (the anode list, the calculation note; see pdf-kit's
 * PagePlanner): how wide a text is set in Inter and how many lines it wraps to in a box. The
 * plans cut the documents into sheets from these estimates, so they are rounded up: a plan
 * must never run short of room.
 */

/** The body font size of the sheet, pt (pdf-kit's pdf.page fontSize). */
export const FONT = 8.5;
/** The line height of the page (pdf-kit's pdf.page lineHeight), a multiple of the font size. */
export const LINE_HEIGHT = 1.35;

// Advance widths of Inter (the widest of weights 400, 600 and 700) for ASCII 32-126, in 1/100 em.
const ASCII_WIDTHS = [
  29, 34, 56, 65, 66, 102, 68, 34, 38, 38, 56, 68, 34, 47, 34, 39, 68, 44, 63, 65, 68, 63, 65, 59, 66, 65, 34, 35, 68, 68, 68, 56, 102, 75, 67, 74, 73, 61, 60, 76, 75, 29, 59, 72, 57,
  94, 77, 78, 65, 78, 66, 66, 67, 75, 75, 104, 74, 74, 67, 38, 39, 38, 49, 48, 37, 59, 64, 59, 64, 60, 40, 64, 63, 28, 28, 59, 28, 92, 63, 62, 64, 64, 41, 57, 37, 63, 60, 86, 59,
  61, 58, 47, 38, 47, 68,
];
const OTHER_WIDTH = 105; // anything else (× – · ², Greek, CJK fallback): wider than any of those glyphs in Inter

const charWidth = (code: number, size: number) => ((code >= 32 && code <= 126 ? ASCII_WIDTHS[code - 32] : OTHER_WIDTH) / 100) * size * 1.03;

/** Width of a text in points at `size`, over-estimated by 3 % so plans never run short. */
export function textWidth(text: string, size = FONT): number {
  let w = 0;
  for (let i = 0; i < text.length; i++) w += charWidth(text.charCodeAt(i), size);
  return w;
}

/**
 * The lines a text takes in a box `width` wide: greedy word wrap, as react-pdf does (no
 * hyphenation); a word wider than the box is cut where it overflows.
 */
export function wrapLines(text: string, width: number, size = FONT): string[] {
  const lines: string[] = [];
  const space = textWidth(' ', size);
  for (const paragraph of text.split('\n')) {
    let line = '';
    let used = 0;
    for (const word of paragraph.split(' ')) {
      if (word === '') continue;
      const w = textWidth(word, size);
      if (line && used + space + w <= width) {
        line += ` ${word}`;
        used += space + w;
        continue;
      }
      if (line) lines.push(line);
      if (w <= width) {
        line = word;
        used = w;
        continue;
      }
      // Cut a word wider than the box.
      let piece = '';
      let pieceWidth = 0;
      for (const ch of word) {
        const cw = charWidth(ch.charCodeAt(0), size);
        if (piece && pieceWidth + cw > width) {
          lines.push(piece);
          piece = '';
          pieceWidth = 0;
        }
        piece += ch;
        pieceWidth += cw;
      }
      line = piece;
      used = pieceWidth;
    }
    lines.push(line);
  }
  return lines;
}

export const lineCount = (text: string, width: number, size = FONT) => wrapLines(text, width, size).length;

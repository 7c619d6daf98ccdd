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

/*
 * The advance widths of one weight, for text whose lines are written as planned (pdf-kit's drawn
 * tables): each glyph's width rounded up to 1/100 em, from fonts/inter-latin-<weight>-normal.ttf, ASCII
 * 32-126 and a few other characters the lists print. Kerning in Inter narrows far more pairs than it
 * widens, and a test measures the drawn lines with the fonts themselves.
 */
const WEIGHT_WIDTHS = {
  400: [
    29, 29, 47, 64, 65, 99, 65, 30, 37, 37, 51, 67, 29, 46, 29, 37, 64, 41, 61, 62, 65, 60, 63, 57, 62, 63, 29, 31, 67, 67, 67, 52, 97, 69, 66, 74, 73, 61, 60, 75, 75, 27, 58, 68, 57,
    91, 76, 77, 64, 77, 65, 65, 65, 75, 69, 99, 69, 68, 63, 37, 37, 37, 48, 46, 33, 57, 62, 58, 62, 59, 38, 62, 60, 25, 25, 55, 25, 88, 60, 60, 62, 62, 38, 53, 33, 60, 57, 82, 55,
    57, 56, 43, 34, 43, 67,
  ],
  600: [
    26, 33, 53, 65, 66, 101, 67, 33, 38, 38, 54, 68, 32, 47, 32, 38, 66, 43, 63, 64, 67, 62, 64, 58, 65, 64, 32, 33, 68, 68, 68, 55, 100, 73, 66, 74, 73, 61, 59, 75, 75, 28, 58, 71, 57,
    93, 76, 77, 65, 78, 66, 66, 67, 74, 73, 103, 72, 72, 66, 38, 38, 38, 49, 47, 36, 58, 63, 59, 63, 60, 39, 63, 62, 27, 27, 57, 27, 91, 62, 61, 63, 63, 40, 55, 36, 62, 59, 84, 57,
    59, 57, 46, 36, 46, 68,
  ],
} as const;
const WEIGHT_OTHER: Record<TextWeight, Record<string, number>> = {
  400: { '×': 67, '–': 50, '·': 29, '²': 45, '°': 46, Ø: 77, ø: 60, '±': 67, µ: 59, '’': 27, '‘': 27, '“': 45, '”': 45, '…': 87, '—': 100 },
  600: { '×': 68, '–': 50, '·': 32, '²': 46, '°': 46, Ø: 77, ø: 61, '±': 68, µ: 62, '’': 30, '‘': 30, '“': 51, '”': 51, '…': 96, '—': 100 },
};
/** A weight measured with its own widths; without one, the widest of 400, 600 and 700 plus 3 % (laid-out text). */
export type TextWeight = keyof typeof WEIGHT_WIDTHS;

function charWidth(code: number, size: number, weight?: TextWeight): number {
  if (!weight) return ((code >= 32 && code <= 126 ? ASCII_WIDTHS[code - 32] : OTHER_WIDTH) / 100) * size * 1.03;
  const units = code >= 32 && code <= 126 ? WEIGHT_WIDTHS[weight][code - 32] : (WEIGHT_OTHER[weight][String.fromCharCode(code)] ?? OTHER_WIDTH);
  return (units / 100) * size * 1.01;
}

/** Width of a text in points at `size`: over-estimated by 3 % so plans never run short, or by 1 % for a weight of its own. */
export function textWidth(text: string, size = FONT, weight?: TextWeight): number {
  let w = 0;
  for (let i = 0; i < text.length; i++) w += charWidth(text.charCodeAt(i), size, weight);
  return w;
}

/**
 * The lines a text takes in a box `width` wide: greedy word wrap, as react-pdf does (no
 * hyphenation); a word wider than the box is cut where it overflows.
 */
export function wrapLines(text: string, width: number, size = FONT, weight?: TextWeight): string[] {
  const lines: string[] = [];
  const space = textWidth(' ', size, weight);
  for (const paragraph of text.split('\n')) {
    let line = '';
    let used = 0;
    for (const word of paragraph.split(' ')) {
      if (word === '') continue;
      const w = textWidth(word, size, weight);
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
        const cw = charWidth(ch.charCodeAt(0), size, weight);
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

export const lineCount = (text: string, width: number, size = FONT, weight?: TextWeight) => wrapLines(text, width, size, weight).length;

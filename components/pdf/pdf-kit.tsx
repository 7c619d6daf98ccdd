import path from 'node:path';
import { Font, StyleSheet, Text, View } from '@react-pdf/renderer';
import { CAUTION_SENTENCE } from '@/lib/words/caution';

// Inter ships in fonts/ (woff; react-pdf does not read woff2). Registered once per process.
let registered = false;
export function registerPdfFonts() {
  if (registered) return;
  const file = (w: number) => path.join(process.cwd(), 'fonts', `inter-latin-${w}-normal.woff`);
  const greek = (w: number) => path.join(process.cwd(), 'fonts', `inter-greek-${w}-normal.woff`);
  Font.register({ family: 'Inter', fonts: [{ src: file(400), fontWeight: 400 }, { src: file(600), fontWeight: 600 }, { src: file(700), fontWeight: 700 }] });
  // Greek letters (ρ, ε, π, Ω) come from Inter's Greek subset as a fallback family.
  Font.register({ family: 'InterGreek', fonts: [{ src: greek(400), fontWeight: 400 }, { src: greek(600), fontWeight: 600 }, { src: greek(700), fontWeight: 700 }] });
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

export const pdf = StyleSheet.create({
  page: { fontFamily: ['Inter', 'InterGreek'] as unknown as string, fontSize: 8.5, color: '#1c232b', paddingTop: 36, paddingBottom: 48, paddingHorizontal: 36, lineHeight: 1.35 },
  h1: { fontSize: 15, fontWeight: 700, color: '#1a474b', lineHeight: 1.25, marginBottom: 3 },
  h2: { fontSize: 10.5, fontWeight: 600, color: '#1a474b', marginTop: 12, marginBottom: 4, borderBottomWidth: 0.6, borderBottomColor: '#b9b3a7', paddingBottom: 2 },
  small: { fontSize: 7.5, color: '#46505b' },
  row: { flexDirection: 'row', borderBottomWidth: 0.4, borderBottomColor: '#d9d5cc', paddingVertical: 2 },
  headRow: { flexDirection: 'row', borderBottomWidth: 0.8, borderBottomColor: '#7b8590', paddingVertical: 2, fontWeight: 600 },
  caution: { marginTop: 10, padding: 6, backgroundColor: '#f4ead7', color: '#7a5718', fontSize: 8 },
  warning: { padding: 4, marginBottom: 3, backgroundColor: '#faefd6', fontSize: 8 },
  footer: { position: 'absolute', bottom: 20, left: 36, right: 36, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7, color: '#7b8590' },
});

export interface Column {
  label: string;
  width: number;
  align?: 'left' | 'right';
}

/** A plain table: header row and data rows, numbers right-aligned. */
export function PdfTable({ columns, rows, bold }: { columns: Column[]; rows: (string | number)[][]; bold?: number[] }) {
  return (
    <View>
      <View style={pdf.headRow} fixed>
        {columns.map((c, i) => (
          <Text key={i} style={{ width: `${c.width}%`, textAlign: c.align ?? 'left', paddingRight: 3 }}>
            {c.label}
          </Text>
        ))}
      </View>
      {rows.map((row, r) => (
        <View key={r} style={[pdf.row, bold?.includes(r) ? { fontWeight: 600 } : {}]} wrap={false}>
          {row.map((cell, i) => (
            <Text key={i} style={{ width: `${columns[i].width}%`, textAlign: columns[i].align ?? 'left', paddingRight: 3 }}>
              {String(cell)}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

export const CAUTION_TEXT = `Caution. ${CAUTION_SENTENCE} Tidewarden does not replace that review.`;

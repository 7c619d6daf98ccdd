import { Ellipse, Line, Path, Rect, StyleSheet, Svg, Text, View } from '@react-pdf/renderer';
import type { AssetDrawing } from '@/lib/drawings/asset-drawing';
import type { DrawingView, Shape, ShapeRole } from '@/lib/drawings/shapes';
import { ROLE_STYLES } from '@/components/drawings/drawing-svg';
import { pdf } from './pdf-kit';

/*
 * The asset's drawing on paper: the same shapes as on the page (lib/drawings), drawn with react-pdf. Patterns are
 * not available in react-pdf's SVG, so each pattern prints as its own grey; the fill levels and the words are the
 * same as on screen. Sized for one sheet (a planned sheet does not wrap): the list below the drawing is held to
 * MAX_ROWS groups and says how many more there are.
 */

export const MAX_ROWS = 12;

/** Pattern fills of the page as plain greys for paper. */
const PATTERN_GREYS: Record<string, string> = { dots: '#e3e3e3', hatch: '#f0f0f0', cross: '#cfcfcf' };

function paint(role: ShapeRole) {
  const s = ROLE_STYLES[role];
  const fill = s.fill?.startsWith('pattern:') ? PATTERN_GREYS[s.fill.slice(8)] : (s.fill ?? 'none');
  return { fill, stroke: s.stroke ?? 'none', strokeWidth: s.strokeWidth, ...(s.strokeDasharray ? { strokeDasharray: s.strokeDasharray } : {}) };
}

function PdfShape({ shape }: { shape: Shape }) {
  switch (shape.kind) {
    case 'rect':
      return <Rect x={shape.x} y={shape.y} width={shape.w} height={shape.h} {...paint(shape.role)} />;
    case 'path':
      return <Path d={shape.d} {...paint(shape.role)} />;
    case 'ellipse':
      return <Ellipse cx={shape.cx} cy={shape.cy} rx={shape.rx} ry={shape.ry} {...paint(shape.role)} />;
    case 'line':
      return <Line x1={shape.x1} y1={shape.y1} x2={shape.x2} y2={shape.y2} {...paint(shape.role)} />;
    case 'text': {
      const s = ROLE_STYLES[shape.role];
      return (
        <Text x={shape.x} y={shape.y} textAnchor={shape.anchor} fill={s.fill} style={{ fontSize: s.fontSize, fontFamily: 'Inter', fontWeight: s.fontWeight ?? 400 } as never}>
          {shape.text}
        </Text>
      );
    }
  }
}

export function PdfDrawingView({ view, width }: { view: DrawingView; width: number }) {
  const height = Math.round((view.height * width) / view.width);
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${view.width} ${view.height}`}>
      {view.shapes.map((shape, i) => (
        <PdfShape key={i} shape={shape} />
      ))}
      {view.groups.flatMap((g) => g.shapes).map((shape, i) => (
        <PdfShape key={`g${i}`} shape={shape} />
      ))}
    </Svg>
  );
}

const s = StyleSheet.create({
  keyRow: { flexDirection: 'row', flexWrap: 'wrap', marginTop: 4 },
  keyItem: { flexDirection: 'row', alignItems: 'center', marginRight: 10, marginBottom: 2, fontSize: 7.5 },
  note: { fontSize: 7.5, color: '#46505b', marginTop: 2 },
  cell: { paddingRight: 4 },
});

const COLS = [
  { head: 'Group', share: 0.27 },
  { head: 'Where', share: 0.43 },
  { head: 'Anodes', share: 0.12 },
  { head: 'Left', share: 0.18 },
];

/**
 * The drawing, its key and notes on the left; on the right the groups it shows in words (position, count, what is
 * left), so the sheet reads without the drawing too. For a landscape sheet of `width` points.
 */
export function PdfAssetDrawing({ drawing, width, heading, subtitle, layout = 'landscape' }: { drawing: AssetDrawing; width: number; heading: string; subtitle?: string; layout?: 'landscape' | 'portrait' }) {
  const shown = drawing.rows.slice(0, MAX_ROWS);
  // Landscape: the drawing on the left, the list on the right; portrait: the list under the drawing.
  const side = layout === 'landscape';
  const left = side ? Math.round(width * 0.6) : width;
  const right = side ? width - left - 14 : width;
  return (
    <View>
      <Text style={pdf.h2}>{heading}</Text>
      {subtitle ? <Text style={s.note}>{subtitle}</Text> : null}
      <View style={{ flexDirection: side ? 'row' : 'column', marginTop: 4 }}>
        <View style={{ width: left, marginRight: side ? 14 : 0, marginBottom: side ? 0 : 8 }}>
          {drawing.views.map((view) => (
            <PdfDrawingView key={view.id} view={view} width={left} />
          ))}
          <View style={s.keyRow}>
            {drawing.key.map((k) => (
              <View key={k.role} style={s.keyItem}>
                <Svg width={16} height={9} viewBox="0 0 22 12">
                  {k.role === 'anode' ? (
                    <>
                      <Rect x={6} y={5} width={9} height={4} {...paint('anode-left')} />
                      <Rect x={6} y={1} width={9} height={8} {...paint('anode')} />
                    </>
                  ) : k.role === 'anode-unknown' ? (
                    <>
                      <Rect x={6} y={1} width={9} height={8} {...paint('anode-unknown')} />
                      <PdfShape shape={{ kind: 'text', role: 'anode-unknown-mark', x: 10.5, y: 7.3, text: '?', anchor: 'middle' }} />
                    </>
                  ) : k.role === 'reading' ? (
                    <Path d="M11 1l5 5l-5 5l-5 -5z" {...paint('reading')} />
                  ) : (
                    <Rect x={1} y={1} width={20} height={10} {...paint(k.role)} />
                  )}
                </Svg>
                <Text> {k.label}</Text>
              </View>
            ))}
          </View>
          {drawing.notes.map((n) => (
            <Text key={n} style={s.note}>{n}</Text>
          ))}
        </View>
        <View style={{ width: right }}>
          <View style={pdf.headRow}>
            {COLS.map((c) => (
              <Text key={c.head} style={[s.cell, { width: right * c.share }]}>{c.head}</Text>
            ))}
          </View>
          {shown.map((r) => (
            <View key={r.id} style={pdf.row} wrap={false}>
              <Text style={[s.cell, { width: right * COLS[0]!.share }]}>{r.label}</Text>
              <Text style={[s.cell, { width: right * COLS[1]!.share }]}>{r.where}{r.note ? `; ${r.note}` : ''}{r.drawn ? '' : ' (not on the drawing)'}</Text>
              <Text style={[s.cell, { width: right * COLS[2]!.share }]}>{r.count}</Text>
              <Text style={[s.cell, { width: right * COLS[3]!.share }]}>{r.remaining}</Text>
            </View>
          ))}
          {drawing.rows.length > shown.length ? <Text style={s.note}>and {drawing.rows.length - shown.length} more groups, with their positions in the list.</Text> : null}
        </View>
      </View>
    </View>
  );
}

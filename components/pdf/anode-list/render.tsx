import type { ReactNode } from 'react';
import { Document, StyleSheet, Text, View } from '@react-pdf/renderer';
import { format } from 'date-fns';
import type { AnodeList } from '@/lib/anode-list/build-anode-list';
import type { AssetDrawing } from '@/lib/drawings/asset-drawing';
import { PdfAssetDrawing } from '../drawing-sheet';
import { CAUTION_TEXT, DrawnRows, PlannedSheet, SheetRow, pdf, sheetArea, type DrawnRow } from '../pdf-kit';
import { formatDateOnly } from '@/lib/dates/date-only';
import { DIMENSIONS_KEY } from '@/lib/labels/anode-list';
import {
  assetRows,
  assetTitle,
  CELL_PAD,
  colWidth,
  COLUMNS,
  CONTENT_WIDTH,
  dockingRows,
  DRAWN_COLUMNS,
  planAnodeListPages,
  RULE,
  referenceLine,
  SIGNATURE_HEADS,
  SIGNATURE_SHARES,
  signatureRows,
  TITLE_LEFT_SHARE,
  titleLine,
  type PlanItem,
  type TableKind,
} from './layout';

/*
 * The react-pdf components of the dry-dock anode list. They draw the sheets layout.ts plans;
 * the heights the plan assumes (its `H`) follow the styles here, so change them together. The
 * column heads and rows of the tables are drawn as planned, a run of them at a time
 * (pdf-kit's DrawnRows: why there); the rest is laid out by react-pdf.
 */

// Number columns use tabular figures so right-aligned digits line up (Inter's tnum also widens
// hyphens, which is why it is not set for the whole page).
const NUMBER_FEATURES = { calt: false, tnum: true };
// Styles made once: react-pdf resolves every style object it meets, so shared objects are cheaper.
const CELL_STYLES = Object.fromEntries(
  (Object.keys(COLUMNS) as TableKind[]).map((kind) => [
    kind,
    COLUMNS[kind].map(
      (c) =>
        StyleSheet.create({
          s: c.right
            ? { width: colWidth(c), textAlign: 'right', paddingRight: CELL_PAD, fontFeatureSettings: NUMBER_FEATURES }
            : { width: colWidth(c), textAlign: 'left', paddingRight: CELL_PAD, paddingLeft: c.gap ? CELL_PAD * 2 : 0 },
        }).s,
    ),
  ]),
) as Record<TableKind, ReturnType<typeof StyleSheet.create>[string][]>;

const s = StyleSheet.create({
  row: { flexDirection: 'row', borderBottomWidth: RULE.row.width, borderBottomColor: RULE.row.color, paddingVertical: 2 },
  headRow: { flexDirection: 'row', borderBottomWidth: RULE.strong.width, borderBottomColor: RULE.strong.color, paddingVertical: 2, fontWeight: 600 },
  zoneTitle: { fontWeight: 600, fontSize: 9.5, marginTop: 6, marginBottom: 2 },
  continued: { fontWeight: 400, color: '#46505b' },
  warning: { ...pdf.warning },
  firstWarning: { ...pdf.warning, marginTop: 8 },
});

const when = (d: Date | null) => (d ? format(d, 'd MMM yyyy') : '');

// ---------- blocks ----------
function Row({ table, cells, rowStyle }: { table: TableKind; cells: string[]; rowStyle: typeof s.row | typeof s.headRow }) {
  return <SheetRow cells={cells} cellStyles={CELL_STYLES[table]} style={rowStyle} />;
}

function SmallTable({ table, title, rows }: { table: TableKind; title: string; rows: string[][] }) {
  return (
    <View>
      <Text style={pdf.h2}>{title}</Text>
      <Row table={table} cells={COLUMNS[table].map((c) => c.label)} rowStyle={s.headRow} />
      {rows.map((cells, i) => (
        <Row key={i} table={table} cells={cells} rowStyle={s.row} />
      ))}
    </View>
  );
}

function Title({ list }: { list: AnodeList }) {
  const d = list.docking;
  return (
    <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' }}>
      <View style={{ width: CONTENT_WIDTH * TITLE_LEFT_SHARE }}>
        <Text style={pdf.small}>{list.organisation.name}</Text>
        <Text style={pdf.h1}>{list.words.title}</Text>
        <Text>{titleLine(list)}</Text>
      </View>
      <View style={{ width: CONTENT_WIDTH * (1 - TITLE_LEFT_SHARE), alignItems: 'flex-end' }}>
        <Text style={{ fontWeight: 600 }}>{`Revision ${list.revision.number}`}</Text>
        {d.reference ? <Text style={[pdf.small, { textAlign: 'right' }]}>{referenceLine(list)}</Text> : null}
      </View>
    </View>
  );
}

function Signatures({ list }: { list: AnodeList }) {
  const cell = (share: number) => ({ width: share * CONTENT_WIDTH, paddingRight: 8 });
  const line = { borderBottomWidth: 0.6, borderBottomColor: '#7b8590' };
  return (
    <View wrap={false}>
      <Text style={pdf.h2}>{`Revision ${list.revision.number} and signatures`}</Text>
      <View style={s.headRow}>
        {SIGNATURE_HEADS.map((head, i) => (
          <Text key={head} style={cell(SIGNATURE_SHARES[i])}>
            {head}
          </Text>
        ))}
      </View>
      {signatureRows(list, when).map(([step, ...filled]) => (
        <View key={step} style={{ flexDirection: 'row', alignItems: 'flex-end', paddingTop: 10, paddingBottom: 2 }}>
          <Text style={{ ...cell(SIGNATURE_SHARES[0]), fontWeight: 600 }}>{step}</Text>
          {[...filled, ''].map((text, i) => (
            <View key={i} style={cell(SIGNATURE_SHARES[i + 1])}>
              <Text style={line}>{text || ' '}</Text>
            </View>
          ))}
        </View>
      ))}
      <Text style={pdf.caution}>{CAUTION_TEXT}</Text>
    </View>
  );
}

function PlanItemView({ item, list }: { item: PlanItem; list: AnodeList }) {
  switch (item.kind) {
    case 'title':
      return <Title list={list} />;
    case 'header-tables':
      return (
        <View style={{ flexDirection: 'row', justifyContent: 'space-between' }}>
          <SmallTable table="asset" title={assetTitle(list)} rows={assetRows(list)} />
          <SmallTable table="docking" title="Docking" rows={dockingRows(list)} />
        </View>
      );
    case 'warning':
      return <Text style={item.first ? s.firstWarning : s.warning}>{item.text}</Text>;
    case 'section':
      return <Text style={pdf.h2}>{item.title}</Text>;
    case 'zone-title':
      return (
        <View>
          {item.withSection ? <Text style={pdf.h2}>Anodes to fit, by zone</Text> : null}
          <Text style={s.zoneTitle}>
            {item.title}
            {item.continued ? <Text style={s.continued}> (continued)</Text> : null}
          </Text>
        </View>
      );
    case 'head':
    case 'row':
      // Drawn in runs by SheetItems; never reached.
      return null;
    case 'empty':
      return <Text>{list.words.empty}</Text>;
    case 'key':
      return <Text style={[pdf.small, { marginTop: 3 }]}>{DIMENSIONS_KEY}</Text>;
    case 'notes':
      return (
        <View wrap={false}>
          <Text style={pdf.h2}>Fitting notes</Text>
          {list.fittingNotes.map((note, i) => (
            <View key={i} style={{ flexDirection: 'row', marginBottom: 2 }}>
              <Text style={{ width: 14 }}>{`${i + 1}.`}</Text>
              <Text style={{ flex: 1 }}>{note}</Text>
            </View>
          ))}
        </View>
      );
    case 'signatures':
      return <Signatures list={list} />;
  }
}

/** A table's column heads and rows as a drawn row. */
const drawnRow = (item: Extract<PlanItem, { kind: 'head' | 'row' }>): DrawnRow => {
  const strong = item.kind === 'head' || item.total;
  return { lines: item.lines, height: item.height, strong, rule: strong ? RULE.strong : RULE.row };
};

/** A sheet's items in order, each run of heads and rows of one table drawn as one block. */
function SheetItems({ items, list }: { items: PlanItem[]; list: AnodeList }) {
  const blocks: ReactNode[] = [];
  for (let i = 0; i < items.length; ) {
    const item = items[i];
    if (item.kind !== 'head' && item.kind !== 'row') {
      blocks.push(<PlanItemView key={i} item={item} list={list} />);
      i++;
      continue;
    }
    const rows: DrawnRow[] = [];
    const start = i;
    for (let next = items[i]; next && (next.kind === 'head' || next.kind === 'row') && next.table === item.table; next = items[++i]) rows.push(drawnRow(next));
    blocks.push(<DrawnRows key={start} width={CONTENT_WIDTH} columns={DRAWN_COLUMNS[item.table]} rows={rows} />);
  }
  return <>{blocks}</>;
}

// Inter's contextual alternates (calt) change nothing in these texts but took about a fifth of
// the text-shaping time in the profile of a 300-line list: off for the whole document.
const NO_CALT = StyleSheet.create({ p: { fontFeatureSettings: { calt: false } } }).p;

/**
 * The dry-dock anode list: per zone what to fit, totals by model for ordering, fitting notes,
 * signatures and cautions, one <Page> per planned sheet with "page N of M" written in.
 * `pagination="checked"` lets every sheet wrap instead, so a test can compare react-pdf's page
 * count with the plan (the numbers printed are still the plan's).
 */
export function AnodeListDocument({ list, pagination = 'planned', drawing = null }: { list: AnodeList; pagination?: 'planned' | 'checked'; drawing?: AssetDrawing | null }) {
  const d = list.docking;
  const footer = `${list.organisation.name} · ${list.asset.name} · ${list.words.title}, ${list.words.occasionTitle.toLowerCase()} from ${formatDateOnly(d.plannedStart)} · revision ${list.revision.number}`;
  const printed = `Printed ${format(list.printedAt, 'd MMM yyyy HH:mm')} by ${list.printedBy}`;
  const plan = planAnodeListPages(list);
  // Should an estimate ever exceed a sheet, let react-pdf continue it rather than cut text off.
  const wrap = pagination === 'checked' || !plan.fits;
  // The drawing of where the anodes go, on a sheet of its own after the list.
  const pages = plan.pages.length + (drawing ? 1 : 0);
  return (
    <Document title={`${list.words.title}: ${list.asset.name}, ${formatDateOnly(d.plannedStart)}, revision ${list.revision.number}`} author="Tidewarden" subject={`Sacrificial anodes to order and fit at a ${list.words.occasionTitle.toLowerCase()}`}>
      {plan.pages.map((items, p) => (
        <PlannedSheet key={p} orientation="landscape" style={NO_CALT} wrap={wrap} footer={{ left: footer, right: printed, page: p + 1, pages }}>
          <SheetItems items={items} list={list} />
        </PlannedSheet>
      ))}
      {drawing ? (
        <PlannedSheet orientation="landscape" style={NO_CALT} wrap={wrap} footer={{ left: footer, right: printed, page: pages, pages }}>
          <PdfAssetDrawing drawing={drawing} width={sheetArea('landscape').width} heading={`Where the anodes go: ${list.asset.name}`} subtitle={`The groups on this list at their positions, each filled to the mass the forecast leaves at the ${list.words.occasionTitle.toLowerCase()} ("Left").`} />
        </PlannedSheet>
      ) : null}
    </Document>
  );
}

import type { ComponentProps } from 'react';
import { Document, Text, View } from '@react-pdf/renderer';
import { PlannedSheet, SheetRow, pdf, sheetArea } from '../pdf-kit';
import type { AssetDrawing } from '@/lib/drawings/asset-drawing';
import { PdfAssetDrawing } from '../drawing-sheet';
import { CELL_PAD, colWidth, COLUMNS, CONTENT_WIDTH, planCalculationNote, SIGNATURE_GAP, TEXT_STYLES, TITLE_LEFT_SHARE, type NoteTable, type PlanItem } from './layout';
import { footerLeft, footerRight, NOTE_TITLE, revisionLine, titleLine, type CalculationNoteData } from './note-data';

/*
 * The react-pdf components of the calculation note. They draw the sheets layout.ts plans; the
 * heights the plan assumes follow the styles here and in pdf-kit, so change them together.
 */

// Cell styles made once per table: react-pdf resolves every style object it meets.
const CELL_STYLES = Object.fromEntries(
  (Object.keys(COLUMNS) as NoteTable[]).map((table) => [
    table,
    COLUMNS[table].map((c) => ({ width: colWidth(c), textAlign: c.right ? ('right' as const) : ('left' as const), paddingRight: CELL_PAD, paddingLeft: c.gap ? CELL_PAD : 0 })),
  ]),
) as Record<NoteTable, { width: number; textAlign: 'left' | 'right'; paddingRight: number; paddingLeft: number }[]>;
const BOLD_ROW = [pdf.row, { fontWeight: 600 }];
const SIGNATURE_ROW = [pdf.row, { paddingTop: 2 + SIGNATURE_GAP }];

function Row({ table, cells, style }: { table: NoteTable; cells: string[]; style: ComponentProps<typeof View>['style'] }) {
  return <SheetRow cells={cells} cellStyles={CELL_STYLES[table]} style={style} />;
}

function Title({ data }: { data: CalculationNoteData }) {
  const right = { textAlign: 'right' as const };
  return (
    <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' }}>
      <View style={{ width: CONTENT_WIDTH * TITLE_LEFT_SHARE }}>
        <Text style={pdf.small}>{data.organisation}</Text>
        <Text style={pdf.h1}>{NOTE_TITLE}</Text>
        <Text>{titleLine(data)}</Text>
      </View>
      <View style={{ width: CONTENT_WIDTH * (1 - TITLE_LEFT_SHARE) }}>
        <Text style={[{ fontWeight: 600 }, right]}>{revisionLine(data)}</Text>
        {data.design.basedOnRevision ? <Text style={[pdf.small, right]}>{`from revision ${data.design.basedOnRevision}`}</Text> : null}
        <Text style={[pdf.small, right]}>{`Tidewarden ${data.design.appVersion}`}</Text>
      </View>
    </View>
  );
}

function PlanItemView({ item, data }: { item: PlanItem; data: CalculationNoteData }) {
  switch (item.kind) {
    case 'title':
      return <Title data={data} />;
    case 'heading':
      return <Text style={pdf.h2}>{item.text}</Text>;
    case 'text':
      return <Text style={TEXT_STYLES[item.style]}>{item.text}</Text>;
    case 'head':
      return <Row table={item.table} cells={COLUMNS[item.table].map((c) => c.label)} style={pdf.headRow} />;
    case 'row':
      return <Row table={item.table} cells={item.cells} style={item.table === 'signatures' ? SIGNATURE_ROW : item.bold ? BOLD_ROW : pdf.row} />;
  }
}

/**
 * The calculation note: asset, inputs, anode, zones, equations, results with the caution, notices
 * and warnings, sources and the revision block; one A4 portrait <Page> per planned sheet with
 * "page N of M" written in. `pagination="checked"` lets every sheet wrap instead, so a test can
 * compare react-pdf's page count with the plan (the numbers printed are still the plan's).
 */
export function CalculationNote({ data, pagination = 'planned', drawing = null }: { data: CalculationNoteData; pagination?: 'planned' | 'checked'; drawing?: { drawing: AssetDrawing; heading: string; subtitle: string } | null }) {
  const plan = planCalculationNote(data);
  // The drawing of the asset with its anodes, on a sheet of its own after the note.
  const pages = plan.pages.length + (drawing ? 1 : 0);
  // Should an estimate ever exceed a sheet, let react-pdf continue it rather than draw into the footer.
  const wrap = pagination === 'checked' || !plan.fits;
  const left = footerLeft(data);
  const right = footerRight(data);
  return (
    <Document title={`Calculation note: ${data.asset.name}, revision ${data.design.revision}`} author="Tidewarden" subject="Sacrificial-anode cathodic protection design">
      {plan.pages.map((items, p) => (
        <PlannedSheet key={p} orientation="portrait" wrap={wrap} footer={{ left, right, page: p + 1, pages }}>
          {items.map((item, i) => (
            <PlanItemView key={i} item={item} data={data} />
          ))}
        </PlannedSheet>
      ))}
      {drawing ? (
        <PlannedSheet orientation="portrait" wrap={wrap} footer={{ left, right, page: pages, pages }}>
          <PdfAssetDrawing drawing={drawing.drawing} width={sheetArea('portrait').width} heading={drawing.heading} subtitle={drawing.subtitle} layout="portrait" />
        </PlannedSheet>
      ) : null}
    </Document>
  );
}

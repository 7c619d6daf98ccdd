import { createElement, type ReactElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { AnodeListDocument } from '@/components/pdf/anode-list';
import { loadPdfFonts } from '@/components/pdf/pdf-kit';
import type { AnodeList } from './build-anode-list';
import type { AssetDrawing } from '@/lib/drawings/asset-drawing';

/**
 * The dry-dock anode list as PDF bytes. Server only (react-pdf, fonts read from
 * `<cwd>/fonts`): a route handler or a script, both run with the repository as cwd.
 */
export async function renderAnodeListPdf(list: AnodeList, drawing: AssetDrawing | null = null): Promise<Buffer> {
  await loadPdfFonts();
  return renderToBuffer(createElement(AnodeListDocument, { list, drawing }) as unknown as ReactElement<DocumentProps>);
}

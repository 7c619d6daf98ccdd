/**
 * The anode list: what a yard orders and fits at one docking, or a contractor at one diving campaign.
 *
 * - build-anode-list      buildAnodeList (pure): validation, zones, subtotals, totals by model
 * - anode-list-csv        anodeListCsv (pure): CSV for spreadsheets, formula-safe, the PDF's line table
 * - words                 the list's words, which follow the asset and the work (PDF, CSV, screens)
 * - fitting-notes         FITTING_NOTES and fittingNotesFor
 * - errors                AnodeListInputError, with `field`
 * - render-anode-list-pdf renderAnodeListPdf (server only, react-pdf): import it from its own
 *                         path so client bundles never pull in the PDF renderer.
 */
export { AnodeListInputError } from './errors';
export {
  ANODE_LIST_ALLOYS,
  ANODE_LIST_MOUNTINGS,
  ANODE_LIST_STATUSES,
  buildAnodeList,
  roundKg,
  type AnodeList,
  type AnodeListInput,
  type AnodeListLine,
  type AnodeListOrderLine,
  type AnodeListRenewalInput,
  type AnodeListTotals,
  type AnodeListZone,
} from './build-anode-list';
export { ANODE_LIST_CSV_HEADER, anodeListCsv } from './anode-list-csv';
export {
  ANODE_LIST_LINE_COLUMNS,
  DIMENSIONS_KEY,
  alloyWords,
  anodeListOccasion,
  anodeListWords,
  dimensionsWords,
  dockingKindWords,
  mountingWords,
  statusWords,
  zoneWords,
  type AnodeListDimensions,
  type AnodeListOccasion,
  type AnodeListWords,
} from '@/lib/labels/anode-list';
// csvField lives in lib/csv (shared with the register export); re-exported for existing callers.
export { csvField } from '@/lib/csv/write-csv';
export { FITTING_NOTES, fittingNotesFor, type FittingNote, type FittingNoteScope, type FittingNoteWork } from './fitting-notes';

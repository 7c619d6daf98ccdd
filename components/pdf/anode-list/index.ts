/**
 * The dry-dock anode list PDF (react-pdf, server only).
 *
 * - layout        page geometry, columns, cell texts and the page plan (planAnodeListPages)
 * - measure-text  text widths and word wrap in Inter, rounded up so plans never run short
 * - format        masses and counts as the list prints them
 * - render        AnodeListDocument, the react-pdf components drawing the plan
 */
export { AnodeListDocument } from './render';
export { planAnodeListPages, type AnodeListPagePlan, type PlanItem } from './layout';
export { lineCount, textWidth, wrapLines } from './measure-text';
export { kgText } from './format';

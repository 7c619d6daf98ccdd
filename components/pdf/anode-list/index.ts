/**
 * The dry-dock anode list PDF (react-pdf, server only).
 *
 * - layout        page geometry, columns, cell texts and the page plan (planAnodeListPages)
 * - format        masses and counts as the list prints them
 * - render        AnodeListDocument, the react-pdf components drawing the plan
 *
 * Text measurement (../measure-text) and the sheet planner and footer (../pdf-kit) are shared with the calculation note.
 */
export { AnodeListDocument } from './render';
export { planAnodeListPages, type AnodeListPagePlan, type PlanItem } from './layout';
export { lineCount, textWidth, wrapLines } from '../measure-text';
export { kgText } from './format';

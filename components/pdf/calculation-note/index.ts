/**
 * The calculation note PDF (react-pdf, server only).
 *
 * - note-data  the data the note is printed from and every text it prints
 * - layout     page geometry, columns, text styles and the page plan (planCalculationNote)
 * - render     CalculationNote, the react-pdf components drawing the plan
 *
 * Text measurement (../measure-text) and the sheet planner and footer (../pdf-kit) are shared with the anode list.
 */
export { CalculationNote } from './render';
export { planCalculationNote, type CalculationNotePlan, type PlanItem as CalculationNotePlanItem } from './layout';
export { FLAG_WORDS, zoneDensitiesMaPerM2, type CalculationNoteData } from './note-data';

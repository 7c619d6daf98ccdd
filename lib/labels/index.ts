/**
 * The one vocabulary: every word a user reads for a stored value (an enum key), the shared sentences and
 * the unit symbols. Screens, PDFs, CSV headers and values and e-mails take their words from here, never
 * from the stored key (tests/unit/labels-coverage.test.ts checks every stored value has a label).
 * Safe for client code: no server imports.
 *
 * - design         the desk's choices: zone kinds, climate, coating, alloys, mountings, metals, formulas
 * - assets         asset kinds, structure types, hull material, water
 * - surveys        survey methods, reference electrodes, potential and remaining-mass statuses
 * - planner        docking kinds and statuses, renewal statuses, eventWords(assetKind): docking/yard or campaign/contractor
 * - forecast       the forecast's dates (renew by, utilisation factor reached)
 * - outlook        an asset's protection outlook
 * - anode-list     the anode list's words (PDF and CSV)
 * - roles          the roles and what each may do
 * - billing        subscription and invoice statuses
 * - units          a potential against its electrode ("V vs Ag/AgCl")
 * - text           inSentence: a label inside a sentence
 * - caution, mail-delivery, renewal-rule: sentences several screens share
 */
export * from './design';
export * from './assets';
export * from './surveys';
export * from './planner';
export * from './forecast';
export * from './outlook';
export * from './anode-list';
export * from './roles';
export * from './billing';
export * from './units';
export * from './text';
export * from './drawings';
export * from './caution';
export * from './mail-delivery';
export * from './renewal-rule';
export * from './capture';

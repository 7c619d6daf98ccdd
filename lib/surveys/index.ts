/**
 * Survey readings: the upload CSV format (survey-csv) and the classification of readings
 * against protection criteria and renewal rules (criteria).
 */
export * from './survey-csv';
export * from './criteria';

/** The reference electrodes a survey's potentials may be read against (kept out of lib/schemas so client code can list them without zod). */
export const SURVEY_ELECTRODE_VALUES = ['ag-agcl-seawater', 'cse', 'sce', 'zinc'] as const;

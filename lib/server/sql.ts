// A user's filter text as an ILIKE pattern that matches it literally (%, _ and \ escaped).
export const ilikePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

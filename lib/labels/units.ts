/**
 * Unit symbols, the same on screens, in PDFs, CSV headers and e-mails (safe for client code):
 * the degree sign, superscripts and the middle dot, never "C", "m2" or "ohm m".
 */
export const UNITS = {
  celsius: '°C',
  metre: 'm',
  millimetre: 'mm',
  squareMetre: 'm²',
  kilogram: 'kg',
  ampere: 'A',
  ohm: 'Ω',
  ohmMetre: 'Ω·m',
  currentDensity: 'mA/m²',
  capacity: 'A·h/kg',
  volt: 'V',
  year: 'years',
  knot: 'kn',
} as const;

/** "−0.95 V vs Ag/AgCl": a potential against its reference electrode (short name). */
export const versusElectrode = (electrodeShort: string): string => `V vs ${electrodeShort}`;

// Units are written with their symbols where they are used (°C, m², Ω·m, mA/m², A·h/kg), never "C", "m2" or
// "ohm m"; a potential says which electrode it is against:
/** "−0.95 V vs Ag/AgCl": a potential against its reference electrode (short name). */
export const versusElectrode = (electrodeShort: string): string => `V vs ${electrodeShort}`;

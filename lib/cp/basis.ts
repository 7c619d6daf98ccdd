import type { BasisEntry } from './types';

/** The one edition of DNV-RP-B401 this core follows; table numbers below are of this edition. */
export const DNV_RP_B401 = 'DNV-RP-B401 (2010, amended 2011)';

/** The standards and references, each pinned to one edition. */
export const basis = {
  sacrificialAnodeDesign: DNV_RP_B401,
  harbourStructures: 'MIL-HDBK-1004/10 (1990; edition year from memory)',
  standoffCorrection: 'El-Reedy, Offshore Structures (2012), ch. 6',
  shipHullGuide: 'Japanese ship-equipment guide (as cited in the design basis)',
  regionalCrossCheck: "Lloyd's Register offshore-unit rules, Table 4.1.1",
  overProtection: 'ABYC E-2',
  wettedSurface: 'Holtrop & Mennen (1982); Denny-Mumford',
  shipHullStandard: 'ISO 20313:2018',
  harbourStandard: 'ISO 13174:2012',
  generalPrinciples: 'EN 12473',
} as const;

const dnv = (where: string) => `${DNV_RP_B401}, ${where}`;

/** Every equation or table a design may use, keyed so a result can list what it used. */
export const BASIS_ENTRIES = {
  currentDemand: { topic: 'current demand Ic = Ac*fc*ic', source: dnv('sec. 7 current demand'), flag: 'published' },
  coatingBreakdown: { topic: 'coating breakdown fc = a + b*t, capped at 1', source: dnv('sec. 6 coating breakdown'), flag: 'published' },
  coatingConstants: { topic: 'coating constants a, b by category and depth', source: dnv('Table 10-4 (number from memory)'), flag: 'memory' },
  anodeMass: { topic: 'net anode mass M = Icm*tf*8760/(u*eps)', source: dnv('sec. 7 anode mass'), flag: 'published' },
  anodeOutput: { topic: 'anode output Ia = (Ec - Ea)/Ra', source: dnv('sec. 7 anode current output'), flag: 'published' },
  countCriteria: { topic: 'count criteria N*m >= M, N*Iai >= Ici, N*Iaf >= Icf', source: dnv('sec. 7 (final published; others from memory)'), flag: 'memory' },
  modifiedDwight: { topic: 'long slender stand-off resistance (modified Dwight)', source: dnv('Table 10-7 (number from memory)'), flag: 'memory' },
  shortSlender: { topic: 'short slender stand-off resistance', source: dnv('Table 10-7 (number from memory)'), flag: 'memory' },
  longFlush: { topic: 'long flush resistance Ra = rho/(2S)', source: dnv('Table 10-7 (number from memory)'), flag: 'memory' },
  mcCoy: { topic: 'McCoy resistance Ra = 0.315*rho/sqrt(A)', source: dnv('Table 10-7'), flag: 'published' },
  standoffFactor: { topic: 'stand-off 0.15-0.30 m: resistance x 1.3', source: basis.standoffCorrection, flag: 'published' },
  nearFlushSlender: { topic: 'slender anode below 0.15 m stand-off treated as flush-mounted (Tidewarden choice)', source: 'Tidewarden engineering choice', flag: 'practice' },
  endOfLifeSlender: { topic: 'end of life: length 0.9*L, remaining mass round the core', source: dnv('sec. 7 final anode dimensions'), flag: 'memory' },
  endOfLifeFlush: { topic: 'end of life of flush/bracelet anodes: uniform recession of exposed faces (Tidewarden model)', source: 'Tidewarden engineering choice', flag: 'practice' },
  ratedOutput: { topic: 'anode output from the manufacturer data sheet', source: 'anode data sheet', flag: 'practice' },
  alloyAlZnIn: { topic: 'Al-Zn-In capacity and potential', source: dnv('Table 10-6'), flag: 'memory' },
  alloyZinc: { topic: 'zinc capacity and potential', source: `${dnv('Table 10-6')}; 780 Ah/kg also MIL-A-18001 data`, flag: 'memory' },
  alloyMagnesium: { topic: 'magnesium capacity and potential', source: basis.harbourStructures, flag: 'published' },
  utilisationTable: { topic: 'utilisation factors by anode shape', source: dnv('Table 10-8 (number from memory)'), flag: 'memory' },
  protectionCriteria: { topic: 'protection potentials (-0.80 V aerobic, -0.90 V anaerobic vs Ag/AgCl/seawater)', source: `${DNV_RP_B401}; ${basis.harbourStructures}`, flag: 'published' },
  overProtectionLimits: { topic: 'over-protection limits by protected metal', source: `${basis.overProtection} (steel, aluminium); ${DNV_RP_B401} (high-strength steel, from memory)`, flag: 'published' },
  distribution: { topic: 'anodes distributed over surfaces in proportion to demand, each rounded up', source: 'common practice', flag: 'practice' },
} as const satisfies Record<string, BasisEntry>;

export type BasisKey = keyof typeof BASIS_ENTRIES;

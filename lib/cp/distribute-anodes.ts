import { CpInputError } from './errors';
import { ceilCount } from './numeric';
import { assertFiniteResult, list, nonNegative, record, text, wholeNonNegative } from './validate';

export interface DistributionInput {
  /** The design count to share out. */
  total: number;
  surfaces: ReadonlyArray<{ name: string; demandA: number }>;
}

export interface DistributionRow {
  name: string;
  demandA: number;
  /** Fraction of the total demand. */
  share: number;
  /** Share of the design count before rounding up. */
  exactCount: number;
  count: number;
  /** False for a surface that takes no anodes (mud): its demand is met from the water. */
  anodesAllowed?: boolean;
}

export interface Distribution {
  designCount: number;
  /** Sum of the rounded-up counts; may exceed the design count. */
  distributedCount: number;
  surfaces: DistributionRow[];
}

/**
 * Shares a count over surfaces in proportion to their current demand, each share rounded
 * up (common practice), so every surface gets at least its proportion.
 */
export function distributeAnodes(input: DistributionInput): Distribution {
  const r = record(input, 'input');
  const total = wholeNonNegative(r.total, 'total');
  const rows = list(r.surfaces, 'surfaces').map((s, i) => {
    const row = record(s, `surfaces[${i}]`);
    return { name: text(row.name, `surfaces[${i}].name`), demandA: nonNegative(row.demandA, `surfaces[${i}].demandA`, 'A') };
  });
  const sum = rows.reduce((acc, s) => acc + s.demandA, 0);
  if (sum <= 0 && total > 0) {
    throw new CpInputError('surfaces', 'The surfaces have no current demand to share the anodes by.');
  }
  return assertFiniteResult(shareOut(total, rows, sum), 'surfaces');
}

/** Unchecked core. */
export function shareOut(total: number, rows: ReadonlyArray<{ name: string; demandA: number }>, sum: number): Distribution {
  const surfaces = rows.map(({ name, demandA }) => {
    const share = sum > 0 ? demandA / sum : 0;
    const exactCount = total * share;
    return { name, demandA, share, exactCount, count: ceilCount(exactCount) };
  });
  return { designCount: total, distributedCount: surfaces.reduce((acc, s) => acc + s.count, 0), surfaces };
}

import { describe, expect, it } from 'vitest';
import { MS_PER_YEAR, forecastGroup, meanCurrentA } from '@/lib/forecast';
import type { DesignRecord } from '@/lib/schemas/design-record';
import { designDemandProfile } from '@/lib/server/services/forecast/design-demand-profile';
import { ferryRecord } from '../design/record-fixture';
import { utc } from './helpers';

type Breakdown = { initial: number; mean: number; final: number };

/** The ferry record with its surfaces' breakdown factors, mean currents and design life replaced (invented values). */
function recordWith(surfaces: { name: string; meanA: number; breakdown: Breakdown }[], designLifeYears = 10): DesignRecord {
  const record = ferryRecord();
  const template = record.results!.surfaces[0];
  return {
    ...record,
    inputs: { ...record.inputs, designLifeYears },
    results: { ...record.results!, surfaces: surfaces.map((s) => ({ ...template, ...s })) },
  };
}

// Invented coating: fc = 0.05 + 0.04 t over 10 years (DNV-RP-B401 form, published): fci 0.05,
// fcm 0.05 + 0.04 x 5 = 0.25, fcf 0.05 + 0.04 x 10 = 0.45, none capped.
const coated: Breakdown = { initial: 0.05, mean: 0.25, final: 0.45 };

describe('designDemandProfile', () => {
  it('follows the zone breakdown: meanShare x fci / fcm to meanShare x fcf / fcm over the design life, hand-worked', () => {
    const p = designDemandProfile(recordWith([{ name: 'Bottom', meanA: 20, breakdown: coated }]), 'Bottom', 2);
    // 2 x 0.05 / 0.25 = 0.4 A; 2 x 0.45 / 0.25 = 3.6 A; mean (0.4 + 3.6) / 2 = 2 A, the share the mass was sized on.
    expect(p).not.toBeNull();
    expect(p!.startA).toBeCloseTo(0.4, 12);
    expect(p!.endA).toBeCloseTo(3.6, 12);
    expect(p!.overYears).toBe(10);
    expect(meanCurrentA(p!)).toBeCloseTo(2, 12);
  });

  it('a group sized on its share for the design life is spent at the design life on that profile, hand-worked', () => {
    // 2 A x 10 yr x 8760 h = 175,200 Ah; u 0.8, eps 2000 Ah/kg: 175,200 / (0.8 x 2000) = 109.5 kg = 10 x 10.95 kg.
    const p = designDemandProfile(recordWith([{ name: 'Bottom', meanA: 20, breakdown: coated }]), 'Bottom', 2)!;
    const f = forecastGroup({ installedOn: utc('2026-01-01'), quantity: 10, netMassPerAnodeKg: 10.95, utilisationFactor: 0.8, capacityAhPerKg: 2000, currentA: 2, demandProfile: p });
    expect((f.endOfLife!.getTime() - utc('2026-01-01').getTime()) / MS_PER_YEAR).toBeCloseTo(10, 6);
    // The profile runs below the mean current early on: half way through, less than half is consumed.
    // Consumed by t: (0.4 t + 0.16 t^2) x 8760 / 2000 / 109.5 = 0.016 t + 0.0064 t^2 -> 0.24 at 5 years (0.4 on the mean current).
    expect(f.remainingFractionAt(new Date(utc('2026-01-01').getTime() + 5 * MS_PER_YEAR))).toBeCloseTo(0.76, 9);
  });

  it('keeps the mean at the share when the record capped the final factor at 1', () => {
    // fc = 0.1 + 0.1 t over 20 years: fci 0.1, fcm min(1, 1.1) = 1, fcf min(1, 2.1) = 1 (DNV-RP-B401 cap, published).
    // fcm of the record is not the line's mean (0.55): dividing by it would average 0.55 x the share.
    const p = designDemandProfile(recordWith([{ name: 'Bottom', meanA: 20, breakdown: { initial: 0.1, mean: 1, final: 1 } }], 20), 'Bottom', 5.5)!;
    expect(p.startA).toBeCloseTo(1, 12); // 5.5 x 0.1 / 0.55
    expect(p.endA).toBeCloseTo(10, 12); // 5.5 x 1 / 0.55
    expect(meanCurrentA(p)).toBeCloseTo(5.5, 12);
  });

  it('bare steel (fc = 1) gives a flat profile at the share', () => {
    const p = designDemandProfile(recordWith([{ name: 'Propeller', meanA: 3, breakdown: { initial: 1, mean: 1, final: 1 } }]), 'Propeller', 1.25)!;
    expect(p).toEqual({ startA: 1.25, endA: 1.25, overYears: 10 });
  });

  it("a group whose zone is not in the design takes the design's shape weighted by mean demand", () => {
    // Coated zone 30 A: shape 0.2 -> 1.8; bare zone 10 A: 1 -> 1. Weighted: (30 x 0.2 + 10) / 40 = 0.4 and (30 x 1.8 + 10) / 40 = 1.6.
    const record = recordWith([
      { name: 'Bottom', meanA: 30, breakdown: coated },
      { name: 'Shaft', meanA: 10, breakdown: { initial: 1, mean: 1, final: 1 } },
    ]);
    const p = designDemandProfile(record, 'Not in the design', 4)!;
    expect(p.startA).toBeCloseTo(1.6, 12);
    expect(p.endA).toBeCloseTo(6.4, 12);
    expect(designDemandProfile(record, null, 4)).toEqual(p);
  });

  it('no profile without results, a design life or a positive share', () => {
    const record = recordWith([{ name: 'Bottom', meanA: 20, breakdown: coated }]);
    expect(designDemandProfile({ ...record, results: null }, 'Bottom', 2)).toBeNull();
    expect(designDemandProfile(record, 'Bottom', 0)).toBeNull();
    expect(designDemandProfile(record, 'Bottom', Number.NaN)).toBeNull();
  });

  it('the ferry of the fixture, sized by ship-hull practice (fc = 1), has flat profiles', () => {
    const record = ferryRecord();
    for (const s of record.results!.surfaces) {
      const p = designDemandProfile(record, s.name, 2)!;
      expect(p.startA).toBeCloseTo(p.endA, 12);
    }
  });
});

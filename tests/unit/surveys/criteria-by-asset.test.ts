import { describe, expect, it } from 'vitest';
import { CpInputError, convertPotential, nernstSlopeV } from '@/lib/cp';
import { classifyPotential, criteriaSubject, type ClassifyPotentialInput } from '@/lib/surveys';
import { surveyCriteriaOf, waterSalinityOf } from '@/lib/register/protected-metal';

const classify = (potentialAgAgClV: number, criteria: Omit<ClassifyPotentialInput, 'potentialAgAgClV'>) => classifyPotential({ potentialAgAgClV, ...criteria });

describe('classifyPotential with the asset flags', () => {
  it('steel, aerobic: protected from -0.80 V to -1.05 V', () => {
    // -0.80 V Ag/AgCl/seawater aerobic: DNV-RP-B401 and MIL-HDBK-1004/10 via design-basis.md (published)
    // -1.05 V: steel hulls -0.80 to -1.05 V, ABYC E-2 practice via design-basis.md (published range); coating disbondment beyond it (common practice)
    const steel = { protectedMetal: 'steel' } as const;
    expect(classify(-0.79, steel)).toMatchObject({ status: 'under-protected', criterion: 'less negative than -0.80 V (steel)', criterionFlag: 'published' });
    expect(classify(-0.8, steel)).toMatchObject({ status: 'protected', criterion: 'from -0.80 V to -1.05 V (steel)' });
    expect(classify(-1.05, steel).status).toBe('protected');
    const over = classify(-1.06, steel);
    expect(over).toMatchObject({ status: 'over-protected', criterion: 'more negative than -1.05 V (steel)', limitV: -1.05 });
    expect(over.message).toMatch(/coating disbondment/);
  });

  it('steel, anaerobic (sulphate-reducing bacteria, mud): -0.90 V', () => {
    // -0.90 V where anaerobic with sulphate-reducing bacteria: design-basis.md "Environment" (published)
    const anaerobic = { protectedMetal: 'steel', anaerobic: true } as const;
    const c = classify(-0.85, anaerobic);
    expect(c).toMatchObject({ status: 'under-protected', criterionV: -0.9, criterionFlag: 'published', criterion: 'less negative than -0.90 V (anaerobic steel)' });
    expect(classify(-0.9, anaerobic)).toMatchObject({ status: 'protected', criterion: 'from -0.90 V to -1.05 V (anaerobic steel)' });
    expect(classify(-1.06, anaerobic).status).toBe('over-protected'); // same -1.05 V limit (published range, disbondment: practice)
  });

  it('high-strength steel by flag: the steel criterion, over-protected beyond about -0.83 V', () => {
    // yield > 550 MPa, no more negative than about -0.83 V: DNV, FROM MEMORY (design-basis.md "Environment")
    const hss = { protectedMetal: 'steel', highStrengthSteel: true } as const;
    expect(classify(-0.79, hss)).toMatchObject({ status: 'under-protected', criterionV: -0.8 }); // -0.80 V, published
    expect(classify(-0.83, hss).status).toBe('protected');
    const over = classify(-1.1, hss);
    expect(over).toMatchObject({ status: 'over-protected', limitV: -0.83, limitFlag: 'memory', criterion: 'more negative than -0.83 V (high-strength steel)' });
    expect(over.message).toMatch(/hydrogen embrittlement/);
    // the flag gives the same answer as naming the metal
    for (const v of [-0.79, -0.8, -0.83, -0.84, -1.1]) expect(classify(v, hss).status).toBe(classify(v, { protectedMetal: 'high-strength-steel' }).status);
  });

  it('anaerobic high-strength steel has no protected window: every reading is under or over', () => {
    // -0.90 V anaerobic criterion (published) is beyond the about -0.83 V limit (from memory)
    const both = { protectedMetal: 'steel', anaerobic: true, highStrengthSteel: true } as const;
    expect(classify(-0.82, both)).toMatchObject({ status: 'under-protected', criterion: 'less negative than -0.90 V (anaerobic high-strength steel)' });
    expect(classify(-0.9, both).status).toBe('over-protected');
    expect(classify(-0.82, both).message).toMatch(/no potential meets both/);
  });

  it('aluminium hull: -0.90 V to -1.10 V, alkaline corrosion beyond; anaerobic changes nothing', () => {
    // aluminium hulls -0.90 to -1.10 V, alkaline corrosion when more negative: ABYC E-2 practice via design-basis.md (published)
    const al = { protectedMetal: 'aluminium' } as const;
    expect(classify(-0.89, al)).toMatchObject({ status: 'under-protected', criterion: 'less negative than -0.90 V (aluminium)' });
    expect(classify(-1.1, al)).toMatchObject({ status: 'protected', criterion: 'from -0.90 V to -1.10 V (aluminium)' });
    expect(classify(-1.11, al)).toMatchObject({ status: 'over-protected', criterion: 'more negative than -1.10 V (aluminium)', limitFlag: 'published' });
    expect(classify(-0.89, { protectedMetal: 'aluminium', anaerobic: true }).criterionV).toBe(-0.9);
  });

  it('stainless -0.75 V and copper alloy -0.55 V minimum, no over-protection limit', () => {
    // stainless -0.75 V, bronze -0.55 V minimum: trade references via design-basis.md (published)
    expect(classify(-0.74, { protectedMetal: 'stainless' })).toMatchObject({ status: 'under-protected', criterion: 'less negative than -0.75 V (stainless steel)' });
    expect(classify(-1.5, { protectedMetal: 'stainless' })).toMatchObject({ status: 'protected', limitV: null, limitFlag: null, criterion: '-0.75 V or more negative (stainless steel)' });
    expect(classify(-0.54, { protectedMetal: 'copper-alloy' })).toMatchObject({ status: 'under-protected', criterion: 'less negative than -0.55 V (copper alloy)' });
    expect(classify(-0.55, { protectedMetal: 'copper-alloy' }).status).toBe('protected');
  });

  it('refuses high-strength steel on a metal that is not steel', () => {
    expect(() => classify(-1, { protectedMetal: 'aluminium', highStrengthSteel: true })).toThrow(CpInputError);
  });
});

describe('the asset as criteria', () => {
  it('takes metal and flags from the asset; an aluminium hull ignores high-strength steel', () => {
    expect(surveyCriteriaOf({ kind: 'structure', anaerobic: true, highStrengthSteel: true })).toEqual({ protectedMetal: 'steel', anaerobic: true, highStrengthSteel: true });
    expect(surveyCriteriaOf({ kind: 'vessel', hullMaterial: 'aluminium', highStrengthSteel: true })).toEqual({ protectedMetal: 'aluminium', anaerobic: false, highStrengthSteel: false });
    expect(surveyCriteriaOf({ kind: 'vessel', hullMaterial: 'steel' })).toEqual({ protectedMetal: 'steel', anaerobic: false, highStrengthSteel: false });
    expect(criteriaSubject(surveyCriteriaOf({ kind: 'structure', anaerobic: true, highStrengthSteel: true }))).toBe('anaerobic high-strength steel');
  });

  it('salinity: as recorded; 35 PSU for a vessel or seawater when blank; unknown in brackish or fresh water', () => {
    expect(waterSalinityOf({ kind: 'structure', waterType: 'brackish', waterSalinityPsu: 5 })).toBe(5);
    expect(waterSalinityOf({ kind: 'structure', waterType: 'seawater', waterSalinityPsu: null })).toBe(35);
    expect(waterSalinityOf({ kind: 'vessel', waterType: null, waterSalinityPsu: null })).toBe(35);
    expect(waterSalinityOf({ kind: 'structure', waterType: 'brackish', waterSalinityPsu: null })).toBeNull();
  });

  it('a -0.80 V reading against Ag/AgCl/seawater in 5 PSU water is about -0.75 V on the seawater scale: under-protected steel', () => {
    // Nernst: shift = -(RT ln10 / F) log10(Cl5 / Cl35) = 0.05916 x log10(7) = 0.0500 V at 25 C (chloride in proportion to salinity)
    const expected = nernstSlopeV(25) * Math.log10(35 / 5);
    expect(expected).toBeCloseTo(0.05, 3);
    const corrected = convertPotential({ valueV: -0.8, from: 'ag-agcl-seawater', to: 'ag-agcl-seawater', salinityPsu: 5 });
    expect(corrected - -0.8).toBeCloseTo(expected, 6);
    expect(classify(corrected, { protectedMetal: 'steel' }).status).toBe('under-protected');
    expect(classify(-0.8, { protectedMetal: 'steel' }).status).toBe('protected'); // uncorrected it would pass
  });
});

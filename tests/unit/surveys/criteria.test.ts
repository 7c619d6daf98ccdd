import { describe, expect, it } from 'vitest';
import { CpInputError } from '@/lib/cp';
import { classifyPotential, classifyRemaining, formatVolts } from '@/lib/surveys';

const status = (potentialAgAgClV: number, protectedMetal: Parameters<typeof classifyPotential>[0]['protectedMetal'], anaerobic?: boolean) =>
  classifyPotential({ potentialAgAgClV, protectedMetal, anaerobic }).status;

describe('classifyPotential', () => {
  it('steel: the -0.80 V criterion is met exactly at -0.80 V', () => {
    // design protective potential -0.80 V Ag/AgCl/seawater, aerobic, DNV-RP-B401 (2010) and MIL-HDBK-1004/10 via design-basis.md, published
    expect(status(-0.8, 'steel')).toBe('protected');
    expect(status(-0.79, 'steel')).toBe('under-protected');
    const c = classifyPotential({ potentialAgAgClV: -0.72, protectedMetal: 'steel' });
    expect(c).toMatchObject({ status: 'under-protected', label: 'Under-protected', criterionV: -0.8, limitV: -1.05 });
    expect(c.message).toBe('-0.72 V is less negative than the -0.80 V criterion for steel: under-protected.');
  });

  it('steel: over-protected beyond the -1.05 V limit', () => {
    // steel hulls -0.80 to -1.05 V, ABYC E-2 practice via design-basis.md, published; coating disbondment beyond (practice)
    expect(status(-1.05, 'steel')).toBe('protected');
    expect(status(-1.06, 'steel')).toBe('over-protected');
    const c = classifyPotential({ potentialAgAgClV: -1.1, protectedMetal: 'steel' });
    expect(c).toMatchObject({ status: 'over-protected', label: 'Over-protected' });
    expect(c.message).toContain('-1.05 V limit');
  });

  it('steel with sulphate-reducing bacteria: -0.90 V criterion', () => {
    // -0.90 V Ag/AgCl/seawater where anaerobic with sulphate-reducing bacteria, DNV-RP-B401 via design-basis.md, published
    expect(status(-0.85, 'steel', true)).toBe('under-protected');
    expect(status(-0.9, 'steel', true)).toBe('protected');
    expect(classifyPotential({ potentialAgAgClV: -0.85, protectedMetal: 'steel', anaerobic: true }).message).toContain('anaerobic');
  });

  it('high-strength steel: over-protected beyond about -0.83 V', () => {
    // high-strength steel (yield > 550 MPa) no more negative than about -0.83 V, DNV, from memory (design-basis.md)
    expect(status(-0.95, 'high-strength-steel')).toBe('over-protected');
    expect(status(-0.83, 'high-strength-steel')).toBe('protected');
    expect(status(-0.81, 'high-strength-steel')).toBe('protected');
    expect(status(-0.79, 'high-strength-steel')).toBe('under-protected'); // same -0.80 V criterion as steel, published
    expect(classifyPotential({ potentialAgAgClV: -0.95, protectedMetal: 'high-strength-steel' }).message).toMatch(/hydrogen/);
  });

  it('high-strength steel in anaerobic conditions has no protected window and says so', () => {
    // -0.90 V anaerobic criterion (published) lies beyond the -0.83 V limit (from memory), design-basis.md
    expect(status(-0.85, 'high-strength-steel', true)).toBe('over-protected');
    expect(status(-0.82, 'high-strength-steel', true)).toBe('under-protected');
    expect(classifyPotential({ potentialAgAgClV: -0.82, protectedMetal: 'high-strength-steel', anaerobic: true }).message).toMatch(/no potential meets both/);
  });

  it('aluminium: -0.90 to -1.10 V', () => {
    // aluminium hulls -0.90 to -1.10 V, alkaline corrosion when more negative, ABYC E-2 practice via design-basis.md, published
    expect(status(-0.89, 'aluminium')).toBe('under-protected');
    expect(status(-0.9, 'aluminium')).toBe('protected');
    expect(status(-1.1, 'aluminium')).toBe('protected');
    expect(status(-1.11, 'aluminium')).toBe('over-protected');
    expect(classifyPotential({ potentialAgAgClV: -1.2, protectedMetal: 'aluminium' }).message).toMatch(/alkaline/);
  });

  it('stainless and copper alloy: minimum protection, no over-protection limit', () => {
    // minimum protection stainless -0.75 V, bronze -0.55 V, trade references via design-basis.md, published
    expect(status(-0.74, 'stainless')).toBe('under-protected');
    expect(status(-0.75, 'stainless')).toBe('protected');
    expect(status(-0.54, 'copper-alloy')).toBe('under-protected');
    expect(status(-0.55, 'copper-alloy')).toBe('protected');
    expect(classifyPotential({ potentialAgAgClV: -1.5, protectedMetal: 'stainless' })).toMatchObject({ status: 'protected', limitV: null, criterionV: -0.75 });
  });

  it('refuses a non-finite potential', () => {
    expect(() => classifyPotential({ potentialAgAgClV: Number.NaN, protectedMetal: 'steel' })).toThrow(CpInputError);
  });

  it('formats potentials with 2 to 4 decimals', () => {
    expect(formatVolts(-0.8)).toBe('-0.80');
    expect(formatVolts(-0.945)).toBe('-0.945');
    expect(formatVolts(-0.7995)).toBe('-0.7995');
  });
});

describe('classifyRemaining', () => {
  it('renews below 25 % of the original mass', () => {
    // renewal when less than 25 % of original mass remains, NAVFAC mooring practice via design-basis.md, published
    expect(classifyRemaining(0.24)).toBe('renew');
    expect(classifyRemaining(0.25)).toBe('renew-soon');
    expect(classifyRemaining(0)).toBe('renew');
  });

  it('flags renew-soon below 40 %', () => {
    // 40 % warning threshold: common practice (this project's choice, no single source)
    expect(classifyRemaining(0.39)).toBe('renew-soon');
    expect(classifyRemaining(0.4)).toBe('sound');
    expect(classifyRemaining(1)).toBe('sound');
  });

  it('renews when the consumed share reaches the utilisation factor', () => {
    // utilisation factor 0.90 long slender stand-off, DNV-RP-B401 from memory (design-basis.md): 10 % left is the end of life
    expect(classifyRemaining(0.1, 0.9)).toBe('renew');
    // short flush 0.80, DNV-RP-B401 from memory: consumed 0.75 < 0.80 but the 25 % rule does not apply at 0.25 either
    expect(classifyRemaining(0.25, 0.8)).toBe('renew-soon');
    expect(classifyRemaining(0.2, 0.8)).toBe('renew');
    // a low factor governs before the 25 % rule
    expect(classifyRemaining(0.5, 0.5)).toBe('renew');
    expect(classifyRemaining(0.51, 0.5)).toBe('sound');
  });

  it('refuses values outside 0..1', () => {
    expect(() => classifyRemaining(1.1)).toThrow(CpInputError);
    expect(() => classifyRemaining(-0.1)).toThrow(CpInputError);
    expect(() => classifyRemaining(0.5, 0)).toThrow(CpInputError);
  });
});

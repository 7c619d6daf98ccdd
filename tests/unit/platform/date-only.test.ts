import { format } from 'date-fns';
import { describe, expect, it } from 'vitest';
import { compareDateOnly, formatDateOnly, isDateOnly, parseDateOnly, toDateOnly, todayDateOnly } from '@/lib/dates/date-only';
import { daysInOrder } from '@/lib/schemas/date-only-field';
import { dockingSchema, fittedSchema } from '@/lib/schemas/planner';
import { removeGroupSchema, surveySchema } from '@/lib/schemas/register';

const utcMidnight = (y: number, m: number, d: number) => new Date(Date.UTC(y, m - 1, d));

describe('parseDateOnly', () => {
  it('reads YYYY-MM-DD as midnight UTC', () => {
    expect(parseDateOnly('2027-03-14')).toEqual(utcMidnight(2027, 3, 14));
    expect(parseDateOnly('2028-02-29')).toEqual(utcMidnight(2028, 2, 29)); // leap year
    expect(parseDateOnly('2000-02-29')).toEqual(utcMidnight(2000, 2, 29)); // divisible by 400
    expect(parseDateOnly('0099-12-31').getUTCFullYear()).toBe(99); // not read as 1999
  });

  it.each(['2026-02-30', '2026-13-01', '2026-00-10', '2026-04-31', '2027-02-29', '1900-02-29', '2026-2-3', '26-02-03', '2026-02-03T00:00:00Z', ' 2026-02-03', '2026/02/03', '3 Feb 2026', ''])(
    'refuses %j',
    (text) => {
      expect(() => parseDateOnly(text)).toThrow(RangeError);
      expect(isDateOnly(text)).toBe(false);
    },
  );

  it('refuses what is not a text', () => {
    expect(isDateOnly(null)).toBe(false);
    expect(isDateOnly(undefined)).toBe(false);
    expect(isDateOnly(new Date())).toBe(false);
    expect(isDateOnly(20260203)).toBe(false);
  });
});

describe('toDateOnly and todayDateOnly', () => {
  it('write the UTC calendar day', () => {
    expect(toDateOnly(utcMidnight(2027, 3, 14))).toBe('2027-03-14');
    expect(toDateOnly(new Date('2027-03-14T23:59:59.999Z'))).toBe('2027-03-14');
    expect(toDateOnly(new Date('2027-03-14T23:30:00-05:00'))).toBe('2027-03-15'); // evening in New York is the next UTC day
    expect(todayDateOnly(new Date('2027-03-14T00:00:00Z'))).toBe('2027-03-14');
    expect(todayDateOnly()).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });

  it('round-trip with parseDateOnly', () => {
    for (const day of ['1970-01-01', '1969-12-31', '2024-02-29', '2027-03-14', '9999-12-31']) expect(toDateOnly(parseDateOnly(day))).toBe(day);
  });

  it('refuse an invalid date', () => {
    expect(() => toDateOnly(new Date(Number.NaN))).toThrow(RangeError);
    expect(() => formatDateOnly(new Date(Number.NaN))).toThrow(RangeError);
  });
});

describe('compareDateOnly', () => {
  it('orders calendar days, texts and dates alike', () => {
    expect(compareDateOnly('2027-03-14', '2027-03-15')).toBe(-1);
    expect(compareDateOnly('2027-03-15', '2027-03-14')).toBe(1);
    expect(compareDateOnly('2027-03-14', utcMidnight(2027, 3, 14))).toBe(0);
    expect(compareDateOnly(new Date('2027-03-14T22:00:00Z'), '2027-03-14')).toBe(0); // same UTC day
    expect(compareDateOnly('2026-12-31', '2027-01-01')).toBe(-1);
  });

  it('refuses a day that does not exist', () => {
    expect(() => compareDateOnly('2026-02-30', '2026-03-01')).toThrow(RangeError);
  });
});

describe('formatDateOnly', () => {
  it("shows d MMM yyyy by default and takes other day, month and year patterns", () => {
    expect(formatDateOnly('2027-03-14')).toBe('14 Mar 2027');
    expect(formatDateOnly(utcMidnight(2027, 3, 14))).toBe('14 Mar 2027');
    expect(formatDateOnly(new Date('2027-03-14T23:59:00Z'))).toBe('14 Mar 2027');
    expect(formatDateOnly('2027-03-01', 'MMM yyyy')).toBe('Mar 2027');
    expect(formatDateOnly('2027-09-01', 'MMM')).toBe('Sep');
    expect(formatDateOnly('2028-02-29', 'd MMMM yyyy')).toBe('29 February 2028');
    expect(formatDateOnly('0099-01-05')).toBe('5 Jan 0099');
  });

  it('writes the display pattern as date-fns does, every day of a common and a leap year', () => {
    for (let t = Date.UTC(2027, 0, 1); t < Date.UTC(2029, 0, 1); t += 86_400_000) {
      const d = new Date(t);
      const local = new Date(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate(), 12);
      expect(formatDateOnly(d)).toBe(format(local, 'd MMM yyyy'));
    }
  });

  it('refuses a text that is not a day', () => {
    expect(() => formatDateOnly('2026-02-30')).toThrow(RangeError);
    expect(() => formatDateOnly('')).toThrow(RangeError);
  });
});

describe('form fields holding a day', () => {
  const docking = { assetId: '0b8c1f3e-6a51-4d8e-9a57-3c8a4e2f1b6d', kind: 'intermediate' };

  it.each(['2026-02-30', '2026-13-01', '2026-2-3', ''])('refuse %j', (day) => {
    expect(fittedSchema.safeParse({ fittedOn: day }).success).toBe(false);
    expect(removeGroupSchema.safeParse({ removedOn: day, reason: 'Renewed' }).success).toBe(false);
    expect(dockingSchema.safeParse({ ...docking, plannedStart: day }).success).toBe(false);
  });

  it('accept 29 February of a leap year', () => {
    expect(fittedSchema.parse({ fittedOn: '2028-02-29' }).fittedOn).toBe('2028-02-29');
    expect(dockingSchema.safeParse({ ...docking, plannedStart: '2028-02-29' }).success).toBe(true);
  });

  it('refuse a survey dated after today (UTC), whatever the format of the mistake', () => {
    const survey = { assetId: docking.assetId, method: 'diver', defaultElectrode: 'ag-agcl-seawater' };
    const tomorrow = toDateOnly(new Date(Date.now() + 86_400_000));
    expect(surveySchema.safeParse({ ...survey, surveyedOn: todayDateOnly() }).success).toBe(true);
    expect(surveySchema.safeParse({ ...survey, surveyedOn: tomorrow }).error?.issues.map((i) => i.message)).toEqual(['The survey date cannot be in the future.']);
    expect(surveySchema.safeParse({ ...survey, surveyedOn: '2026-02-30' }).error?.issues.map((i) => i.message)).toEqual(['The survey date is not a real date.']);
  });

  it('check the order of start and end only when both are real days', () => {
    expect(daysInOrder('2027-03-14', '2027-03-14')).toBe(true);
    expect(daysInOrder('2027-03-14', '2027-03-13')).toBe(false);
    expect(daysInOrder('2027-03-14', null)).toBe(true);
    expect(daysInOrder('2027-03-14', '2027-02-30')).toBe(true); // the field itself reports it
    const end = dockingSchema.safeParse({ ...docking, plannedStart: '2027-03-14', plannedEnd: '2027-03-13' });
    expect(end.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['plannedEnd', 'The planned end is before the start.']]);
    const bad = dockingSchema.safeParse({ ...docking, plannedStart: '2027-03-14', plannedEnd: '2027-02-30' });
    expect(bad.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['plannedEnd', 'The planned end is not a real date.']]);
  });
});

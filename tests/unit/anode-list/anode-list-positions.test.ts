import { describe, expect, it } from 'vitest';
import { anodeListCsv, buildAnodeList } from '@/lib/anode-list';
import { lineCells } from '@/components/pdf/anode-list/layout';
import { smallInput, smallRenewals } from './helpers';

describe("the list's positions", () => {
  const renewals = smallRenewals();
  renewals[0] = { ...renewals[0], positions: 'Stern frame and shaft brackets P/S, clear of propeller tips', positionReadAs: 'Propeller and shaft, aft, port and starboard; clear of propeller tips' };
  renewals[1] = { ...renewals[1], positions: 'Rudder blade, 2 each side', positionReadAs: 'Rudder blade, 2 each side' };
  renewals[3] = { ...renewals[3], positions: null, positionReadAs: 'Sea chest' };
  const list = buildAnodeList(smallInput({ renewals }));
  const line = (label: string) => list.zones.flatMap((z) => z.lines).find((l) => l.groupLabel === label)!;

  it('keeps the text exactly as written and prints the reading on a second line of the PDF cell', () => {
    expect(line('Bottom P10').positions).toBe('Stern frame and shaft brackets P/S, clear of propeller tips');
    expect(lineCells(line('Bottom P10'))).toContain('Stern frame and shaft brackets P/S, clear of propeller tips\nRead as: Propeller and shaft, aft, port and starboard; clear of propeller tips');
  });

  it('adds no "Read as" when the reading repeats the text or there is no text', () => {
    expect(line('Rudder').positionReadAs).toBeNull();
    expect(lineCells(line('Rudder'))).toContain('Rudder blade, 2 each side');
    expect(line('Sea chest grid').positionReadAs).toBeNull();
    expect(lineCells(line('Sea chest grid'))).toContain('–');
  });

  it('gives the CSV the text as written, never the reading', () => {
    const csv = anodeListCsv(list);
    expect(csv).toContain('"Stern frame and shaft brackets P/S, clear of propeller tips"');
    expect(csv).not.toContain('Read as');
    expect(csv).not.toContain('Propeller and shaft, aft');
  });
});

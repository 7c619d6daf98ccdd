import { it, expect } from 'vitest';
it('tz', () => { process.env.TZ = 'Pacific/Auckland'; const d = new Date('2025-03-31T23:30:00Z'); expect(d.getDate()).toBe(1); delete process.env.TZ; });

import { describe, expect, it } from 'vitest';
import { offlineCopyWords } from '@/lib/labels/capture';

// The line a page shows without signal: how old the copy is, in the phone's own time.
describe('offlineCopyWords', () => {
  const kept = new Date(2026, 11, 2, 7, 5); // 07:05 on 2 Dec 2026, local time

  it('on a survey page says when the copy was kept and that capture still works', () => {
    const words = offlineCopyWords(kept, true);
    expect(words).toContain('kept on this phone on 2 Dec 2026, 07:05');
    expect(words).toContain('saved here and sent when the connection returns');
  });

  it('elsewhere says when the page was loaded and that it may be behind', () => {
    expect(offlineCopyWords(kept, false)).toBe('No connection. This page was loaded on 2 Dec 2026, 07:05; what it shows may have changed since.');
  });

  it('a time it cannot read is said as unknown, never as a made-up date', () => {
    expect(offlineCopyWords(new Date('not a date'), true)).toContain('kept on this phone at an unknown time');
  });
});

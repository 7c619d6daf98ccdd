import { describe, expect, it } from 'vitest';
import { offlineCopyWords } from '@/lib/labels/capture';

// The line a page shows without signal, or when the worker served its kept copy: how old it is, in the phone's time.
describe('offlineCopyWords', () => {
  const since = new Date(2026, 11, 2, 7, 5); // 07:05 on 2 Dec 2026, local time

  it('without signal: what the server sent and when; on a page with the capture form, that capture still works', () => {
    expect(offlineCopyWords(since, { offline: true, capturing: false })).toBe('No connection. This page shows what the server sent on 2 Dec 2026, 07:05; it may have changed since.');
    expect(offlineCopyWords(since, { offline: true, capturing: true })).toBe(
      'No connection. This page shows what the server sent on 2 Dec 2026, 07:05; it may have changed since. Readings and photos you capture are saved on this phone and sent when the connection returns.',
    );
  });

  it('a kept copy served while the phone thinks it is online says it is the copy, from when', () => {
    expect(offlineCopyWords(since, { offline: false, capturing: false })).toBe('The server did not answer in time. This page is the copy kept on this phone on 2 Dec 2026, 07:05; it may have changed since.');
  });

  it('a time it cannot read is said as unknown, never as a made-up date', () => {
    expect(offlineCopyWords(new Date('not a date'), { offline: true, capturing: false })).toContain('what the server sent at an unknown time;');
  });
});

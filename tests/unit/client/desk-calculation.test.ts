import { describe, expect, it } from 'vitest';
import { DeskCalculationError, initialDeskAnswer, settleDeskAnswer, type DeskComputed, type DeskQueryState } from '@/lib/client/desk-calculation';
import { unlessAborted } from '@/lib/client/unless-aborted';

// Stand-ins: the answer logic only passes results along, it never reads them.
const first = { result: null, error: null, notices: [], options: [], impressedCurrent: null } as unknown as DeskComputed;
const second = { ...first } as DeskComputed;

const success = (data: DeskComputed, isPlaceholderData = false): DeskQueryState => ({ status: 'success', data, isPlaceholderData, error: null });
const failure = (error: Error): DeskQueryState => ({ status: 'error', data: undefined, isPlaceholderData: false, error });
const pending = (placeholder?: DeskComputed): DeskQueryState => ({ status: placeholder ? 'success' : 'pending', data: placeholder, isPlaceholderData: Boolean(placeholder), error: null });

describe('the desk answer', () => {
  it('keeps the page results until the first answer', () => {
    const start = initialDeskAnswer(first);
    expect(settleDeskAnswer(start, success(first))).toBe(start);
    expect(settleDeskAnswer(start, pending())).toBe(start);
    expect(settleDeskAnswer(start, pending(first))).toBe(start);
  });

  it('takes the results for the current inputs, not a placeholder', () => {
    const start = initialDeskAnswer(first);
    expect(settleDeskAnswer(start, pending(second))).toBe(start);
    const next = settleDeskAnswer(start, success(second));
    expect(next).toEqual({ computed: second, fieldErrors: {}, message: null });
    expect(settleDeskAnswer(next, success(second))).toBe(next);
  });

  it('shows a refusal beside the fields and keeps the last results that could be sized', () => {
    const refused = new DeskCalculationError('Some fields need attention.', { 'surfaces.0.areaM2': ['The area must be more than 0 m².'] });
    const answer = settleDeskAnswer(initialDeskAnswer(first), failure(refused));
    expect(answer).toEqual({ computed: first, fieldErrors: { 'surfaces.0.areaM2': ['The area must be more than 0 m².'] }, message: 'Some fields need attention.' });
    expect(settleDeskAnswer(answer, failure(refused))).toBe(answer);
    // While the next inputs are being computed, the messages stay (no flicker while typing).
    expect(settleDeskAnswer(answer, pending(first))).toBe(answer);
    // Valid inputs again: results replace the messages.
    expect(settleDeskAnswer(answer, success(second))).toEqual({ computed: second, fieldErrors: {}, message: null });
  });

  it('shows any other failure as a message with no field messages', () => {
    const answer = settleDeskAnswer(initialDeskAnswer(null), failure(new Error('Failed to fetch')));
    expect(answer).toEqual({ computed: null, fieldErrors: {}, message: 'Failed to fetch' });
  });
});

describe('unlessAborted', () => {
  it('settles as the work does while the signal stays quiet', async () => {
    const controller = new AbortController();
    await expect(unlessAborted(Promise.resolve(4), controller.signal)).resolves.toBe(4);
    await expect(unlessAborted(Promise.reject(new Error('refused')), controller.signal)).rejects.toThrow('refused');
  });

  it('rejects with the reason as soon as the signal aborts, whatever the work does later', async () => {
    const controller = new AbortController();
    let finish!: (value: number) => void;
    const waiting = unlessAborted(new Promise<number>((resolve) => (finish = resolve)), controller.signal);
    controller.abort(new Error('superseded'));
    finish(4);
    await expect(waiting).rejects.toThrow('superseded');
  });

  it('does not start waiting on a signal already aborted', async () => {
    const controller = new AbortController();
    controller.abort(new Error('superseded'));
    await expect(unlessAborted(Promise.resolve(4), controller.signal)).rejects.toThrow('superseded');
  });
});

import { afterEach, describe, expect, it, vi } from 'vitest';

// The queue's database open, with `idb` stood in for: the first open is refused (storage full, private mode),
// the next succeeds.
const openDB = vi.fn();
vi.mock('idb', () => ({ openDB: (...args: unknown[]) => openDB(...args) }));

afterEach(() => {
  openDB.mockReset();
  vi.resetModules();
});

describe('the capture database', () => {
  it('does not keep a refused open: the next call opens again and saves', async () => {
    const put = vi.fn(async () => undefined);
    openDB.mockRejectedValueOnce(new DOMException('The quota has been exceeded.', 'QuotaExceededError')).mockResolvedValueOnce({ put });
    const { putItem, captureDb } = await import('@/lib/offline/capture-db');
    await expect(captureDb()).rejects.toThrow(/quota/);
    const item = { deviceId: 'd1' } as Parameters<typeof putItem>[0];
    await putItem(item);
    expect(openDB).toHaveBeenCalledTimes(2);
    expect(put).toHaveBeenCalledWith('items', item);
  });

  it('keeps a good open: one database for every call', async () => {
    openDB.mockResolvedValue({ get: vi.fn(async () => undefined) });
    const { captureDb } = await import('@/lib/offline/capture-db');
    await captureDb();
    await captureDb();
    expect(openDB).toHaveBeenCalledTimes(1);
  });

  it('signing out never takes storage it cannot read as "nothing waits": the count is unknown (null), not 0', async () => {
    openDB.mockRejectedValue(new DOMException('The database connection is closing.', 'InvalidStateError'));
    const { unsentOnThisPhone } = await import('@/lib/offline/sign-out');
    expect(await unsentOnThisPhone()).toBeNull();
  });

  it('counts the items still waiting or needing the member, not the sent ones', async () => {
    const items = [{ state: 'waiting' }, { state: 'sending' }, { state: 'conflict' }, { state: 'sent' }];
    openDB.mockResolvedValue({ getAll: vi.fn(async () => items) });
    const { unsentOnThisPhone } = await import('@/lib/offline/sign-out');
    expect(await unsentOnThisPhone()).toBe(3);
  });
});

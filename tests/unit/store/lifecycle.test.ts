import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { openDB } from 'idb';
import { describeStorageError, eraseStore, openStore, validateDraft, emptyDraft, StoreError, DB_VERSION } from '../../../src/store';

const names: string[] = [];
function freshName(): string {
  const n = `rodside-life-${Date.now()}-${Math.random().toString(16).slice(2)}`;
  names.push(n);
  return n;
}
afterEach(async () => {
  vi.restoreAllMocks();
  while (names.length) await eraseStore(names.pop()!);
});

describe('a tab running an older version', () => {
  it('is told to reload when a newer version opens the database, instead of hanging the upgrade', async () => {
    const name = freshName();
    const onVersionChange = vi.fn();
    const older = await openStore(name, { onVersionChange });
    // A newer build of the app opens the same database at a higher version.
    const newer = await openDB(name, DB_VERSION + 1, { upgrade() {} });
    expect(onVersionChange).toHaveBeenCalledTimes(1);
    expect(newer.version).toBe(DB_VERSION + 1);
    newer.close();
    // The old connection was closed: its writes fail with a plain message, not silently.
    const v = validateDraft({ ...emptyDraft(), name: 'x', rodFieldRadius: '4', rodLength: '150', rfFrequency: '1', maxRfAmplitude: '1000', axialEnergy: '5' });
    if (!v.ok) throw new Error('valid draft expected');
    await expect(older.saveInstrument(v.fields)).rejects.toThrow(/Reload this tab/);
  });

  it('an upgrade held up by another open connection reports that it is blocked', async () => {
    const name = freshName();
    // An "old tab" that does not close on versionchange.
    const stubborn = await openDB(name, 1, { upgrade(db) { db.createObjectStore('instruments', { keyPath: 'id' }); db.createObjectStore('settings', { keyPath: 'key' }); } });
    const onBlocked = vi.fn();
    const opening = openStore(name, { onBlocked });
    await vi.waitFor(() => expect(onBlocked).toHaveBeenCalled());
    stubborn.close();
    const store = await opening;
    expect(store.db.version).toBe(DB_VERSION);
    store.close();
  });
});

describe('failed writes give a plain message', () => {
  it('maps a quota error to a sentence that says the input is kept', () => {
    const e = describeStorageError('save the instrument profile', new DOMException('full', 'QuotaExceededError'));
    expect(e).toBeInstanceOf(StoreError);
    expect(e.userMessage).toMatch(/^Could not save the instrument profile: this device has no storage space left/);
    expect(e.userMessage).toMatch(/What you typed is still here/);
  });

  it('a quota failure during save rejects with that message and stores nothing', async () => {
    const store = await openStore(freshName());
    const proto = Object.getPrototypeOf(store.db.transaction('instruments').store) as { put: (...a: unknown[]) => unknown };
    vi.spyOn(proto, 'put').mockImplementation(() => {
      throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    });
    const v = validateDraft({ ...emptyDraft(), name: 'Quota test', rodFieldRadius: '4', rodLength: '150', rfFrequency: '1', maxRfAmplitude: '1000', axialEnergy: '5' });
    if (!v.ok) throw new Error('valid draft expected');
    await expect(store.saveInstrument(v.fields)).rejects.toMatchObject({ userMessage: expect.stringMatching(/no storage space left/) });
    vi.restoreAllMocks();
    expect(await store.listInstruments()).toEqual([]);
    store.close();
  });
});

describe('a page put away in the back/forward cache (suspend)', () => {
  const draft = () => {
    const v = validateDraft({ ...emptyDraft(), name: 'Suspended', rodFieldRadius: '4', rodLength: '150', rfFrequency: '1', maxRfAmplitude: '1000', axialEnergy: '5' });
    if (!v.ok) throw new Error('valid draft expected');
    return v.fields;
  };

  it('aborts a read still running, so a write from another page is not held up behind it', async () => {
    const name = freshName();
    const page = await openStore(name);
    await page.saveInstrument(draft());
    // A read the page started and has not finished (its callbacks never ran: the page was frozen).
    const reading = page.db.transaction(['instruments', 'visits', 'readings'], 'readonly');
    const pending = reading.objectStore('instruments').getAll();
    page.suspend('cached');
    await expect(reading.done).rejects.toMatchObject({ name: 'AbortError' });
    await pending.catch(() => undefined);
    // The next page writes at once and reads what the first page saved.
    const next = await openStore(name);
    await next.loadDemo();
    expect((await next.listInstruments()).map((p) => p.name)).toContain('Suspended');
    next.close();
  });

  it('going for good (unload), lets a write still running finish: nothing typed is lost', async () => {
    const name = freshName();
    const page = await openStore(name);
    const saving = page.saveInstrument(draft());
    page.suspend('unload');
    const saved = await saving;
    const next = await openStore(name);
    expect(await next.getInstrument(saved.id)).toMatchObject({ name: 'Suspended' });
    next.close();
  });

  it('tracks the reads idb opens for its shortcut methods too (db.get, db.getAll…)', async () => {
    const name = freshName();
    const page = await openStore(name);
    const read = page.db.getAll('instruments');
    page.suspend('unload');
    await expect(read).rejects.toMatchObject({ name: 'AbortError' });
  });

  it('frozen in the cache, aborts a write too, and the caller is told it was not saved', async () => {
    const name = freshName();
    const page = await openStore(name);
    // The write that marks a visit in use, started as the page was left: frozen, it would hold that store for good.
    const saving = page.setSetting('some-mark', { visitId: 'v1' });
    page.suspend('cached');
    await expect(saving).rejects.toMatchObject({ userMessage: expect.stringMatching(/save a setting/i) });
    const next = await openStore(name);
    // Nothing is held: the next page reads and writes that store at once.
    expect(await next.getSetting('some-mark')).toBeUndefined();
    await next.setSetting('some-mark', 1);
    expect(await next.getSetting('some-mark')).toBe(1);
    next.close();
  });
});

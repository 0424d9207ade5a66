// The one hook behind every form that keeps a draft: the visit form, the instrument profile form, the reading
// entry, the leak check and the calculator inputs. It loads the kept copy (typing before it arrives wins), keeps
// every change on the device, and when the device refuses a write it says so beside the form and keeps the
// input on screen: nothing typed is ever dropped without a word.
import { useEffect, useRef, useState } from 'preact/hooks';
import type { Store } from '../../store';
import { useApp } from '../context';
import { markSaved, markUnsaved } from '../offline';

export interface DraftOptions<T> {
  /** Where the copy is kept (one key per form and record). */
  key: string;
  /** What the form starts from when nothing is kept (or the kept copy is not usable). */
  initial: () => T;
  /** The form in words, for the "unsaved input" mark that holds back an app update ("the visit form"). */
  what: string;
  /** False while the form cannot start yet (e.g. the profile being edited is still unknown). */
  ready?: boolean;
  /** Whether a kept copy can still be shown by this form (e.g. its reading type still exists). */
  accept?: (kept: T) => boolean;
  /** Bring a kept copy of an older shape up to date before it is checked and shown (e.g. a retired reading type). */
  revive?: (kept: T) => T;
  /** 'blank' (default): value is null until the kept copy is read. 'initial': show initial() at once. */
  whileLoading?: 'blank' | 'initial';
  /** 'draft' (default): the drafts store, marked unsaved until cleared. 'setting': calculator inputs kept as settings. */
  kind?: 'draft' | 'setting';
  /** False: changes are shown but not written (nothing to keep them under). Default true. */
  keep?: boolean;
  /** False: a scratch form with no "save" step, never marked as unsaved input (default true for drafts). */
  unsaved?: boolean;
  /** Whether a restored copy counts as unsaved input (default: always). */
  unsavedWhenRestored?: (kept: T) => boolean;
}

export interface Draft<T> {
  /** The input on screen; null only while a 'blank' draft is being read. */
  value: T | null;
  /** A kept copy was found and shown. */
  restored: boolean;
  /** Why the last write of the copy failed, in a sentence for the screen; null when it is kept. */
  problem: string | null;
  /** The latest value, even between renders (two inputs in one frame never overwrite each other). */
  latest(): T | null;
  /** Change the input: merged into the latest value, shown, kept and marked unsaved. Returns the new value. */
  update(patch: Partial<T> | ((current: T) => T)): T;
  /** Show and keep `next` without marking it unsaved (e.g. the blank form after a reading was saved). */
  replace(next: T): Promise<void>;
  /** The input was saved for real (or discarded): drop the kept copy. A failure is shown, never swallowed. */
  clear(): Promise<void>;
}

/** A short reason for a storage failure (the store's own sentences are longer than fits beside a form). */
export function storageReason(err: unknown): string {
  const cause = (err as { cause?: unknown } | null)?.cause ?? err;
  const name = (cause as { name?: string } | null)?.name ?? '';
  if (name === 'QuotaExceededError') return 'this device has no storage space left for Rodside';
  if (name === 'InvalidStateError' || name === 'TransactionInactiveError') return 'the database was closed, probably because Rodside was updated in another tab';
  const text = cause instanceof Error ? cause.message : String(cause);
  return (text || name || 'the device refused the write').replace(/[.\s]+$/, '');
}

export function draftProblemText(err: unknown): string {
  return `Couldn't save your draft on this device: ${storageReason(err)}. Your input is still here; keep this screen open and try again, or note it elsewhere before you leave.`;
}

function readKept<T>(store: Store, kind: 'draft' | 'setting', key: string): Promise<T | undefined> {
  return kind === 'setting' ? store.getSetting<T>(key) : store.getDraft<T>(key);
}
function writeKept(store: Store, kind: 'draft' | 'setting', key: string, value: unknown): Promise<void> {
  return kind === 'setting' ? store.setSetting(key, value) : store.putDraft(key, value);
}

export function useDraft<T>(options: DraftOptions<T>): Draft<T> {
  const { store } = useApp();
  const { key, ready = true, whileLoading = 'blank', kind = 'draft' } = options;
  const opts = useRef(options);
  opts.current = options;
  const [state, setState] = useState<{ key: string; value: T | null; restored: boolean }>(() => ({
    key, value: whileLoading === 'initial' ? options.initial() : null, restored: false,
  }));
  const [problem, setProblem] = useState<string | null>(null);
  const latest = useRef<T | null>(state.value);
  const typedSinceLoad = useRef(false);
  // Only the newest write decides what is shown: an older failure must not hide a newer success, nor the reverse.
  const writes = useRef(0);
  // The copy this tab last put on the device (or found there). Another tab editing the same record shares the key:
  // a save here must not delete input that tab kept since (see clear()).
  const lastKept = useRef<string | null>(null);

  // A new key (another record or profile) starts over.
  if (state.key !== key) {
    const value = whileLoading === 'initial' ? options.initial() : null;
    latest.current = value;
    typedSinceLoad.current = false;
    setState({ key, value, restored: false });
  }

  useEffect(() => {
    if (!ready) return;
    let live = true;
    const o = opts.current;
    const start = () => {
      if (!live || typedSinceLoad.current) return;
      const value = o.initial();
      latest.current = value;
      setState({ key, value, restored: false });
    };
    if (!store) {
      if (latest.current === null) start();
      return;
    }
    readKept<T>(store, kind, key).then((found) => {
      if (!live || typedSinceLoad.current) return;
      const kept = found !== undefined && found !== null && o.revive ? o.revive(found) : found;
      if (kept !== undefined && kept !== null && (o.accept?.(kept) ?? true)) {
        const value = whileLoading === 'initial' && typeof kept === 'object' && !Array.isArray(kept) ? { ...o.initial(), ...kept } : kept;
        latest.current = value;
        lastKept.current = JSON.stringify(kept);
        setState({ key, value, restored: true });
        if (kind === 'draft' && o.unsaved !== false && (o.unsavedWhenRestored?.(kept) ?? true)) markUnsaved(key, o.what);
      } else start();
    }, (err: unknown) => {
      if (!live) return;
      setProblem(`Couldn't read the input kept on this device: ${storageReason(err)}. It stays there; the form starts empty.`);
      start();
    });
    return () => {
      live = false;
    };
  }, [store, key, ready, kind, whileLoading]);

  // Leaving the form keeps the copy; only the "unsaved" mark that holds back an update goes with the screen.
  useEffect(() => () => markSaved(key), [key]);

  function write(value: T): Promise<void> {
    if (!store || opts.current.keep === false) return Promise.resolve();
    const n = ++writes.current;
    return writeKept(store, kind, key, value).then(
      () => {
        lastKept.current = JSON.stringify(value);
        if (n === writes.current) setProblem(null);
      },
      (err: unknown) => { if (n === writes.current) setProblem(draftProblemText(err)); },
    );
  }

  function show(value: T) {
    latest.current = value;
    setState((s) => ({ ...s, key, value }));
  }

  return {
    value: state.key === key ? state.value : latest.current,
    restored: state.restored,
    problem,
    latest: () => latest.current,
    update(patch) {
      typedSinceLoad.current = true;
      const current = latest.current ?? opts.current.initial();
      const next = typeof patch === 'function' ? patch(current) : ({ ...current, ...patch } as T);
      show(next);
      if (kind === 'draft' && opts.current.unsaved !== false) markUnsaved(key, opts.current.what);
      void write(next);
      return next;
    },
    async replace(next) {
      typedSinceLoad.current = true;
      show(next);
      await write(next);
      markSaved(key);
    },
    async clear() {
      markSaved(key);
      if (!store) return;
      writes.current += 1;
      try {
        // Two tabs on one record share this copy. If the copy on the device is not the one this tab kept, the other
        // tab has typed since: leave it for that tab (its reload restores it). The later save wins either way.
        const onDevice = await store.getDraft<unknown>(key);
        if (onDevice !== undefined && JSON.stringify(onDevice) === lastKept.current) await store.clearDraft(key);
        lastKept.current = null;
        setProblem(null);
      } catch (err) {
        // The input was saved; only the spare copy stays behind. Say so: it would come back as a restored draft.
        setProblem(`Saved, but the spare copy of this form could not be removed from this device: ${storageReason(err)}. It may come back as restored input; discard it then.`);
      }
    },
  };
}

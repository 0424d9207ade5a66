// Service worker registration, update offers and storage persistence: one small module.
// An update is never applied on its own: the user agrees, and never while a form holds unsaved input.
import { Workbox } from 'workbox-window';

export interface OfflineState {
  /** A new version is installed and waiting for the user's agreement. */
  updateReady: boolean;
  /** The app shell is cached and will open without a network. */
  offlineReady: boolean;
  /** Result of the persistent-storage request: true kept, false may be evicted, null unknown/unsupported. */
  persisted: boolean | null;
  /** False until the persistent-storage request has answered (the status line keeps its place meanwhile). */
  persistenceChecked: boolean;
  /** Message to show after a refused update (unsaved input). */
  updateBlockedReason: string | null;
}

type Listener = (s: OfflineState) => void;

let state: OfflineState = { updateReady: false, offlineReady: false, persisted: null, persistenceChecked: false, updateBlockedReason: null };
const listeners = new Set<Listener>();
let wb: Workbox | null = null;

/** Forms register here while they hold input that is not yet saved. */
const unsaved = new Map<string, string>();

function set(patch: Partial<OfflineState>): void {
  state = { ...state, ...patch };
  listeners.forEach((l) => l(state));
}

export function getOfflineState(): OfflineState {
  return state;
}

export function subscribeOffline(l: Listener): () => void {
  listeners.add(l);
  l(state);
  return () => void listeners.delete(l);
}

export function markUnsaved(key: string, description: string): void {
  unsaved.set(key, description);
}

export function markSaved(key: string): void {
  unsaved.delete(key);
  if (unsaved.size === 0 && state.updateBlockedReason) set({ updateBlockedReason: null });
}

export function unsavedDescriptions(): string[] {
  return [...unsaved.values()];
}

export async function requestPersistence(): Promise<boolean | null> {
  const storage = navigator.storage;
  if (!storage?.persist) {
    set({ persisted: null, persistenceChecked: true });
    return null;
  }
  try {
    const already = await storage.persisted();
    const granted = already || (await storage.persist());
    set({ persisted: granted, persistenceChecked: true });
    return granted;
  } catch {
    set({ persisted: null, persistenceChecked: true });
    return null;
  }
}

export function registerServiceWorker(): void {
  if (!('serviceWorker' in navigator) || import.meta.env.DEV) return;
  wb = new Workbox('/sw.js', { scope: '/' });
  // `waiting` can arrive for a worker that was already waiting before this page registered: keep those too.
  wb.addEventListener('waiting', () => set({ updateReady: true }));
  wb.addEventListener('activated', (event) => {
    if (!event.isUpdate) set({ offlineReady: true });
  });
  wb.addEventListener('controlling', (event) => {
    if (event.isUpdate) window.location.reload();
  });
  void wb.register().then((reg) => {
    if (reg?.active) set({ offlineReady: true });
    if (reg?.waiting && navigator.serviceWorker.controller) set({ updateReady: true });
  });
  // Look for a new version when the app comes back to the foreground, and hourly while open.
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'visible') void wb?.update();
  });
  setInterval(() => void wb?.update(), 60 * 60 * 1000);
}

/** Apply a waiting update if the user agreed and nothing is unsaved. Returns false when refused. */
export function applyUpdate(): boolean {
  const pending = unsavedDescriptions();
  if (pending.length > 0) {
    set({ updateBlockedReason: `Save or discard first: ${pending.join('; ')}. The update waits until then.` });
    return false;
  }
  if (!wb) return false;
  wb.messageSkipWaiting();
  // Home-screen apps on some platforms never fire `controlling`: reload after a short wait anyway.
  setTimeout(() => window.location.reload(), 3000);
  return true;
}

export function dismissUpdate(): void {
  set({ updateReady: false, updateBlockedReason: null });
}

// A small history router: every area has its own path, so deep links and reloads land in the right place
// (the service worker serves index.html for any navigation while offline).
import { useEffect, useState } from 'preact/hooks';

type Listener = (path: string) => void;
const listeners = new Set<Listener>();

/** Guards that may refuse a navigation (e.g. unsaved input); return a message to refuse, null to allow. */
const leaveGuards = new Set<() => string | null>();

export function currentPath(): string {
  return location.pathname.replace(/\/+$/, '') || '/';
}

export function currentQuery(): URLSearchParams {
  return new URLSearchParams(location.search);
}

export function navigate(to: string, opts: { replace?: boolean } = {}): void {
  const target = new URL(to, location.href);
  if (target.origin !== location.origin) return;
  const href = target.pathname + target.search + target.hash;
  if (href === location.pathname + location.search + location.hash) return;
  if (opts.replace) history.replaceState(null, '', href);
  else history.pushState(null, '', href);
  const path = currentPath();
  listeners.forEach((l) => l(path));
  window.scrollTo(0, 0);
}

export function addLeaveGuard(guard: () => string | null): () => void {
  leaveGuards.add(guard);
  return () => leaveGuards.delete(guard);
}

export function startRouter(): void {
  window.addEventListener('popstate', () => {
    const path = currentPath();
    listeners.forEach((l) => l(path));
  });
  // Intercept same-origin link clicks so the app does not reload.
  document.addEventListener('click', (event) => {
    if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
    const anchor = (event.target as Element | null)?.closest?.('a');
    if (!anchor || anchor.target || anchor.hasAttribute('download')) return;
    const href = anchor.getAttribute('href');
    if (!href || href.startsWith('#') || /^[a-z]+:/i.test(href)) return;
    event.preventDefault();
    navigate(href);
  });
}

export function usePath(): string {
  const [path, setPath] = useState(currentPath());
  useEffect(() => {
    const l: Listener = (p) => setPath(p);
    listeners.add(l);
    return () => void listeners.delete(l);
  }, []);
  return path;
}

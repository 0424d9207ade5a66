// Field mode: a device setting for gloves and bright plant rooms (56 px touch targets, larger result type, a
// high-contrast light theme). Kept per device in localStorage, apart from the record store: it belongs to the
// phone, not to the instruments or visits.
import { useEffect, useState } from 'preact/hooks';

const KEY = 'rodside:field-mode';
/** Fired on window when field mode changes, so canvas charts redraw in the new palette. */
export const FIELD_MODE_EVENT = 'rodside:field-mode';

export function fieldModeKept(): boolean {
  try {
    return localStorage.getItem(KEY) === 'on';
  } catch {
    return false; // storage blocked: the ordinary look, which the toggle can still change for this session
  }
}

export function fieldModeActive(): boolean {
  return typeof document !== 'undefined' && document.documentElement.hasAttribute('data-field-mode');
}

export function applyFieldMode(on: boolean): void {
  if (typeof document === 'undefined') return;
  document.documentElement.toggleAttribute('data-field-mode', on);
}

/** Switch field mode; returns false when the device would not keep the choice (it still applies until reload). */
export function setFieldMode(on: boolean): boolean {
  applyFieldMode(on);
  window.dispatchEvent(new Event(FIELD_MODE_EVENT));
  try {
    localStorage.setItem(KEY, on ? 'on' : 'off');
    return true;
  } catch {
    return false;
  }
}

/** [on, set]: the device's field mode, applied to the page on first use. */
export function useFieldMode(): [boolean, (on: boolean) => boolean] {
  const [on, setOn] = useState(() => {
    const kept = fieldModeKept();
    applyFieldMode(kept);
    return kept;
  });
  useEffect(() => {
    const sync = () => setOn(fieldModeActive());
    window.addEventListener(FIELD_MODE_EVENT, sync);
    return () => window.removeEventListener(FIELD_MODE_EVENT, sync);
  }, []);
  return [on, (next: boolean) => {
    setOn(next);
    return setFieldMode(next);
  }];
}

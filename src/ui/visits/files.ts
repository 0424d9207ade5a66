// Getting a file off the device: the share sheet where the browser offers one for files, else a download.
import { formatDateTime } from '../locale';

export type SaveOutcome = 'shared' | 'downloaded' | 'cancelled';

export function canShareFiles(): boolean {
  try {
    const probe = new File(['x'], 'probe.txt', { type: 'text/plain' });
    return typeof navigator.share === 'function' && typeof navigator.canShare === 'function' && navigator.canShare({ files: [probe] });
  } catch {
    return false;
  }
}

export function downloadText(name: string, mime: string, text: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: mime }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Give the browser time to start the download before the URL goes.
  setTimeout(() => URL.revokeObjectURL(url), 30_000);
}

export async function shareOrDownload(name: string, mime: string, text: string, share: boolean): Promise<SaveOutcome> {
  if (share && canShareFiles()) {
    try {
      await navigator.share({ files: [new File([text], name, { type: mime })], title: name });
      return 'shared';
    } catch (err) {
      if ((err as { name?: string }).name === 'AbortError') return 'cancelled';
      // Some browsers refuse certain file types: fall back to a download.
    }
  }
  downloadText(name, mime, text);
  return 'downloaded';
}

export function stamp(d = new Date()): string {
  return d.toISOString().slice(0, 16).replace(/[-:]/g, '').replace('T', '-');
}

/** ISO instant → the value a datetime-local input shows, in the device's time zone. */
export function toLocalInput(iso: string): string {
  const d = new Date(iso);
  if (!Number.isFinite(d.getTime())) return '';
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

/**
 * ISO instant → "2 Dec 2026, 16:03" in the device's time zone: day, month as a word and a 24-hour clock read the
 * same way everywhere. Built by hand rather than with Intl.DateTimeFormat, whose first use loads locale data and
 * costs a long task on a phone (measured at several hundred ms on a throttled start-up trace).
 */
export function showDate(iso: string): string {
  const d = new Date(iso);
  if (!Number.isFinite(d.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getDate()} ${MONTHS[d.getMonth()]} ${d.getFullYear()}, ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

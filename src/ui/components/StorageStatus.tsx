import { useEffect, useState } from 'preact/hooks';
import { requestPersistence, subscribeOffline, type OfflineState } from '../offline';

type Shown = 'checking' | 'kept' | 'not-kept' | 'unknown';

/**
 * Whether the browser promised to keep Rodside's data, and what that means for the user.
 * The answer arrives after the first paint, so every variant is laid out in the same place (one grid cell) and only
 * the current one is visible: the block is as tall as its tallest variant from the start and nothing below it jumps.
 */
export function StorageStatus() {
  const [s, setS] = useState<OfflineState | null>(null);
  useEffect(() => subscribeOffline(setS), []);
  const persisted = s?.persisted ?? null;
  const shown: Shown = !s?.persistenceChecked ? 'checking' : persisted === true ? 'kept' : persisted === false ? 'not-kept' : 'unknown';
  const variant = (which: Shown) =>
    which === shown ? { class: 'stack-item' } : { class: 'stack-item stack-hidden', 'aria-hidden': 'true' as const, inert: true };
  return (
    <div class="storage-status stack" data-testid="storage-status" data-persisted={shown === 'checking' ? 'checking' : String(persisted)}>
      <div {...variant('checking')}>
        <p>… <strong>Storage:</strong> asking the browser whether it will keep Rodside's data.</p>
      </div>
      <div {...variant('kept')}>
        <p>✓ <strong>Storage kept:</strong> the browser has agreed not to clear Rodside's data to free space. Export a backup now and then all the same.</p>
      </div>
      <div {...variant('not-kept')}>
        <p>! <strong>Storage not guaranteed:</strong> the browser may clear Rodside's data when the device runs short of space, or after some weeks without use on some phones. Install Rodside to the home screen and export backups regularly.</p>
        <button type="button" class="btn btn-small" onClick={() => void requestPersistence()}>Ask the browser again to keep it</button>
      </div>
      <div {...variant('unknown')}>
        <p>? <strong>Storage state unknown:</strong> this browser does not say whether it keeps site data. Export backups regularly.</p>
      </div>
    </div>
  );
}

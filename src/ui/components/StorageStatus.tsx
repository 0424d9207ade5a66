import { useEffect, useState } from 'preact/hooks';
import { requestPersistence, subscribeOffline, type OfflineState } from '../offline';

/** Whether the browser promised to keep Rodside's data, and what that means for the user. */
export function StorageStatus() {
  const [s, setS] = useState<OfflineState | null>(null);
  useEffect(() => subscribeOffline(setS), []);
  const persisted = s?.persisted ?? null;
  return (
    <div class="storage-status" data-testid="storage-status" data-persisted={String(persisted)}>
      {persisted === true && (
        <p>✓ <strong>Storage kept:</strong> the browser has agreed not to clear Rodside's data to free space. Export a backup now and then all the same.</p>
      )}
      {persisted === false && (
        <>
          <p>! <strong>Storage not guaranteed:</strong> the browser may clear Rodside's data when the device runs short of space, or after some weeks without use on some phones. Install Rodside to the home screen and export backups regularly.</p>
          <button type="button" class="btn btn-small" onClick={() => void requestPersistence()}>Ask the browser again to keep it</button>
        </>
      )}
      {persisted === null && (
        <p>? <strong>Storage state unknown:</strong> this browser does not say whether it keeps site data. Export backups regularly.</p>
      )}
    </div>
  );
}

import { useEffect, useState } from 'preact/hooks';
import { applyUpdate, dismissUpdate, subscribeOffline, type OfflineState } from '../offline';

/** Offers a waiting new version; applies it only when the user agrees and nothing is unsaved. */
export function UpdateBanner() {
  const [s, setS] = useState<OfflineState | null>(null);
  useEffect(() => subscribeOffline(setS), []);
  if (!s?.updateReady) return null;
  return (
    <div class="banner banner-update" role="region" aria-label="Update ready" data-testid="update-ready">
      <p>
        <strong>A new version of Rodside is ready.</strong> It takes effect when you choose; your data stays on this device.
      </p>
      {s.updateBlockedReason && <p class="field-error" role="alert">{s.updateBlockedReason}</p>}
      <div class="row">
        <button type="button" class="btn btn-primary" onClick={() => applyUpdate()}>Update now</button>
        <button type="button" class="btn" onClick={() => dismissUpdate()}>Later</button>
      </div>
    </div>
  );
}

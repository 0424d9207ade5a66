// Backup, restore, CSV and the reminder. Restore checks the whole file first and changes nothing if any part is wrong.
import { useEffect, useState } from 'preact/hooks';
import type { BackupReminder, ImportResult } from '../../store';
import { useApp } from '../context';
import { canShareFiles, shareOrDownload, stamp } from './files';
import { errorText } from '../errorText';
import { ConfirmAction } from '../components/ConfirmAction';

/** Fired on window after a backup was saved or shared, so every reminder on screen updates. */
const BACKUP_SAVED_EVENT = 'rodside:backup-saved';

/** `initial`: a status the screen already read, so the note is in place at the first render instead of arriving late. */
export function BackupReminderNote(props: { initial?: BackupReminder | null } = {}) {
  const { store } = useApp();
  const [status, setStatus] = useState<BackupReminder | null>(props.initial ?? null);
  useEffect(() => {
    if (!store) return;
    // The reminder is a nudge: if its date cannot be read, the note stays away and the console says why (the
    // Backup panel itself shows the failure where the user acts on it).
    const refresh = () => void store.backupStatus().then(setStatus).catch((err: unknown) => {
      setStatus(null);
      console.warn('Backup reminder: the last backup date could not be read.', err);
    });
    refresh();
    window.addEventListener(BACKUP_SAVED_EVENT, refresh);
    return () => window.removeEventListener(BACKUP_SAVED_EVENT, refresh);
  }, [store]);
  if (!status?.due) return null;
  return (
    <div class="card reminder" role="note" data-testid="backup-reminder">
      <div class="reminder-line">
        <p><strong>⚠ Time for a backup.</strong></p>
        <a class="btn btn-small" href="/visits#backup">Back up now</a>
      </div>
      <details class="reminder-why"><summary>Why now</summary><p>{status.message}</p></details>
    </div>
  );
}

export function BackupPanel() {
  const { store, notify, reloadInstruments } = useApp();
  const [status, setStatus] = useState<BackupReminder | null>(null);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<ImportResult | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const share = canShareFiles();

  const refresh = () => void store?.backupStatus().then(setStatus).catch((err: unknown) => setProblem(`The last backup date could not be read: ${errorText(err)}`));
  useEffect(refresh, [store]);

  async function exportBackup(viaShare: boolean) {
    if (!store) return;
    setBusy(true);
    setProblem(null);
    try {
      const text = await store.exportBackup();
      const outcome = await shareOrDownload(`rodside-backup-${stamp()}.json`, 'application/json', text, viaShare);
      if (outcome !== 'cancelled') {
        await store.noteBackupSaved();
        window.dispatchEvent(new Event(BACKUP_SAVED_EVENT));
        notify(outcome === 'shared' ? 'Backup shared.' : 'Backup downloaded. Keep the file somewhere other than this device.');
        refresh();
      }
    } catch (err) {
      setProblem(errorText(err));
    } finally {
      setBusy(false);
    }
  }

  async function exportCsv(viaShare: boolean) {
    if (!store) return;
    try {
      const text = await store.readingsCsv();
      await shareOrDownload(`rodside-readings-${stamp()}.csv`, 'text/csv;charset=utf-8', text, viaShare);
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  async function restore(file: File | undefined) {
    if (!store || !file) return;
    setBusy(true);
    setProblem(null);
    setResult(null);
    try {
      const text = await file.text();
      const r = await store.importBackup(text);
      setResult(r);
      await reloadInstruments();
      notify(`Backup restored: ${r.added} added, ${r.updated} updated, ${r.unchanged} unchanged.`);
    } catch (err) {
      // A refused backup already says it was not restored and nothing changed; say it once.
      const words = errorText(err);
      setProblem(/was not restored/.test(words) ? words : `The backup was not restored and nothing on this device changed. ${words}`);
    } finally {
      setBusy(false);
    }
  }

  async function eraseEverything() {
    if (!store) return;
    try {
      await store.eraseAll();
      await reloadInstruments();
      setResult(null);
      notify('Everything on this device was erased.');
      refresh();
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  return (
    <section class="card" id="backup" data-testid="backup-panel">
      <h2 class="card-title">Backup and export</h2>
      <p class="muted">
        Everything lives only on this device. {status?.daysSince != null ? status.message : 'No backup has been exported from this device yet.'}{' '}
        Browsers may delete a site’s data without asking; keep a backup file elsewhere.
      </p>
      <div class="row">
        <button type="button" class="btn btn-primary" disabled={busy || !store} onClick={() => exportBackup(false)}>Download backup</button>
        {share && <button type="button" class="btn" disabled={busy || !store} onClick={() => exportBackup(true)}>Share backup…</button>}
        <button type="button" class="btn" disabled={!store} onClick={() => exportCsv(false)}>Readings as CSV</button>
        {share && <button type="button" class="btn" disabled={!store} onClick={() => exportCsv(true)}>Share CSV…</button>}
      </div>
      <div class="field file-pick">
        <label for="backup-file">Restore from a backup file</label>
        <input id="backup-file" type="file" accept=".json,application/json" disabled={busy || !store}
          onChange={(e) => { const input = e.target as HTMLInputElement; void restore(input.files?.[0]).finally(() => { input.value = ''; }); }} />
        <p class="hint">Records are merged by id: nothing on this device is deleted, and a damaged file changes nothing.</p>
      </div>
      {result && (
        <p data-testid="restore-result" role="status">✓ Restored: {result.added} added, {result.updated} updated, {result.unchanged} unchanged.</p>
      )}
      {problem && <p class="banner banner-problem" role="alert" data-testid="backup-problem">{problem}</p>}
      <details>
        <summary>Erase this device</summary>
        <p class="muted">Removes every record kept by Rodside on this device.</p>
        <ConfirmAction danger label="Erase everything on this device" question="Erase every instrument, visit, reading and setting on this device? Export a backup first: this cannot be undone."
          confirmLabel="Yes, erase everything" onConfirm={eraseEverything} />
      </details>
    </section>
  );
}

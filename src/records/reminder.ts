// When to remind the user to export a backup.

export const BACKUP_REMINDER_DAYS = 30;

export interface BackupReminder {
  due: boolean;
  /** Whole days since the last backup; null when there has never been one. */
  daysSince: number | null;
  message: string;
}

const eviction =
  'Browsers may delete a site’s stored data without asking, for example when the device runs short of space, ' +
  'or (on iPhone and iPad) when Rodside has not been added to the home screen and is not used for a while. ' +
  'A backup file kept elsewhere is the only safe copy.';

/** Due when there is something to lose and the last backup is more than 30 days old (or there was none). */
export function backupReminder(lastBackupAt: string | undefined, now: Date, hasRecords: boolean): BackupReminder {
  const last = lastBackupAt ? Date.parse(lastBackupAt) : NaN;
  const daysSince = Number.isFinite(last) ? Math.floor((now.getTime() - last) / 86_400_000) : null;
  if (!hasRecords) return { due: false, daysSince, message: '' };
  if (daysSince === null) return { due: true, daysSince, message: `No backup has been exported from this device yet. ${eviction}` };
  if (daysSince > BACKUP_REMINDER_DAYS) {
    return { due: true, daysSince, message: `The last backup was exported ${daysSince} days ago. ${eviction}` };
  }
  return { due: false, daysSince, message: `Last backup exported ${daysSince === 0 ? 'today' : `${daysSince} day${daysSince === 1 ? '' : 's'} ago`}.` };
}

// What leaves the device: the backup file (and its restore), the backup reminder, CSV of readings, the visit report.
import { backupReminder, readingsCsv, visitReportHtml, type Reading, type Visit } from '../records';
import type { Store, StoreContext } from './api';
import { exportBackupText, importBackupText } from './backup';
import { DEMO_LAB } from './demoData';
import { describeStorageError, guard, StoreError } from './errors';
import { readingTypes } from './readingTypes';

type OutputMethods = 'exportBackup' | 'importBackup' | 'noteBackupSaved' | 'backupStatus' | 'readingsCsv' | 'visitReport';

export function outputMethods(ctx: StoreContext): Pick<Store, OutputMethods> {
  const { db } = ctx;
  return {
    exportBackup: () => guard('export the backup', () => exportBackupText(db)),

    importBackup: async (text) => {
      try {
        return await importBackupText(db, text);
      } catch (err) {
        // Problems with the file keep their exact message; storage failures get the usual wording.
        if (err instanceof Error && err.name === 'BackupError') throw err;
        throw describeStorageError('restore the backup', err);
      }
    },

    noteBackupSaved: (at = new Date()) => guard('remember the backup', async () => void (await db.put('settings', { key: 'lastBackupAt', value: at.toISOString() }))),

    backupStatus: (now = new Date()) =>
      guard('check the backup date', async () => {
        const last = (await db.get('settings', 'lastBackupAt'))?.value;
        const count = (await db.count('visits')) + (await db.count('instruments'));
        return backupReminder(typeof last === 'string' ? last : undefined, now, count > 0);
      }),

    readingsCsv: (filter = {}) =>
      guard('export the readings', async () => {
        const [instruments, types] = await Promise.all([db.getAll('instruments'), readingTypes(ctx)]);
        let visits: Visit[];
        let readings: Reading[];
        if (filter.visitId) {
          const v = await db.get('visits', filter.visitId);
          visits = v ? [v] : [];
          readings = await db.getAllFromIndex('readings', 'byVisit', filter.visitId);
        } else if (filter.instrumentId) {
          visits = await db.getAllFromIndex('visits', 'byInstrument', filter.instrumentId);
          readings = await db.getAllFromIndex('readings', 'byInstrumentType', IDBKeyRange.bound([filter.instrumentId, ''], [filter.instrumentId, '\uffff']));
        } else {
          visits = await db.getAll('visits');
          readings = await db.getAll('readings');
        }
        return readingsCsv(instruments, visits, readings, (id) => types.find((t) => t.id === id));
      }),

    visitReport: (visitId, now = new Date()) =>
      guard('make the visit report', async () => {
        const visit = await db.get('visits', visitId);
        if (!visit) throw new StoreError(`Could not make the report: the visit ${visitId} no longer exists.`);
        const instrument = await db.get('instruments', visit.instrumentId);
        if (!instrument) throw new StoreError('Could not make the report: the visit’s instrument profile no longer exists.');
        const [readings, walks, types] = await Promise.all([
          db.getAllFromIndex('readings', 'byVisit', visitId), db.getAllFromIndex('walks', 'byVisit', visitId), readingTypes(ctx),
        ]);
        readings.sort((a, b) => (a.takenAt < b.takenAt ? -1 : a.takenAt > b.takenAt ? 1 : 0));
        walks.sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1));
        return visitReportHtml({
          lab: instrument.demo ? DEMO_LAB : undefined, instrument, visit, readings, walks,
          typeOf: (id) => types.find((t) => t.id === id), generatedAt: now,
        });
      }),
  };
}

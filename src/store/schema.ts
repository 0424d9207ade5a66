// IndexedDB schema and its stepwise migrations. Only src/store imports idb.
import type { DBSchema, IDBPDatabase, IDBPTransaction, StoreNames } from 'idb';
import type { MakerLimit, ReadingType } from '../records';
import type { DraftRecord, InstrumentProfile, Reading, SettingRecord, Visit, WalkRecord } from '../records/types';
import { migrateToTyped } from './migrateV3';

export const DB_NAME = 'rodside';
export const DB_VERSION = 3;

/** The maker's (or site's) limits of one instrument, one per reading type. */
export interface MakerLimitsRecord {
  instrumentId: string;
  limits: MakerLimit[];
}

/** One reading type the user added on this device; `order` keeps them in the order they were added. */
export interface OwnTypeRecord {
  id: string;
  order: number;
  type: ReadingType;
}

/** The visit "Note this" and the Visits screen treat as open for an instrument. */
export interface CurrentVisitRecord {
  instrumentId: string;
  visitId: string;
}

/** The copy kept after an instrument is deleted, so undo works across a reload. */
export interface UndoCopyRecord {
  instrumentId: string;
  profile: InstrumentProfile;
  bundles: { visit: Visit; readings: Reading[]; walks: WalkRecord[] }[];
  deletedAt: string;
}

export interface RodsideSchema extends DBSchema {
  instruments: { key: string; value: InstrumentProfile; indexes: { byName: string } };
  settings: { key: string; value: SettingRecord };
  visits: { key: string; value: Visit; indexes: { byInstrument: string; byStart: string } };
  readings: { key: string; value: Reading; indexes: { byVisit: string; byInstrumentType: [string, string] } };
  walks: { key: string; value: WalkRecord; indexes: { byVisit: string } };
  drafts: { key: string; value: DraftRecord };
  makerLimits: { key: string; value: MakerLimitsRecord };
  ownTypes: { key: string; value: OwnTypeRecord };
  currentVisits: { key: string; value: CurrentVisitRecord };
  undoCopies: { key: string; value: UndoCopyRecord };
}

/**
 * Version 1 kept instrument profiles in display units (mm, MHz) with a single "rfIsPeakToPeak" flag and had
 * only the instruments and settings stores. Version 2 moves profiles to SI, states the read-back convention in
 * full, and adds visits, readings, walks and drafts. Version 3 moves maker's limits, own reading types, current-visit
 * marks and undo copies out of the untyped settings and drafts stores into typed stores of their own.
 */
export interface InstrumentV1 {
  id: string;
  name: string;
  kind: InstrumentProfile['kind'];
  r0Mm: number;
  rodLengthMm: number;
  frequencyMHz: number;
  maxRfVolts: number;
  ionEnergyEv: number;
  rfIsPeakToPeak: boolean;
  notes: string;
  createdAt: string;
  updatedAt: string;
}

export type UpgradeTx = IDBPTransaction<RodsideSchema, StoreNames<RodsideSchema>[], 'versionchange'>;

export async function upgrade(db: IDBPDatabase<RodsideSchema>, oldVersion: number, tx: UpgradeTx): Promise<void> {
  if (oldVersion < 1) {
    const instruments = db.createObjectStore('instruments', { keyPath: 'id' });
    instruments.createIndex('byName', 'name');
    db.createObjectStore('settings', { keyPath: 'key' });
  }
  if (oldVersion < 2) {
    // Convert every v1 profile in place; nothing is dropped.
    const store = tx.objectStore('instruments');
    let cursor = await store.openCursor();
    while (cursor) {
      const old = cursor.value as unknown as InstrumentV1 & Partial<InstrumentProfile>;
      if (old.rodFieldRadius === undefined) {
        const next: InstrumentProfile = {
          id: old.id,
          name: old.name,
          kind: old.kind,
          rodFieldRadius: old.r0Mm * 1e-3,
          rodLength: old.rodLengthMm * 1e-3,
          rfFrequency: old.frequencyMHz * 1e6,
          maxRfAmplitude: old.maxRfVolts,
          axialEnergy: old.ionEnergyEv,
          readbackConvention: { amplitude: old.rfIsPeakToPeak ? 'peak-to-peak' : 'zero-to-peak', reference: 'per-rod' },
          notes: old.notes ?? '',
          createdAt: old.createdAt,
          updatedAt: old.updatedAt,
        };
        await cursor.update(next);
      }
      cursor = await cursor.continue();
    }
    const visits = db.createObjectStore('visits', { keyPath: 'id' });
    visits.createIndex('byInstrument', 'instrumentId');
    visits.createIndex('byStart', 'startedAt');
    const readings = db.createObjectStore('readings', { keyPath: 'id' });
    readings.createIndex('byVisit', 'visitId');
    readings.createIndex('byInstrumentType', ['instrumentId', 'typeId']);
    const walks = db.createObjectStore('walks', { keyPath: 'id' });
    walks.createIndex('byVisit', 'visitId');
    db.createObjectStore('drafts', { keyPath: 'key' });
  }
  if (oldVersion < 3) await migrateToTyped(db, tx);
}

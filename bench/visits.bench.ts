// Visit log at scale: 10,000 readings over 200 visits on one instrument, in fake-indexeddb under Node.
// Targets: list a visit and a five-year trend < 200 ms; export and import < 1 s. Figures only, no asserts.
import 'fake-indexeddb/auto';
import { performance } from 'node:perf_hooks';
import { eraseStore, openStore, PASCAL_PER_TORR, type Reading, type Visit } from '../src/store';
import { medianMsAsync, report } from './timing';

const VISITS = 200;
const PER_VISIT = 50;

function records(instrumentId: string): { visits: Visit[]; readings: Reading[] } {
  const visits: Visit[] = [];
  const readings: Reading[] = [];
  const start = Date.parse('2021-12-01T09:00:00.000Z');
  const span = 5 * 365.2425 * 86400_000;
  for (let i = 0; i < VISITS; i++) {
    const at = new Date(start + (span * i) / VISITS).toISOString();
    const id = `bench-visit-${String(i).padStart(3, '0')}`;
    visits.push({ id, instrumentId, startedAt: at, site: 'Bench site', engineer: 'Bench engineer', reason: 'preventive',
      notes: 'Routine visit with a few lines of notes about what was done and found.', partsUsed: '', createdAt: at, updatedAt: at });
    for (let k = 0; k < PER_VISIT; k++) {
      const phase = k % 2 === 0 ? 'as-found' : 'as-left';
      const slot = Math.floor(k / 2);
      let typeId: string, value: number, context: Reading['context'];
      if (slot === 0) { typeId = 'multiplier-voltage'; value = 1400 + i * 2 + (k % 2) * 5; }
      else if (slot === 1) { typeId = 'vacuum-high'; value = 1.2e-5 * PASCAL_PER_TORR * (1 + 0.1 * Math.sin(i)); context = { gaugeGas: 'N2-equivalent' }; }
      else if (slot === 2) { typeId = 'vacuum-fore'; value = 3e-2 * 100 * (1 + i / VISITS); context = { gaugeGas: 'N2-equivalent' }; }
      else { typeId = 'peak-width'; value = 0.6 + 0.001 * slot; context = { mz: 20 + slot * 20 }; }
      readings.push({ id: `${id}-r${k}`, visitId: id, instrumentId, typeId, phase, value, entered: { text: String(value), unit: 'base' },
        ...(context ? { context } : {}), expected: { value, basis: 'baseline', source: 'bench' }, verdict: 'pass', note: '',
        takenAt: new Date(Date.parse(at) + k * 60_000).toISOString(), origin: 'entered' });
    }
  }
  return { visits, readings };
}

export async function run(): Promise<void> {
  const name = `rodside-bench-${Date.now()}`;
  const store = await openStore(name);
  await store.loadDemo();
  const instrumentId = 'demo-gcms-kestrel';
  const { visits, readings } = records(instrumentId);
  const t0 = performance.now();
  const tx = store.db.transaction(['visits', 'readings'], 'readwrite');
  await Promise.all([...visits.map((v) => tx.objectStore('visits').put(v)), ...readings.map((r) => tx.objectStore('readings').put(r))]);
  await tx.done;
  report(`seed ${VISITS} visits, ${VISITS * PER_VISIT} readings (one transaction)`, performance.now() - t0, 'ms');

  const target = visits[137].id;
  report('list one visit\'s readings (50)', await medianMsAsync(() => store.listReadings(target)), 'ms', '< 200 ms');
  report('list the instrument\'s visits (208)', await medianMsAsync(() => store.listVisits(instrumentId)), 'ms', '< 200 ms');
  const since = new Date(Date.parse('2026-12-01T00:00:00Z') - 5 * 365.2425 * 86400_000).toISOString();
  report('five-year trend, multiplier voltage (fit + projection)', await medianMsAsync(() => store.trend(instrumentId, 'multiplier-voltage', { since })), 'ms', '< 200 ms');
  report('five-year trend, high vacuum (log fit)', await medianMsAsync(() => store.trend(instrumentId, 'vacuum-high', { since })), 'ms', '< 200 ms');

  let text = '';
  report('export full backup (JSON + SHA-256)', await medianMsAsync(async () => { text = await store.exportBackup(); }, 3, 1), 'ms', '< 1 s');
  report('backup size', text.length / 1048576, 'MB');
  store.close();

  let n = 0;
  const importFresh = async () => {
    const fresh = `${name}-import-${n++}`;
    const s = await openStore(fresh);
    const t = performance.now();
    await s.importBackup(text);
    const ms = performance.now() - t;
    s.close();
    await eraseStore(fresh);
    return ms;
  };
  const fresh: number[] = [];
  for (let i = 0; i < 3; i++) fresh.push(await importFresh());
  fresh.sort((a, b) => a - b);
  report('import into an empty database (validate, check, write all)', fresh[1], 'ms', '< 1 s');

  const again = await openStore(`${name}-again`);
  await again.importBackup(text);
  report('import the same backup again (all unchanged)', await medianMsAsync(() => again.importBackup(text), 3, 0), 'ms', '< 1 s');
  again.close();
  await eraseStore(`${name}-again`);
  report('CSV of all readings', await (async () => { const s = await openStore(name); const t = performance.now(); await s.readingsCsv(); const ms = performance.now() - t; s.close(); return ms; })(), 'ms');
  await eraseStore(name);
}

import 'fake-indexeddb/auto';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { BACKUP_FORMAT, canonicalJson, eraseStore, openStore, sha256Hex, type Store } from '../../../src/store';
import { sha256Fallback } from '../../../src/store/sha256';
import { dump, freshName, registerCleanup, testEngine } from './helpers';

registerCleanup();

/** A store holding the demo scenario plus a walk and a draft: every store has records. */
async function filledStore(): Promise<Store> {
  const store = await openStore(freshName(), {}, { engine: testEngine });
  await store.loadDemo();
  // A hostile note of the test's own (the demo's notes are ordinary text).
  const k6 = (await store.getVisit('demo-visit-k6'))!;
  await store.saveVisit({ ...k6, notes: `${k6.notes} <script>alert("notes are plain text")</script>` }, k6.id);
  await store.saveWalk({ visitId: 'demo-visit-k6', instrumentId: 'demo-gcms-kestrel', treeId: 'leak', state: { at: 'LK-2', answers: ['yes'] }, status: 'in-progress' });
  await store.putDraft('visit-form:new', { site: 'half typed', notes: '<script>x</script>' });
  await store.setSetting('theme', 'dark');
  return store;
}

async function rewrite(text: string, change: (doc: any) => void, fixChecksum = true): Promise<string> {
  const doc = JSON.parse(text);
  change(doc);
  if (fixChecksum) doc.checksum.value = await sha256Hex(JSON.stringify(doc.data));
  return JSON.stringify(doc);
}

let backup = '';
beforeAll(async () => {
  const s = await filledStore();
  backup = await s.exportBackup();
  s.close();
});

describe('SHA-256', () => {
  it('matches FIPS 180-2 Appendix B examples, both via crypto.subtle and the fallback', async () => {
    const abc = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';
    const two = '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1';
    const msg2 = 'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq';
    expect(await sha256Hex('abc')).toBe(abc);
    expect(sha256Fallback(new TextEncoder().encode('abc'))).toBe(abc);
    expect(sha256Fallback(new TextEncoder().encode(msg2))).toBe(two);
    const long = 'µ°'.repeat(40000);
    expect(sha256Fallback(new TextEncoder().encode(long))).toBe(await sha256Hex(long));
  });
});

describe('export → wipe → import', () => {
  it('gives the same data back, and a second import changes nothing', async () => {
    const a = await filledStore();
    const before = await dump(a);
    const text = await a.exportBackup();
    const doc = JSON.parse(text);
    expect(doc.format).toBe(BACKUP_FORMAT);
    expect(doc.version).toBe(1);
    expect(doc.checksum.value).toBe(await sha256Hex(JSON.stringify(doc.data)));
    a.close();
    const b = await openStore(freshName());
    const total = Object.values(before).reduce((n, l) => n + l.length, 0);
    expect(await b.importBackup(text)).toEqual({ added: total, updated: 0, unchanged: 0 });
    expect(canonicalJson(await dump(b))).toBe(canonicalJson(before));
    expect(await b.importBackup(text)).toEqual({ added: 0, updated: 0, unchanged: total });
    b.close();
  });

  it('merges by id: changed records count as updated, records only here stay', async () => {
    const s = await openStore(freshName());
    await s.importBackup(backup);
    const v = (await s.getVisit('demo-visit-k2'))!;
    await s.saveVisit({ ...v, notes: 'edited here' }, v.id);
    await s.putDraft('only-here', { a: 1 });
    const r = await s.importBackup(backup);
    expect(r.updated).toBe(1);
    expect(r.added).toBe(0);
    expect((await s.getVisit('demo-visit-k2'))?.notes).toBe(v.notes);
    expect(await s.getDraft('only-here')).toEqual({ a: 1 });
    s.close();
  });

  it('keeps script tags in notes as plain text', async () => {
    const s = await openStore(freshName());
    await s.importBackup(backup);
    expect((await s.getVisit('demo-visit-k6'))?.notes).toContain('<script>alert("notes are plain text")</script>');
    s.close();
  });
});

describe('hostile and malformed backups are refused, and the database is left exactly as it was', () => {
  const cases: [string, () => Promise<string> | string, RegExp][] = [
    ['truncated JSON', () => backup.slice(0, Math.floor(backup.length * 0.7)), /not valid JSON .*truncated or damaged/],
    ['empty text', () => '', /not valid JSON/],
    ['a JSON array', () => '[]', /expected a backup object at the top level, got an array/],
    ['another format', () => rewrite(backup, (d) => { d.format = 'something-else'; }), /format: expected "rodside-backup", got "something-else"/],
    ['a newer format version', () => rewrite(backup, (d) => { d.version = 2; }), /version: this Rodside reads backup format version 1, the file says 2 \(made by a newer Rodside/],
    ['a wrong type in a reading', () => rewrite(backup, (d) => { d.data.readings[12].value = 'abc'; }), /^readings\[12\]\.value: expected a finite number, got "abc"/],
    ['a reading far outside its plausible range', () => rewrite(backup, (d) => { d.data.readings[3].value = 1e300; }), /readings\[3\]\.value: 1e\+300 .* outside the accepted range/],
    ['a duplicate id', () => rewrite(backup, (d) => { d.data.visits.push({ ...d.data.visits[0] }); }), /visits\[\d+\]\.id: "demo-visit-h1" appears twice \(also at visits\[0\]\)/],
    ['a 10 MB string in notes', () => rewrite(backup, (d) => { d.data.visits[1].notes = 'x'.repeat(10 * 1024 * 1024); }), /visits\[1\]\.notes: text is 10485760 characters long, more than the 20000 allowed/],
    ['a bad checksum', () => rewrite(backup, (d) => { d.data.visits[1].notes = 'quietly edited'; }, false), /checksum: the SHA-256 of the data does not match/],
    ['a missing checksum', () => rewrite(backup, (d) => { delete d.checksum; }, false), /checksum: expected/],
    ['a reading whose visit is missing', () => rewrite(backup, (d) => { d.data.readings[0].visitId = 'demo-visit-nowhere'; }), /readings\[0\]\.visitId: no visit "demo-visit-nowhere"/],
    ['a reading on the wrong instrument', () => rewrite(backup, (d) => { d.data.readings[0].instrumentId = 'demo-rga-wren'; }), /readings\[0\]\.instrumentId: "demo-rga-wren" differs from its visit’s instrument/],
    ['an unexpected field', () => rewrite(backup, (d) => { d.data.instruments[0].__proto__evil = 1; }), /instruments\[0\]: unexpected field "__proto__evil"/],
    ['a __proto__ key', () => backup.replace('"data":{', '"data":{"__proto__":{"polluted":true},'), /data: unexpected field "__proto__"/],
    ['a NaN-like string id', () => rewrite(backup, (d) => { d.data.visits[0].id = '../../etc'; }), /visits\[0\]\.id: expected an identifier/],
    ['a bad date', () => rewrite(backup, (d) => { d.data.visits[0].startedAt = '31/12/2025'; }), /visits\[0\]\.startedAt: expected an ISO 8601 date/],
    ['record counts that disagree with the header', () => rewrite(backup, (d) => { d.data.drafts = []; }), /counts\.drafts: the header says 1 records, the file holds 0/],
    ['a non-list store', () => rewrite(backup, (d) => { d.data.readings = {}; }), /data\.readings: expected a list, got an object/],
    ['a huge setting value', () => rewrite(backup, (d) => { d.data.settings.push({ key: 'big', value: 'y'.repeat(1_100_000) }); d.counts.settings++; }), /settings\[\d+\]\.value: \d+ characters of data, more than the 1000000 allowed/],
  ];
  for (const [label, make, message] of cases) {
    it(label, async () => {
      const s = await openStore(freshName());
      await s.loadDemo();
      await s.putDraft('mine', { typed: 'keep me' });
      const before = await dump(s);
      const text = await make();
      await expect(s.importBackup(text)).rejects.toThrow(message);
      expect(canonicalJson(await dump(s))).toBe(canonicalJson(before));
      s.close();
    });
  }
  it('refuses to move a visit already here to another instrument, and a walk on a missing visit', async () => {
    const s = await openStore(freshName());
    await s.importBackup(backup);
    const before = await dump(s);
    const moved = await rewrite(backup, (d) => {
      const v = d.data.visits.find((x: { id: string }) => x.id === 'demo-visit-w3');
      v.instrumentId = 'demo-gcms-kestrel';
      for (const r of d.data.readings) if (r.visitId === 'demo-visit-w3') r.instrumentId = 'demo-gcms-kestrel';
    });
    await expect(s.importBackup(moved)).rejects.toThrow(/visits\[\d+\]\.instrumentId: the visit "demo-visit-w3" already on this device belongs to another instrument/);
    const orphanWalk = await rewrite(backup, (d) => { d.data.walks[0].visitId = 'demo-visit-none'; });
    await expect(s.importBackup(orphanWalk)).rejects.toThrow(/walks\[0\]\.visitId: no visit "demo-visit-none"/);
    expect(canonicalJson(await dump(s))).toBe(canonicalJson(before));
    s.close();
  });
  it('refuses a file larger than the limit before parsing it', async () => {
    const s = await openStore(freshName());
    await expect(s.importBackup(' '.repeat(64 * 1024 * 1024 + 1))).rejects.toThrow(/larger than the 64 MB a backup may be/);
    s.close();
  });
  it('rolls back a merge that fails in the middle of the transaction', async () => {
    // The second reading points at a visit that exists neither in the file nor here: the check runs inside the
    // write transaction after the existing records are read, and nothing of the file is written.
    const s = await openStore(freshName());
    const before = await dump(s);
    const text = await rewrite(backup, (d) => { d.data.readings[5].visitId = 'demo-visit-zz'; });
    await expect(s.importBackup(text)).rejects.toThrow(/readings\[5\]\.visitId/);
    expect(canonicalJson(await dump(s))).toBe(canonicalJson(before));
    s.close();
  });
});

describe('random corruptions (fast-check)', () => {
  type Mutation = { kind: 'truncate'; at: number } | { kind: 'replace-char'; at: number; ch: string } |
    { kind: 'set'; store: number; index: number; field: number; value: unknown; fix: boolean } |
    { kind: 'delete-field'; store: number; index: number; field: number; fix: boolean } |
    { kind: 'duplicate'; store: number; index: number; fix: boolean };
  const stores = ['instruments', 'visits', 'readings', 'walks', 'settings', 'drafts'];
  const jsonish = fc.oneof(fc.string({ maxLength: 30 }), fc.integer(), fc.double(), fc.boolean(), fc.constant(null),
    fc.constant('2026-01-01T00:00:00.000Z'), fc.constant('demo-visit-k1'), fc.constant(-1), fc.array(fc.integer(), { maxLength: 3 }),
    fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 2 }));
  const mutation: fc.Arbitrary<Mutation> = fc.oneof(
    fc.record({ kind: fc.constant('truncate' as const), at: fc.nat() }),
    fc.record({ kind: fc.constant('replace-char' as const), at: fc.nat(), ch: fc.constantFrom('"', '{', '}', ',', '0', '9', 'x', ' ', '\\', ']', 'e', '-') }),
    fc.record({ kind: fc.constant('set' as const), store: fc.nat(5), index: fc.nat(), field: fc.nat(), value: jsonish, fix: fc.boolean() }),
    fc.record({ kind: fc.constant('delete-field' as const), store: fc.nat(5), index: fc.nat(), field: fc.nat(), fix: fc.boolean() }),
    fc.record({ kind: fc.constant('duplicate' as const), store: fc.nat(5), index: fc.nat(), fix: fc.boolean() }),
  );

  async function apply(m: Mutation): Promise<string> {
    if (m.kind === 'truncate') return backup.slice(0, m.at % backup.length);
    if (m.kind === 'replace-char') {
      const at = m.at % backup.length;
      return backup.slice(0, at) + m.ch + backup.slice(at + 1);
    }
    return rewrite(backup, (d) => {
      const list = d.data[stores[m.store]] as Record<string, unknown>[];
      if (!list.length) return;
      const rec = list[m.index % list.length];
      if (m.kind === 'duplicate') { list.push(structuredClone(rec)); return; }
      const keys = Object.keys(rec);
      const key = keys[m.field % keys.length];
      if (m.kind === 'set') rec[key] = m.value;
      else delete rec[key];
    }, m.fix);
  }

  // `npm test` runs a small count; `npm run test:soak` sets RODSIDE_FUZZ_RUNS=10000 (the long form).
  const fuzzRuns = Number(process.env.RODSIDE_FUZZ_RUNS ?? 120);
  if (!Number.isInteger(fuzzRuns) || fuzzRuns < 1) throw new Error(`RODSIDE_FUZZ_RUNS must be a whole number ≥ 1, not “${process.env.RODSIDE_FUZZ_RUNS}”`);
  it(`every corruption is either refused with the database byte-identical, or accepted consistently (${fuzzRuns} cases)`, async () => {
    let refused = 0, accepted = 0;
    await fc.assert(
      fc.asyncProperty(mutation, fc.boolean(), async (m, prefilled) => {
        // One database per case, deleted at once: ten thousand cases must not pile up in memory.
        const name = `rodside-fuzz-${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;
        const s = await openStore(name);
        try {
          if (prefilled) await s.importBackup(backup);
          const before = await dump(s);
          const text = await apply(m);
          let result;
          try {
            result = await s.importBackup(text);
          } catch (err) {
            refused++;
            expect(err).toBeInstanceOf(Error);
            expect((err as Error).message.length).toBeGreaterThan(10);
            // Byte for byte: the same records, in the same order, with the same key order.
            expect(JSON.stringify(await dump(s))).toBe(JSON.stringify(before));
            return;
          }
          accepted++;
          // Accepted: every record of the file is now here exactly, the counts add up, and importing again changes nothing.
          const doc = JSON.parse(text);
          const after = await dump(s);
          let total = 0;
          for (const st of stores) {
            const keyName = st === 'settings' || st === 'drafts' ? 'key' : 'id';
            const here = new Map((after[st] as Record<string, unknown>[]).map((r) => [r[keyName], canonicalJson(r)]));
            for (const rec of doc.data[st]) expect(here.get(rec[keyName])).toBe(canonicalJson(rec));
            total += doc.data[st].length;
          }
          expect(result.added + result.updated + result.unchanged).toBe(total);
          expect(await s.importBackup(text)).toEqual({ added: 0, updated: 0, unchanged: total });
        } finally {
          s.close();
          await eraseStore(name);
        }
      }),
      { numRuns: fuzzRuns, seed: Number(process.env.RODSIDE_FUZZ_SEED ?? 20261201) },
    );
    expect(refused).toBeGreaterThan(0);
    expect(accepted).toBeGreaterThan(0);
    console.log(`import fuzz: ${fuzzRuns} cases, ${refused} refused with the database byte-identical, ${accepted} accepted consistently`);
  // A hang guard only, generous enough for the long form beside a CPU burner (about 40 ms a case when idle).
  }, 60_000 + fuzzRuns * 1_000);
});

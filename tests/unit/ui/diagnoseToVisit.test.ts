// Walk readings go into the visit log as catalogue readings where the step names a type (so the visit log
// judges and trends them), else as plain noted values; checked against the real store in fake-indexeddb.
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { answer, enter, record, start, treeById, trees, type DiagnoseInstrument } from '../../../src/diagnose';
import { catalogue } from '../../../src/records/catalogue';
import { demoInstruments, openStore } from '../../../src/store';
import { noteThis } from '../../../src/ui/noteThis';
import { plainNote, visitNote } from '../../../src/ui/screens/diagnose/toVisit';
import { freshName, registerCleanup } from '../store/helpers';

registerCleanup();

describe('walk readings into the visit log', () => {
  it('every reading type a tree step names is in the visit log catalogue, in a unit of that type', () => {
    const named = trees.flatMap((t) => t.nodes.flatMap((n) => (n.kind === 'measure' && n.measure.visitType ? [{ at: `${t.id}/${n.id}`, type: n.measure.visitType, unit: n.measure.unit }] : [])));
    expect(named.length).toBeGreaterThanOrEqual(10);
    for (const n of named) {
      const type = catalogue.find((c) => c.id === n.type);
      expect(type, `${n.at} names ${n.type}`).toBeDefined();
    }
  });

  it('records pressure, emission and RF as catalogue readings with unit and context, the rest as noted values', async () => {
    const store = await openStore(freshName());
    await store.loadDemo(true);
    const heron = demoInstruments.find((p) => p.id === 'demo-lcms-heron')!; // read-backs peak-to-peak per rod
    const instrument: DiagnoseInstrument = heron;
    const entry = treeById('entry');
    const ns = treeById('no-signal');
    let s = start(entry, instrument);
    s = answer(s, entry, { kind: 'gate', role: 'field-engineer', confirmed: ['procedure', 'permit', 'ppe', 'lockout'] });
    s = answer(s, entry, { kind: 'measure', value: 2e-5, unit: 'mbar' });
    s = answer(s, entry, { kind: 'option', optionId: 'none' });
    s = answer(s, entry, { kind: 'option', optionId: 'gradual' });
    s = answer(s, entry, { kind: 'options', optionIds: ['no-signal'] });
    s = enter(s, ns);
    s = answer(s, ns, { kind: 'option', optionId: 'nothing' });
    s = answer(s, ns, { kind: 'option', optionId: 'no-flow-ok' });
    s = answer(s, ns, { kind: 'option', optionId: 'ei' });
    s = answer(s, ns, { kind: 'measure', value: 48, unit: 'µA', inputs: { setPoint: 50 } });
    s = answer(s, ns, { kind: 'option', optionId: 'plausible' });
    s = answer(s, ns, { kind: 'option', optionId: 'output' });
    s = answer(s, ns, { kind: 'gate', role: 'field-engineer', confirmed: ['live-work', 'meter-rating', 'ppe', 'procedure'] });
    s = answer(s, ns, { kind: 'measure', value: 0.4, unit: 'kV', inputs: { mz: 69 } });

    const notes = s.readings.map((r) => visitNote(r, instrument));
    expect(notes.map((n) => n.typeId)).toEqual(['vacuum-high', 'emission-current', 'rf-amplitude']);
    expect(notes[2]).toMatchObject({ unit: 'Vpp-rod', value: 400, context: { mz: 69 } });
    for (const n of notes) await store.noteReading(heron, n);
    const visit = (await store.listVisits(heron.id))[0];
    const kept = await store.listReadings(visit.id);
    const byType = Object.fromEntries(kept.map((r) => [r.typeId, r]));
    // Base units of the catalogue: Pa; A; V zero-to-peak per rod (400 V peak-to-peak = 200 V zero-to-peak).
    expect(byType['vacuum-high'].value).toBeCloseTo(2e-3, 12);
    expect(byType['emission-current'].value).toBeCloseTo(48e-6, 15);
    expect(byType['rf-amplitude'].value).toBeCloseTo(200, 9);
    expect(byType['rf-amplitude'].context).toMatchObject({ mz: 69 });
    expect(kept.every((r) => r.phase === 'as-found')).toBe(true);
    // A step without a catalogue type, or an as-left value, is kept as a noted value with its own unit.
    const plain = plainNote({ ...s.readings[1], phase: 'as-left' });
    expect(visitNote({ ...s.readings[1], phase: 'as-left' }, instrument)).toEqual(plain);
    const r = await store.noteReading(heron, plain);
    expect(r.reading.typeId).toBe('noted-value');
    expect(r.reading.context).toMatchObject({ unit: 'µA', walkStep: 'no-signal/NS3E1' });
    store.close();
  });

  it('a reading re-measured after a corrective action goes in as-left, its label left as measured', async () => {
    const store = await openStore(freshName());
    await store.loadDemo(true);
    const heron = demoInstruments.find((p) => p.id === 'demo-lcms-heron')!;
    const ns = treeById('no-signal');
    let s = start(ns, heron);
    for (const o of ['nothing', 'no-flow-ok', 'ei']) s = answer(s, ns, { kind: 'option', optionId: o });
    s = answer(s, ns, { kind: 'measure', value: 0, inputs: { setPoint: 50 } });
    s = answer(s, ns, { kind: 'gate', role: 'field-engineer', confirmed: ['lockout', 'discharge', 'ppe', 'procedure'] });
    s = answer(s, ns, { kind: 'measure', value: 1e7 });
    expect(s.nodeId).toBe('NS3E-open');
    s = record(s, ns, { kind: 'measure', value: 0.4, unit: 'Ω', quantity: 'Filament resistance (new filament)' });
    // What the Diagnose screen's "Add readings to the visit log" does for each reading.
    for (const r of s.readings) {
      const res = await noteThis(store, heron, visitNote(r, heron));
      expect(res.ok, res.message).toBe(true);
    }
    const visit = (await store.listVisits(heron.id))[0];
    // By step: readings noted within the same millisecond have no order of their own.
    const kept = await store.listReadings(visit.id);
    const byStep = Object.fromEntries(kept.map((r) => [String(r.context?.walkStep), r.phase]));
    expect(byStep).toEqual({ 'no-signal/NS3E1': 'as-found', 'no-signal/NS3E2': 'as-found', 'no-signal/NS3E-open': 'as-left' });
    const left = kept.find((r) => r.phase === 'as-left')!;
    expect(left.note).toBe('Filament resistance (new filament) — diagnosis walk');
    expect(left.note).not.toMatch(/as-left/);
    expect(left.context).toMatchObject({ label: 'Filament resistance (new filament) — diagnosis walk', unit: 'Ω' });
    store.close();
  });
});

import { describe, expect, it } from 'vitest';
import {
  activeReadings,
  answer,
  back,
  currentNode,
  describeLimits,
  enter,
  judge,
  orderSymptoms,
  preview,
  record,
  start,
  startDirect,
  treeById,
  type DiagnoseInstrument,
  type MeasureNode,
  type WalkState,
} from '../../../src/diagnose';

const T = (n: number) => `2026-12-01T10:${String(n).padStart(2, '0')}:00.000Z`;

// Invented demo-style instrument (not a real product): r0 4.5 mm, 1.0 MHz.
const heron: DiagnoseInstrument = {
  id: 'inst-test',
  name: 'Test analyser',
  kind: 'gc-ms-single',
  rodFieldRadius: 4.5e-3,
  rodLength: 0.2,
  rfFrequency: 1.0e6,
  maxRfAmplitude: 1500,
  axialEnergy: 5,
  readbackConvention: { amplitude: 'zero-to-peak', reference: 'per-rod' },
};

const entry = treeById('entry');
const noSignal = treeById('no-signal');
const leak = treeById('leak');
const vacuum = treeById('vacuum');
const sensitivity = treeById('sensitivity');

function throughEntry(symptoms: string[]): WalkState {
  let s = start(entry, heron, { at: T(0) });
  s = answer(s, entry, { kind: 'gate', role: 'field-engineer', confirmed: ['procedure', 'permit', 'ppe', 'lockout'] }, { at: T(1) });
  s = answer(s, entry, { kind: 'measure', value: 2e-5, unit: 'mbar' }, { at: T(2) });
  s = answer(s, entry, { kind: 'option', optionId: 'vent' }, { at: T(3) });
  s = answer(s, entry, { kind: 'option', optionId: 'sudden' }, { at: T(4) });
  return answer(s, entry, { kind: 'options', optionIds: symptoms }, { at: T(5) });
}

describe('judge', () => {
  it('relative tolerance: pass, borderline with side, fail with side', () => {
    const tol = { kind: 'relative' as const, pass: 0.05, borderline: 0.1 };
    expect(judge(102, { value: 100 }, tol).verdict).toBe('pass');
    expect(judge(93, { value: 100 }, tol)).toMatchObject({ verdict: 'borderline', side: 'low' });
    expect(judge(120, { value: 100 }, tol)).toMatchObject({ verdict: 'fail', side: 'high' });
  });
  it('range in decades for pressures', () => {
    const tol = { kind: 'range' as const, borderline: 0.5, log: true };
    expect(judge(1e-5, { low: 5e-6, high: 5e-5 }, tol).verdict).toBe('pass');
    expect(judge(1e-4, { low: 5e-6, high: 5e-5 }, tol)).toMatchObject({ verdict: 'borderline', side: 'high' });
    expect(judge(1e-3, { low: 5e-6, high: 5e-5 }, tol)).toMatchObject({ verdict: 'fail', side: 'high' });
  });
  it('range with explicit outer band (28:32: 3.7–4 pass, 3–5 borderline)', () => {
    const tol = { kind: 'range' as const, borderline: 0, outer: { low: 3, high: 5 } };
    expect(judge(3.88, { low: 3.7, high: 4 }, tol).verdict).toBe('pass');
    expect(judge(4.6, { low: 3.7, high: 4 }, tol).verdict).toBe('borderline');
    expect(judge(2.5, { low: 3.7, high: 4 }, tol)).toMatchObject({ verdict: 'fail', side: 'low' });
  });
  it('refuses a non-finite measured value', () => {
    expect(() => judge(Number.NaN, { value: 1 }, { kind: 'relative', pass: 0.1, borderline: 0.2 })).toThrow(/measured value must be a finite number/);
  });
  it('describes limits in words', () => {
    expect(describeLimits(95, 105, 'V')).toBe('95 to 105 V');
    expect(describeLimits(Number.NEGATIVE_INFINITY, 2700, 'V')).toBe('at most 2700 V');
  });
});

describe('walker', () => {
  it('start puts the walk at the entry with an empty record', () => {
    const s = start(entry, heron, { at: T(0) });
    expect(s).toMatchObject({ treeId: 'entry', nodeId: 'E1', status: 'walking', steps: [], readings: [], queue: [] });
    expect(s.instrument?.name).toBe('Test analyser');
  });

  it('a refused gate leads to the stop-and-escalate leaf', () => {
    let s = start(entry, null, { at: T(0) });
    s = answer(s, entry, { kind: 'gate', role: 'analyst', confirmed: ['procedure', 'ppe'] }, { at: T(1) });
    expect(s.nodeId).toBe('E-stop');
    expect(s.status).toBe('at-leaf');
    expect(s.outcome).toMatchObject({ escalate: true });
    expect(s.outcome?.closing).toMatch(/^Re-measure and record: /);
  });

  it('orders several symptoms vacuum, leak, no signal, mass axis, peak shape, sensitivity, noise', () => {
    expect(orderSymptoms(['noise', 'no-signal', 'vacuum', 'sensitivity', 'leak', 'peak-shape', 'mass-axis'])).toEqual([
      'vacuum', 'leak', 'no-signal', 'mass-axis', 'peak-shape', 'sensitivity', 'noise',
    ]);
    const s = throughEntry(['sensitivity', 'no-signal', 'leak']);
    expect(s.status).toBe('hand-over');
    expect(s.handOver).toBe('leak');
    expect(s.queue).toEqual(['no-signal', 'sensitivity']);
    const inLeak = enter(s, leak, { at: T(6) });
    expect(inLeak).toMatchObject({ treeId: 'leak', nodeId: 'HB1', queue: ['no-signal', 'sensitivity'] });
    expect(() => enter(s, noSignal)).toThrow(/cannot move to tree "no-signal"/);
  });

  it('records the as-found pressure reading with quantity, unit, value, node, time and derived mean free path', () => {
    const s = throughEntry(['no-signal']);
    const r = s.readings[0];
    expect(r).toMatchObject({ treeId: 'entry', nodeId: 'E2', quantity: 'Analyser pressure (as found)', unit: 'mbar', value: 2e-5, verdict: 'recorded', at: T(2) });
    expect(r.derived[0].calc).toBe('meanFreePath');
  });

  it('answers a measurement against a set point: value, expected, tolerance and verdict stored; branch follows the verdict', () => {
    let s = enter(throughEntry(['no-signal']), noSignal, { at: T(6) });
    s = answer(s, noSignal, { kind: 'option', optionId: 'nothing' }, { at: T(7) });
    s = answer(s, noSignal, { kind: 'option', optionId: 'no-flow-ok' }, { at: T(8) });
    s = answer(s, noSignal, { kind: 'option', optionId: 'ei' }, { at: T(9) });
    expect(s.nodeId).toBe('NS3E1');
    const low = answer(s, noSignal, { kind: 'measure', value: 30, inputs: { setPoint: 50 } }, { at: T(10) });
    const r = low.readings.at(-1)!;
    expect(r).toMatchObject({ quantity: 'Emission current', unit: 'µA', value: 30, expected: 50, verdict: 'fail', side: 'low', judgedBy: 'expected', nodeId: 'NS3E1', at: T(10) });
    expect(r.tolerance).toMatchObject({ kind: 'relative', pass: 0.05, borderline: 0.1, passLow: 47.5, passHigh: 52.5 });
    expect(low.nodeId).toBe('NS3E-G');
    // Same reading entered in mA: converted before judging.
    const ok = answer(s, noSignal, { kind: 'measure', value: 0.0505, unit: 'mA', inputs: { setPoint: 50 } }, { at: T(10) });
    expect(ok.readings.at(-1)).toMatchObject({ unit: 'mA', verdict: 'pass' });
    expect(ok.readings.at(-1)!.expected).toBeCloseTo(0.05, 12);
    expect(ok.nodeId).toBe('NS3E3');
    // A missing set point is named.
    expect(() => answer(s, noSignal, { kind: 'measure', value: 30 })).toThrow(/Emission set point is needed: enter a value between 0.1 and 10000 µA/);
    // A unit of another quantity is refused.
    expect(() => answer(s, noSignal, { kind: 'measure', value: 30, unit: 'V', inputs: { setPoint: 50 } })).toThrow(/unit must be µA or mA/);
  });

  it('a gate in front of covers-off work checks the role and every item', () => {
    let s = enter(throughEntry(['no-signal']), noSignal, { at: T(6) });
    for (const [id, t] of [['nothing', 7], ['no-flow-ok', 8], ['ei', 9]] as const) s = answer(s, noSignal, { kind: 'option', optionId: id }, { at: T(t) });
    s = answer(s, noSignal, { kind: 'measure', value: 0, inputs: { setPoint: 50 } }, { at: T(10) });
    const noLoto = answer(s, noSignal, { kind: 'gate', role: 'analyst', confirmed: ['ppe', 'procedure'] }, { at: T(11) });
    expect(noLoto.nodeId).toBe('NS-stop');
    const wrongRole = answer(s, noSignal, { kind: 'gate', role: 'vacuum-engineer', confirmed: ['ppe', 'procedure', 'lockout', 'discharge'] }, { at: T(11) });
    expect(wrongRole.nodeId).toBe('NS-stop');
    const noDischarge = answer(s, noSignal, { kind: 'gate', role: 'analyst', confirmed: ['ppe', 'procedure', 'lockout'] }, { at: T(11) });
    expect(noDischarge.nodeId).toBe('NS-stop');
    const ok = answer(s, noSignal, { kind: 'gate', role: 'analyst', confirmed: ['ppe', 'procedure', 'lockout', 'discharge'] }, { at: T(11) });
    expect(ok.nodeId).toBe('NS3E2');
    // Open filament (fixed range, from memory): fail high → burnt-out leaf.
    const open = answer(ok, noSignal, { kind: 'measure', value: 1e7 }, { at: T(12) });
    expect(open.nodeId).toBe('NS3E-open');
    expect(open.outcome?.continueWith).toEqual(['leak']);
    // As-left reading at the leaf.
    const left = record(open, noSignal, { kind: 'measure', value: 0.4, unit: 'Ω', quantity: 'Filament resistance (new filament)' }, { at: T(13) });
    expect(left.readings.at(-1)).toMatchObject({ phase: 'as-left', verdict: 'recorded', nodeId: 'NS3E-open' });
    expect(left.nodeId).toBe('NS3E-open');
  });

  it('with no engine value available the engineer judges, and the reading says so', () => {
    let s = start(noSignal, heron, { at: T(0) });
    const path = [['nothing'], ['no-flow-ok'], ['ei']];
    for (const [o] of path) s = answer(s, noSignal, { kind: 'option', optionId: o });
    s = answer(s, noSignal, { kind: 'measure', value: 50, inputs: { setPoint: 50 } });
    s = answer(s, noSignal, { kind: 'option', optionId: 'plausible' });
    s = answer(s, noSignal, { kind: 'option', optionId: 'output' });
    // A live-work gate: a lockout cannot stand in for live-work authorisation and a rated meter.
    expect(answer(s, noSignal, { kind: 'gate', role: 'field-engineer', confirmed: ['lockout', 'discharge', 'ppe', 'procedure'] }).nodeId).toBe('NS-stop');
    expect(answer(s, noSignal, { kind: 'gate', role: 'field-engineer', confirmed: ['live-work', 'ppe', 'procedure'] }).nodeId).toBe('NS-stop');
    s = answer(s, noSignal, { kind: 'gate', role: 'field-engineer', confirmed: ['live-work', 'meter-rating', 'ppe', 'procedure'] });
    expect(s.nodeId).toBe('NS5');
    const broken = { rfAtMass: () => { throw new RangeError('rfForMass is not in this build'); } };
    expect(() => answer(s, noSignal, { kind: 'measure', value: 100, inputs: { mz: 69 } }, { registry: broken })).toThrow(/Give your own verdict/);
    const judged = answer(s, noSignal, { kind: 'measure', value: 100, inputs: { mz: 69 }, verdict: { verdict: 'fail', side: 'low' } }, { registry: broken });
    expect(judged.readings.at(-1)).toMatchObject({ judgedBy: 'engineer', verdict: 'fail', side: 'low', expected: null });
    expect(judged.nodeId).toBe('NS5a-G');
  });

  it('uses the registry it is given, in the instrument read-back convention', () => {
    const node = noSignal.nodes.find((n) => n.id === 'NS5') as MeasureNode;
    // A registry stand-in returning a fixed SI figure proves the plumbing, not the physics.
    const reg = { rfAtMass: () => ({ value: 100.91, unit: 'V', basis: 'stand-in' }) };
    const p = preview(node, heron, { mz: 69 }, 'kV', reg);
    expect(p).toMatchObject({ ok: true, basis: 'stand-in' });
    expect(p.expected).toBeCloseTo(0.10091, 10);
    expect(preview(node, heron, { mz: 0 }, undefined, reg)).toMatchObject({ ok: false, error: 'Parked m/z (mz) must be between 1 and 10000 u; got 0' });
  });

  it('back undoes the last answer; a reading taken with it is kept, marked withdrawn', () => {
    let s = start(sensitivity, heron, { at: T(0) });
    s = answer(s, sensitivity, { kind: 'measure', value: 40 }, { at: T(1) });
    expect(s.nodeId).toBe('LS2');
    expect(s.readings[0]).toMatchObject({ value: 40, verdict: 'fail', side: 'low' });
    const b = back(s, { at: T(2) });
    expect(b.nodeId).toBe('LS1');
    expect(b.steps).toEqual([]);
    expect(b.readings).toHaveLength(1);
    expect(b.readings[0].withdrawn).toBe(true);
    expect(activeReadings(b)).toEqual([]);
    const again = answer(b, sensitivity, { kind: 'measure', value: 85 }, { at: T(3) });
    expect(again.nodeId).toBe('LS1-ok');
    expect(again.readings.map((r) => r.value)).toEqual([40, 85]);
    expect(back(start(sensitivity))).toMatchObject({ nodeId: 'LS1', steps: [] });
  });

  it('back across a tree hand-over restores the hand-over and the queue', () => {
    const h = throughEntry(['vacuum', 'noise']);
    const inVac = enter(h, vacuum, { at: T(6) });
    const b = back(inVac, { at: T(7) });
    expect(b).toMatchObject({ treeId: 'entry', nodeId: 'E5', status: 'hand-over', handOver: 'vacuum', queue: ['noise'] });
    const b2 = back(b, { at: T(8) });
    expect(b2).toMatchObject({ nodeId: 'E5', status: 'walking', handOver: null, queue: [] });
  });

  it('from a leaf, the walk moves on to the next queued tree', () => {
    let s = enter(throughEntry(['vacuum', 'noise']), vacuum);
    s = answer(s, vacuum, { kind: 'option', optionId: 'bursts' });
    expect(s.status).toBe('at-leaf');
    const n = enter(s, treeById('noise'));
    expect(n).toMatchObject({ treeId: 'noise', nodeId: 'NU1', queue: [] });
    expect(back(n)).toMatchObject({ treeId: 'vacuum', nodeId: 'VF7', status: 'at-leaf', queue: ['noise'] });
  });

  it('a deliberate loop is bounded', () => {
    let s = start(leak);
    s = answer(s, leak, { kind: 'option', optionId: 'ei' });
    s = answer(s, leak, { kind: 'option', optionId: '28' });
    s = answer(s, leak, { kind: 'measure', value: 3.9 });
    s = answer(s, leak, { kind: 'measure', value: 1.6 });
    s = answer(s, leak, { kind: 'option', optionId: 'steady' });
    s = answer(s, leak, { kind: 'gate', role: 'specialist', confirmed: ['lockout', 'discharge', 'ppe', 'procedure'] });
    s = answer(s, leak, { kind: 'option', optionId: 'stays' });
    expect(s.nodeId).toBe('HB6');
    for (let i = 0; i < 20; i++) s = answer(s, leak, { kind: 'option', optionId: 'next-joint' });
    expect(() => answer(s, leak, { kind: 'option', optionId: 'next-joint' })).toThrow(/already been taken 20 times/);
    expect(answer(s, leak, { kind: 'option', optionId: 'found' }).nodeId).toBe('HB6-found-G');
  });

  it('the state survives a JSON round trip and the walk resumes from it', () => {
    let s = enter(throughEntry(['no-signal']), noSignal, { at: T(6) });
    s = answer(s, noSignal, { kind: 'option', optionId: 'nothing' }, { at: T(7) });
    const saved = JSON.parse(JSON.stringify(s)) as WalkState;
    expect(saved).toEqual(s);
    const resumed = answer(saved, noSignal, { kind: 'option', optionId: 'no-flow-ok' }, { at: T(8) });
    const direct = answer(s, noSignal, { kind: 'option', optionId: 'no-flow-ok' }, { at: T(8) });
    expect(resumed).toEqual(direct);
    expect(resumed.path.map((p) => p.nodeId)).toEqual(['E1', 'E2', 'E3', 'E4', 'E5', 'E5', 'NS1', 'NS2', 'NS3']);
  });

  it('a long walk with readings, gates, hand-overs and Back stays plain JSON (no undefined, no infinity)', () => {
    let s = enter(throughEntry(['vacuum', 'no-signal']), vacuum);
    s = answer(s, vacuum, { kind: 'option', optionId: 'hv' });
    s = answer(s, vacuum, { kind: 'measure', value: 3e-4, unit: 'mbar', inputs: { flow: 1, pumpingSpeed: 200, relativeSensitivity: 0.18 } });
    s = back(s);
    s = answer(s, vacuum, { kind: 'measure', value: 1.5e-5, unit: 'mbar', inputs: { flow: 1, pumpingSpeed: 200, relativeSensitivity: 0.18 } });
    expect(s.nodeId).toBe('VF5-flow');
    s = record(s, vacuum, { kind: 'measure', value: 1.4e-5, unit: 'mbar', quantity: 'Analyser pressure after set-point fix' });
    s = enter(s, noSignal);
    s = answer(s, noSignal, { kind: 'option', optionId: 'nothing' });
    s = answer(s, noSignal, { kind: 'measure', value: 1.6e-5, unit: 'Torr' });
    expect(JSON.parse(JSON.stringify(s))).toStrictEqual(s);
    expect(s.readings.map((r) => r.verdict)).toEqual(['recorded', 'fail', 'pass', 'recorded', 'pass']);
    expect(s.readings[1].withdrawn).toBe(true);
  });

  it('an absolute tolerance stated in V still holds when the reading is entered in kV', () => {
    const tree = {
      id: 'noise' as const, title: 't', summary: 's', entry: 'M',
      nodes: [
        {
          id: 'M', kind: 'measure' as const, title: 'm', text: 't',
          measure: { quantity: 'Lens voltage', unit: 'V', altUnits: ['kV'], tool: 'read-back', how: 'read' },
          expect: { calc: 'setPoint', inputs: [{ key: 'setPoint', label: 'Set', unit: 'V', min: -1e4, max: 1e4 }], tolerance: { kind: 'absolute' as const, pass: 1, borderline: 2 } },
          branches: { otherwise: 'L' },
        },
        { id: 'L', kind: 'action' as const, title: 'l', text: 'l', steps: ['s'], closing: { kind: 're-measure-and-record' as const, what: 'v' } },
      ],
    };
    const s = start(tree, null);
    const r = answer(s, tree, { kind: 'measure', value: 0.1015, unit: 'kV', inputs: { setPoint: 100 } }).readings[0];
    expect(r).toMatchObject({ verdict: 'borderline', side: 'high', unit: 'kV' });
    expect(r.expected).toBeCloseTo(0.1, 12);
    expect(r.tolerance!.passHigh).toBeCloseTo(0.101, 12);
    expect(answer(s, tree, { kind: 'measure', value: 100.5, inputs: { setPoint: 100 } }).readings[0].verdict).toBe('pass');
  });

  it('refuses answers that do not fit the node, and a state from another format', () => {
    const s = start(entry, heron);
    expect(() => answer(s, entry, { kind: 'option', optionId: 'x' })).toThrow(/acknowledgement gate/);
    expect(() => answer(s, noSignal, { kind: 'option', optionId: 'x' })).toThrow(/this walk is in tree "entry"/);
    expect(() => answer({ ...s, format: 'other' } as unknown as WalkState, entry, { kind: 'option', optionId: 'x' })).toThrow(/walk format must be/);
  });

  it('never mutates the state it is given', () => {
    const s = start(entry, heron, { at: T(0) });
    const frozen = JSON.stringify(s);
    answer(s, entry, { kind: 'gate', role: 'field-engineer', confirmed: ['procedure', 'permit', 'ppe', 'lockout'] });
    expect(JSON.stringify(s)).toBe(frozen);
  });
});

describe('going straight to one symptom', () => {
  const gateOk = { kind: 'gate' as const, role: 'field-engineer' as const, confirmed: ['procedure', 'permit', 'ppe', 'lockout'] as ('procedure' | 'permit' | 'ppe' | 'lockout')[] };

  it('opens at the shared safety gate itself, not a copy of it', () => {
    const s = startDirect(entry, noSignal, heron, { at: T(0) });
    expect(s).toMatchObject({ treeId: 'entry', nodeId: 'E1', status: 'walking', direct: 'no-signal', steps: [], readings: [] });
    expect(currentNode(s, entry)).toBe(entry.nodes.find((n) => n.id === 'E1'));
    expect(currentNode(s, entry).kind).toBe('gate');
    // A walk started the usual way carries no direct mark (saved walks keep their shape).
    expect('direct' in start(entry, heron)).toBe(false);
  });

  it('a refused gate stops and escalates, as on the full walk', () => {
    const s = answer(startDirect(entry, noSignal, null), entry, { kind: 'gate', role: 'analyst', confirmed: ['procedure', 'ppe'] });
    expect(s).toMatchObject({ nodeId: 'E-stop', status: 'at-leaf', outcome: { escalate: true } });
  });

  it('once confirmed, hands over to the chosen symptom, skipping the as-found record; Back returns to the gate', () => {
    const gated = answer(startDirect(entry, noSignal, heron, { at: T(0) }), entry, gateOk, { at: T(1) });
    expect(gated).toMatchObject({ treeId: 'entry', nodeId: 'E1', status: 'hand-over', handOver: 'no-signal', queue: [] });
    expect(gated.steps[0].answer).toMatchObject({ kind: 'gate', accepted: true, role: 'field-engineer' });
    expect(() => enter(gated, vacuum)).toThrow(/cannot move to tree "vacuum"/);
    const inTree = enter(gated, noSignal, { at: T(2) });
    expect(inTree).toMatchObject({ treeId: 'no-signal', nodeId: 'NS1', status: 'walking' });
    expect(inTree.path.map((p) => `${p.treeId}/${p.nodeId}`)).toEqual(['entry/E1', 'entry/E1', 'no-signal/NS1']);
    expect(inTree.readings).toEqual([]);
    expect(back(inTree)).toMatchObject({ treeId: 'entry', nodeId: 'E1', status: 'hand-over', handOver: 'no-signal' });
    expect(back(gated)).toMatchObject({ treeId: 'entry', nodeId: 'E1', status: 'walking', handOver: null, steps: [] });
    // The saved state resumes exactly.
    const saved = JSON.parse(JSON.stringify(inTree)) as WalkState;
    expect(saved).toStrictEqual(inTree);
    expect(answer(saved, noSignal, { kind: 'option', optionId: 'nothing' }, { at: T(3) })).toEqual(answer(inTree, noSignal, { kind: 'option', optionId: 'nothing' }, { at: T(3) }));
  });

  it('gates further on in the symptom tree still lead where they always did', () => {
    let s = enter(answer(startDirect(entry, noSignal, heron), entry, gateOk), noSignal);
    for (const o of ['nothing', 'no-flow-ok', 'ei']) s = answer(s, noSignal, { kind: 'option', optionId: o });
    s = answer(s, noSignal, { kind: 'measure', value: 0, inputs: { setPoint: 50 } });
    expect(currentNode(s, noSignal).kind).toBe('gate');
    expect(answer(s, noSignal, { kind: 'gate', role: 'field-engineer', confirmed: ['lockout', 'discharge', 'ppe', 'procedure'] }).nodeId).toBe('NS3E2');
  });

  it('refuses a tree that does not open with a gate, and a direct start into the entry itself', () => {
    expect(() => startDirect(noSignal, leak, heron)).toThrow(/must open with a safety gate/);
    expect(() => startDirect(entry, entry, heron)).toThrow(/goes to a symptom tree/);
  });
});

// Diagnose: the structural check over every shipped tree, and a long walk (answers, readings with expected
// values from the engine, Back, JSON round trip as a reload does). Targets: check < 5 ms, a step < 1 ms on a
// phone-class CPU. Figures only, no asserts.
import { answer, back, enter, start, treeById, treeProblems, trees, type DiagnoseInstrument, type WalkState } from '../src/diagnose';
import { medianMs, report } from './timing';

const analyser: DiagnoseInstrument = {
  id: 'bench', name: 'Bench analyser', kind: 'gc-ms-single', rodFieldRadius: 4.5e-3, rodLength: 0.15, rfFrequency: 1e6,
  maxRfAmplitude: 1600, axialEnergy: 5, readbackConvention: { amplitude: 'zero-to-peak', reference: 'per-rod' },
};

function longWalk(): WalkState {
  const entry = treeById('entry');
  const ns = treeById('no-signal');
  let s = start(entry, analyser);
  s = answer(s, entry, { kind: 'gate', role: 'field-engineer', confirmed: ['procedure', 'permit', 'ppe', 'lockout'] });
  s = answer(s, entry, { kind: 'measure', value: 2e-5, unit: 'mbar' });
  s = answer(s, entry, { kind: 'option', optionId: 'vent' });
  s = answer(s, entry, { kind: 'option', optionId: 'sudden' });
  s = answer(s, entry, { kind: 'options', optionIds: ['no-signal'] });
  s = enter(s, ns);
  s = answer(s, ns, { kind: 'option', optionId: 'nothing' });
  s = answer(s, ns, { kind: 'measure', value: 1.5e-5, unit: 'mbar' });
  s = answer(s, ns, { kind: 'option', optionId: 'ei' });
  s = answer(s, ns, { kind: 'measure', value: 50, inputs: { setPoint: 50 } });
  s = answer(s, ns, { kind: 'option', optionId: 'plausible' });
  s = answer(s, ns, { kind: 'option', optionId: 'output' });
  s = answer(s, ns, { kind: 'gate', role: 'field-engineer', confirmed: ['lockout', 'ppe', 'procedure'] });
  s = answer(s, ns, { kind: 'measure', value: 100.9, inputs: { mz: 69 } });
  s = back(s);
  s = answer(s, ns, { kind: 'measure', value: 100.9, inputs: { mz: 69 } });
  s = answer(s, ns, { kind: 'measure', value: 320, inputs: { mzFirst: 69, rfFirst: 100.9, mz: 219 } });
  s = answer(s, ns, { kind: 'option', optionId: 'none' });
  s = answer(s, ns, { kind: 'option', optionId: 'single' });
  return JSON.parse(JSON.stringify(s)) as WalkState;
}

export function run(): void {
  const nodes = trees.reduce((n, t) => n + t.nodes.length, 0);
  report(`treeProblems over all ${trees.length} trees (${nodes} nodes)`, medianMs(() => trees.forEach(treeProblems), 21, 3), 'ms', '< 5 ms');
  const steps = longWalk().steps.length;
  const ms = medianMs(longWalk, 21, 3);
  report(`walk of ${steps} steps with engine expectations + JSON round trip`, ms, 'ms');
  report('  per step', ms / steps, 'ms', '< 1 ms');
}

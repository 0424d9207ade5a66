import { describe, expect, it } from 'vitest';
import { cardProblems, DEFERRAL, SAFETY_CARDS, treeProblems, trees, TREE_IDS } from '../../../src/diagnose';
import type { DiagnoseNode, Tree } from '../../../src/diagnose';

const closing = { kind: 're-measure-and-record' as const, what: 'the value' };

/** A small sound tree to break one way at a time. */
function sound(): Tree {
  return {
    id: 'noise',
    title: 'Test tree',
    summary: 'for the checker',
    entry: 'A',
    nodes: [
      { id: 'A', kind: 'question', title: 'A', text: 'a?', options: [{ id: 'y', label: 'yes', next: 'G' }, { id: 'n', label: 'no', next: 'L1' }] },
      { id: 'G', kind: 'gate', title: 'G', text: 'gate', roles: ['field-engineer'], asks: ['role', 'lockout', 'ppe', 'procedure'], next: 'M', refuse: 'L1', cards: ['lockout'] },
      {
        id: 'M',
        kind: 'measure',
        title: 'M',
        text: 'measure',
        access: 'energised',
        hazards: ['rf'],
        cards: ['rf'],
        measure: { quantity: 'RF', unit: 'V', tool: 'monitor point', how: 'read it' },
        expect: { calc: 'rfAtMass', inputs: [{ key: 'mz', label: 'm/z', unit: 'u', default: 69, min: 1, max: 10000 }], tolerance: { kind: 'relative', pass: 0.05, borderline: 0.1 } },
        branches: { pass: 'L1', borderline: 'L1', low: 'L2', high: 'L2' },
      },
      { id: 'L1', kind: 'action', title: 'L1', text: 'do', steps: ['one'], closing },
      { id: 'L2', kind: 'action', title: 'L2', text: 'do', steps: ['two'], closing },
    ],
  };
}

function broken(edit: (t: Tree, n: (id: string) => DiagnoseNode) => void): string[] {
  const t = structuredClone(sound());
  edit(t, (id) => t.nodes.find((x) => x.id === id) as DiagnoseNode);
  return treeProblems(t);
}

describe('shipped trees', () => {
  it('ships the entry and all seven symptom trees', () => {
    expect(trees.map((t) => t.id).sort()).toEqual([...TREE_IDS].sort());
  });
  for (const t of trees) {
    it(`${t.id} is structurally sound (${t.nodes.length} nodes)`, () => {
      expect(treeProblems(t)).toEqual([]);
    });
  }
  it('the no-signal tree is the most complete', () => {
    const ns = trees.find((t) => t.id === 'no-signal')!;
    for (const t of trees) expect(ns.nodes.length).toBeGreaterThanOrEqual(t.nodes.length);
  });
  it('every leaf of every tree closes with re-measure and record', () => {
    for (const t of trees) for (const n of t.nodes) if (n.kind === 'action') expect(n.closing.kind, `${t.id}/${n.id}`).toBe('re-measure-and-record');
  });
  it('measurement steps with a physics expectation exist where the brief asks (RF, cut-off, gas load, mean free path)', () => {
    const calcs = new Set<string>();
    for (const t of trees) for (const n of t.nodes) if (n.kind === 'measure') {
      if (n.expect && 'calc' in n.expect) calcs.add(n.expect.calc);
      for (const d of n.derived ?? []) calcs.add(d.calc);
    }
    for (const c of ['rfAtMass', 'rfProportional', 'rfOnlyCutoff', 'gaugeReadingForCarrier', 'meanFreePath', 'truePressureFromGauge', 'dcAtMass', 'apparentMassShift']) expect(calcs.has(c), c).toBe(true);
  });
});

describe('safety cards', () => {
  it('every card names hazards, precautions, sources and ends with the deferral', () => {
    expect(cardProblems()).toEqual([]);
    for (const c of Object.values(SAFETY_CARDS)) expect(c.deferral).toBe(DEFERRAL);
    expect(DEFERRAL).toMatch(/maker's procedures.*site's safety rules and permits.*local codes.*licensed/);
  });
  it('the cards name the standards of domain notes §4', () => {
    expect(SAFETY_CARDS.lockout.sources.join(' ')).toMatch(/1910\.147/);
    expect(SAFETY_CARDS['high-voltage'].sources.join(' ')).toMatch(/61010-1/);
    expect(SAFETY_CARDS.rf.sources.join(' ')).toMatch(/C95\.1/);
    expect(SAFETY_CARDS.vacuum.sources.join(' ')).toMatch(/EN 1012-2/);
    expect(SAFETY_CARDS.turbo.sources.join(' ')).toMatch(/ISO 27892/);
    expect(SAFETY_CARDS['hot-surface'].sources.join(' ')).toMatch(/ISO 13732-1/);
    expect(SAFETY_CARDS.gas.sources.join(' ')).toMatch(/CGA P-1/);
  });
});

describe('treeProblems catches each kind of defect', () => {
  it('accepts the sound test tree', () => {
    expect(treeProblems(sound())).toEqual([]);
  });
  it('missing entry node', () => {
    expect(broken((t) => { t.entry = 'nope'; })).toEqual(['The entry node "nope" does not exist.']);
  });
  it('duplicate node id', () => {
    expect(broken((t) => { t.nodes.push({ ...t.nodes[3] }); }).join(' ')).toMatch(/used twice/);
  });
  it('unreachable node', () => {
    expect(broken((t) => { t.nodes.push({ id: 'X', kind: 'action', title: 'x', text: 'x', steps: ['x'], closing }); })).toEqual([
      'Node "X" cannot be reached from the entry "A".',
    ]);
  });
  it('dead end: an answer pointing nowhere', () => {
    expect(broken((_t, n) => { (n('A') as Extract<DiagnoseNode, { kind: 'question' }>).options[1].next = 'gone'; }).join(' ')).toMatch(/leads \(answer "no"\) to "gone", which does not exist: a dead end/);
  });
  it('dead end: a question with no answers', () => {
    expect(broken((_t, n) => { (n('A') as Extract<DiagnoseNode, { kind: 'question' }>).options = []; }).join(' ')).toMatch(/has no answers: a dead end/);
  });
  it('dead end: a measurement with no branch for a verdict', () => {
    expect(broken((_t, n) => { delete (n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).branches.high; })).toEqual([
      'Measurement "M" has nowhere to go on verdict "high": a dead end.',
    ]);
  });
  it('unmarked cycle', () => {
    const p = broken((_t, n) => { (n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).branches.low = 'A'; });
    expect(p.join(' ')).toMatch(/unmarked cycle A → G → M → A/);
  });
  it('a marked bounded loop is allowed, an unbounded one is not', () => {
    const ok = broken((_t, n) => { (n('A') as Extract<DiagnoseNode, { kind: 'question' }>).options.push({ id: 'again', label: 'again', next: 'A', loop: { max: 5 } }); });
    expect(ok).toEqual([]);
    const bad = broken((_t, n) => { (n('A') as Extract<DiagnoseNode, { kind: 'question' }>).options.push({ id: 'again', label: 'again', next: 'A', loop: { max: 0 } }); });
    expect(bad.join(' ')).toMatch(/bound is not a whole number from 1 to 50/);
  });
  it('a node whose only way out is its loop', () => {
    const p = broken((t) => {
      t.nodes.push({ id: 'Q', kind: 'question', title: 'q', text: 'q', options: [{ id: 'l', label: 'loop', next: 'Q', loop: { max: 3 } }] });
      (t.nodes[0] as Extract<DiagnoseNode, { kind: 'question' }>).options.push({ id: 'q', label: 'q', next: 'Q' });
    });
    expect(p.join(' ')).toMatch(/only looping answers/);
    expect(p.join(' ')).toMatch(/From node "Q" no path reaches an action/);
  });
  it('a leaf without "re-measure and record"', () => {
    expect(broken((_t, n) => { delete (n('L2') as Partial<Extract<DiagnoseNode, { kind: 'action' }>>).closing; })).toEqual([
      'Action "L2" does not end with "re-measure and record".',
    ]);
  });
  it('a hazard without its card', () => {
    expect(broken((_t, n) => { n('M').cards = []; }).join(' ')).toMatch(/involves rf but does not carry the "rf" safety card/);
  });
  it('energised work not behind a gate', () => {
    const p = broken((_t, n) => { (n('A') as Extract<DiagnoseNode, { kind: 'question' }>).options[0].next = 'M'; n('G').access = undefined; });
    expect(p.join(' ')).toMatch(/is reached from "A" without passing an acknowledgement gate/);
  });
  it('a gate that does not ask for lockout/tagout', () => {
    expect(broken((_t, n) => { (n('G') as Extract<DiagnoseNode, { kind: 'gate' }>).asks = ['role', 'ppe', 'procedure']; })).toEqual([
      'Gate "G" in front of "M" does not ask for lockout.',
    ]);
  });
  it('a gate whose refusal is not an action', () => {
    expect(broken((_t, n) => { (n('G') as Extract<DiagnoseNode, { kind: 'gate' }>).refuse = 'A'; }).join(' ')).toMatch(/must send a refusal to an action leaf/);
  });
  it('an expected value naming a computation that is not in the registry', () => {
    expect(broken((_t, n) => { ((n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).expect as { calc: string }).calc = 'rfGuess'; })).toEqual([
      'Measurement "M" names the computation "rfGuess", which is not in the expectations registry.',
    ]);
  });
  it('an expected value in a unit that cannot be compared with the reading', () => {
    expect(broken((_t, n) => { (n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).measure.unit = 'mbar'; })).toEqual([
      'Measurement "M" is entered in "mbar" but "rfAtMass" gives "V".',
    ]);
  });
  it('a computation input that is missing or has a default out of range', () => {
    expect(broken((_t, n) => { ((n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).expect as { inputs: unknown[] }).inputs = []; })).toEqual([
      'Measurement "M" does not give input "mz" to "rfAtMass".',
    ]);
    expect(broken((_t, n) => { ((n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).expect as { inputs: { default: number }[] }).inputs[0].default = 0; })).toEqual([
      'Input "mz" of "M" has a default outside its range.',
    ]);
  });
  it('a measurement that does not say tool and how', () => {
    expect(broken((_t, n) => { (n('M') as Extract<DiagnoseNode, { kind: 'measure' }>).measure.tool = ''; })).toEqual([
      'Measurement "M" must say what to measure, with which tool, and how.',
    ]);
  });
  it('a hand-over to an unknown tree, and a multiple choice with an answer that is not a hand-over', () => {
    const p = broken((t) => {
      t.nodes[0] = { id: 'A', kind: 'choice', multiple: true, title: 'A', text: 'which?', options: [{ id: 's', label: 's', tree: 'smell' as never }, { id: 'y', label: 'y', next: 'G' }] };
    });
    expect(p.join(' ')).toMatch(/hands over to an unknown tree "smell"/);
    expect(p.join(' ')).toMatch(/allows several answers, so every answer must hand over to a tree/);
  });
});

import { describe, expect, it } from 'vitest';
import { cardProblems, DEFERRAL, SAFETY_CARDS, treeProblems, trees, TREE_IDS } from '../../../src/diagnose';
import type { DiagnoseNode, Tree } from '../../../src/diagnose';
import { handsOnWord } from '../../../src/diagnose/check';
import { GATE_ASKS, GATE_MUST_NOT_ASK } from '../../../src/diagnose/safety';

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
      { id: 'G', kind: 'gate', title: 'G', text: 'gate', guards: 'energised', roles: ['field-engineer'], asks: ['role', 'live-work', 'meter-rating', 'ppe', 'procedure'], next: 'M', refuse: 'L1', cards: ['rf'] },
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
  it('the cards name the usual standards for each hazard', () => {
    expect(SAFETY_CARDS.lockout.sources.join(' ')).toMatch(/1910\.147/);
    expect(SAFETY_CARDS['high-voltage'].sources.join(' ')).toMatch(/61010-1/);
    expect(SAFETY_CARDS.rf.sources.join(' ')).toMatch(/C95\.1/);
    expect(SAFETY_CARDS.vacuum.sources.join(' ')).toMatch(/EN 1012-2/);
    expect(SAFETY_CARDS.turbo.sources.join(' ')).toMatch(/ISO 27892/);
    expect(SAFETY_CARDS['hot-surface'].sources.join(' ')).toMatch(/ISO 13732-1/);
    expect(SAFETY_CARDS.gas.sources.join(' ')).toMatch(/CGA P-1/);
  });
});

describe('standards and thresholds on the cards', () => {
  const STANDARD = /\b(IEC|ISO|EN|NFPA|ANSI|CGA|OSHA|IEEE|UN GHS)\b/;
  const EDITION = /:\d{4}|-\d{4}|\b\d{4} edition|\(\d{4}\)|as in force \d{4}|Rev\. \d+|\b(19|20)\d{2}\b/;
  it('every source that names a standard names its edition', () => {
    for (const c of Object.values(SAFETY_CARDS)) for (const src of c.sources) if (STANDARD.test(src)) expect(src, `${c.id}: ${src}`).toMatch(EDITION);
  });
  it('every threshold stated on a card says where the number comes from', () => {
    const THRESHOLD = /\d\s*(V|kV|%|N|°C|h|kHz|MHz)\b/;
    const ORIGIN = /common practice|from memory|computed|IEC|ISO|OSHA|Dawson/;
    let seen = 0;
    for (const c of Object.values(SAFETY_CARDS)) for (const line of [...c.hazards, ...c.precautions]) if (THRESHOLD.test(line)) {
      seen++;
      expect(line, c.id).toMatch(ORIGIN);
    }
    expect(seen).toBeGreaterThan(5);
  });
  it('the tracer card covers live parts, confined spaces and flammable tracers', () => {
    const text = [...SAFETY_CARDS.tracer.hazards, ...SAFETY_CARDS.tracer.precautions].join(' ');
    expect(text).toMatch(/HV feedthroughs/);
    expect(text).toMatch(/confined/);
    expect(text).toMatch(/Never use a flammable tracer/);
  });
});

describe('hands-on steps and their gates in the shipped trees', () => {
  it('every hands-on step declares covers-off, energised or covers-on with a card (and there are many)', () => {
    let handsOn = 0;
    for (const t of trees) for (const n of t.nodes) {
      if (!handsOnWord(n)) continue;
      handsOn++;
      expect(['covers-on', 'covers-off', 'energised'], `${t.id}/${n.id}`).toContain(n.access);
      expect((n.cards ?? []).length, `${t.id}/${n.id}`).toBeGreaterThan(0);
    }
    expect(handsOn).toBeGreaterThan(40);
  });
  it('the steps named in the safety review are declared', () => {
    const access = (tree: string, id: string) => trees.find((t) => t.id === tree)!.nodes.find((n) => n.id === id)!.access;
    expect(access('peak-shape', 'PS5-fringe')).toBe('covers-off'); // entrance lens cleaning
    expect(access('no-signal', 'NS3A-blocked')).toBe('covers-off'); // sampling orifice
    expect(access('no-signal', 'NS4-hv')).toBe('covers-off'); // HV supply replacement
    expect(access('no-signal', 'NS4-em')).toBe('covers-off'); // multiplier replacement
    expect(access('no-signal', 'NS4-tp')).toBe('energised'); // kilovolt test point
    expect(access('noise', 'NU3-em')).toBe('covers-off'); // HV feedthroughs
    expect(access('vacuum', 'VF4-ctl')).toBe('covers-off'); // controller cables
    expect(access('vacuum', 'VF3-exhaust')).toBe('covers-off'); // pump parts
    expect(access('noise', 'NU4s')).toBe('energised'); // oscilloscope on a running instrument
    expect(access('leak', 'HB6')).toBe('covers-on'); // tracer spray, with its card
    expect(trees.find((t) => t.id === 'leak')!.nodes.find((n) => n.id === 'HB6')!.cards).toContain('tracer');
  });
  it('every gate asks what its work needs and nothing that does not fit it', () => {
    let live = 0;
    for (const t of trees) for (const n of t.nodes) if (n.kind === 'gate') {
      for (const a of GATE_ASKS[n.guards]) expect(n.asks, `${t.id}/${n.id}`).toContain(a);
      for (const a of GATE_MUST_NOT_ASK[n.guards]) expect(n.asks, `${t.id}/${n.id}`).not.toContain(a);
      if (n.guards === 'energised') {
        live++;
        expect(n.asks).toEqual(expect.arrayContaining(['live-work', 'meter-rating']));
        expect(n.asks).not.toContain('lockout');
      }
    }
    expect(live).toBeGreaterThanOrEqual(4);
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
  it('a live-work gate that asks for lockout instead of live-work authorisation and rated meters', () => {
    expect(broken((_t, n) => { (n('G') as Extract<DiagnoseNode, { kind: 'gate' }>).asks = ['role', 'lockout', 'ppe', 'procedure']; })).toEqual([
      'Gate "G" guards energised work but does not ask for live-work.',
      'Gate "G" guards energised work but does not ask for meter-rating.',
      'Gate "G" guards energised work but asks for lockout, which does not fit that work.',
    ]);
  });
  it('a de-energised gate that does not ask for lockout or the discharge wait', () => {
    const p = broken((_t, n) => {
      const m = n('M');
      m.access = 'covers-off';
      m.hazards = ['stored-charge'];
      m.cards = ['lockout', 'stored-charge'];
      const g = n('G') as Extract<DiagnoseNode, { kind: 'gate' }>;
      g.guards = 'covers-off';
      g.cards = ['lockout', 'stored-charge'];
      g.asks = ['role', 'ppe', 'procedure'];
    });
    expect(p).toEqual(['Gate "G" guards covers-off work but does not ask for lockout.', 'Gate "G" guards covers-off work but does not ask for discharge.']);
  });
  it('a gate whose kind does not match the step behind it', () => {
    const p = broken((_t, n) => {
      const g = n('G') as Extract<DiagnoseNode, { kind: 'gate' }>;
      g.guards = 'covers-off';
      g.asks = ['role', 'lockout', 'discharge', 'ppe', 'procedure'];
    });
    expect(p).toEqual(['Gate "G" guards covers-off work but the step behind it ("M") is declared energised.']);
  });
  it('a gate that does not show the card of the step behind it', () => {
    expect(broken((_t, n) => { n('G').cards = []; })).toEqual(['Gate "G" does not show the "rf" card of the step behind it ("M").']);
  });
  it('a hands-on step left undeclared (a tree built to break the rule)', () => {
    const p = broken((_t, n) => {
      const leafNode = n('L2') as Extract<DiagnoseNode, { kind: 'action' }>;
      leafNode.steps = ['Replace the HV supply module by the procedure.'];
    });
    expect(p).toEqual(['Node "L2" puts hands on the instrument ("Replace") but does not declare covers-off, energised, or covers-on access.']);
    // Declared read-back does not excuse it either; each family of words is caught.
    for (const text of ['Clean the entrance lens.', 'Spray a short burst of helium at the joint.', 'Unplug the controller cables.', 'Put an oscilloscope on the monitor output.', 'Check the HV feedthroughs.', 'Probe the kilovolt test point.', 'Change the oil.']) {
      const q = broken((_t, n) => {
        n('L2').access = 'read-back';
        n('L2').text = text;
      });
      expect(q.join(' '), text).toMatch(/puts hands on the instrument/);
    }
  });
  it('a covers-on hands-on step without its hazard card', () => {
    const p = broken((_t, n) => {
      n('L2').text = 'Change the cylinder.';
      n('L2').access = 'covers-on';
    });
    expect(p).toEqual(['Node "L2" is covers-on hands-on work but names no hazard and card.']);
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

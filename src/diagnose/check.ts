/**
 * Structural check of a tree: returns [] for a sound tree, one plain sentence per problem otherwise.
 */
import { EXPECTATION_INFO } from './expectations';
import { GATE_ASKS, GATE_MUST_NOT_ASK, HAZARD_CARD, SAFETY_CARDS } from './safety';
import type { CalcRef, DiagnoseNode, Expectation, Option, Tree } from './types';
import { TREE_IDS } from './types';
import { sameDimension, unitKnown } from '../records/units';

/**
 * Words that put hands inside the instrument or on live parts: opening, cleaning, replacing, unplugging,
 * probing, spraying a tracer, working at feedthroughs, cables, pumps and gas lines. A step whose title, text,
 * points, steps or measuring instructions use one of them must declare its access (covers-off, energised, or
 * covers-on with a hazard card). Words are matched whole, in any case.
 */
export const HANDS_ON_WORDS: readonly RegExp[] = [
  /\b(clean|cleaning)\b(?!\s+solvents?)/i,
  /\b(replace|replaced|replacing|refill|swap|realign|remove|removing|trim)\b/i,
  /\b(unplug|unplugging|disconnect|disconnected|reconnect|wiggle-test)\b/i,
  /\b(open|opens|opening)\s+(the|a|its)\b/i,
  /\b(vent(ed)? (the|it)|vent,|needs? (a )?vent(ing)?|may need venting|vent only)\b/i,
  /\b(probe|probes|probing|oscilloscope|test points?|pickup loop|divider probe)\b/i,
  /\b(multimeter|insulation tester)\b/i,
  /\bfeedthroughs?\b/i,
  /\b(cable|cables|connectors?|pins?)\b/i,
  /\btracer\b.*\b(spray|burst)|\bspray (a|the) (short )?(burst|tracer)/i,
  /\b(lock (it|the pump|out)|locked out)\b/i,
  /\b(the oil|mist filter|exhaust line|gas ballast|blank flange|blank the|blanked)\b/i,
  /\b(chang(e|ing)|correct) (the )?(oil|cylinders?|regulators?|filament)\b|\b(moisture trap|gas lines?)\b/i,
  /\bbond\b/i,
  /\b(leak detector|installation depth|housing)\b/i,
];

/** The words of a node that say what the engineer does (answers and sources are not instructions). */
function instructionText(n: DiagnoseNode): string {
  const parts = [n.title, n.text, ...(n.points ?? [])];
  if (n.kind === 'action') parts.push(...n.steps);
  if (n.kind === 'measure') parts.push(n.measure.tool, n.measure.how);
  return parts.join('\n');
}

/** The first hands-on word a node uses, or null. */
export function handsOnWord(n: DiagnoseNode): string | null {
  if (n.kind === 'gate') return null;
  const text = instructionText(n);
  for (const re of HANDS_ON_WORDS) {
    const m = re.exec(text);
    if (m) return m[0];
  }
  return null;
}

export interface Edge {
  to: string;
  loop?: { max: number };
  label: string;
}

/** Every edge out of a node to another node of the same tree (tree hand-overs are not edges). */
export function edgesOf(node: DiagnoseNode): Edge[] {
  const fromOptions = (opts: Option[] | undefined) =>
    (opts ?? []).filter((o) => o.next !== undefined).map((o) => ({ to: o.next as string, loop: o.loop, label: `answer "${o.label}"` }));
  switch (node.kind) {
    case 'question':
    case 'choice':
      return fromOptions(node.options);
    case 'gate':
      return [
        { to: node.next, label: 'confirmed' },
        { to: node.refuse, label: 'not confirmed' },
      ];
    case 'measure': {
      const out: Edge[] = [];
      for (const [k, v] of Object.entries(node.branches)) if (v !== undefined) out.push({ to: v, label: `verdict ${k}` });
      return out.concat(fromOptions(node.alternatives));
    }
    case 'action':
      return [];
  }
}

function isComputed(e: Expectation): e is Extract<Expectation, { calc: string }> {
  return (e as { calc?: string }).calc !== undefined;
}

export function treeProblems(tree: Tree): string[] {
  const p: string[] = [];
  const byId = new Map<string, DiagnoseNode>();
  for (const n of tree.nodes) {
    if (byId.has(n.id)) p.push(`Node id "${n.id}" is used twice.`);
    byId.set(n.id, n);
  }
  if (!TREE_IDS.includes(tree.id)) p.push(`Tree id "${tree.id}" is not one of ${TREE_IDS.join(', ')}.`);
  if (!byId.has(tree.entry)) {
    p.push(`The entry node "${tree.entry}" does not exist.`);
    return p;
  }

  // Edges resolve; hand-overs name real trees.
  const preds = new Map<string, DiagnoseNode[]>();
  for (const n of tree.nodes) {
    for (const e of edgesOf(n)) {
      if (!byId.has(e.to)) p.push(`Node "${n.id}" leads (${e.label}) to "${e.to}", which does not exist: a dead end.`);
      else {
        const list = preds.get(e.to) ?? [];
        list.push(n);
        preds.set(e.to, list);
      }
      if (e.loop && !(Number.isInteger(e.loop.max) && e.loop.max >= 1 && e.loop.max <= 50)) {
        p.push(`Node "${n.id}" has a loop (${e.label}) whose bound is not a whole number from 1 to 50.`);
      }
    }
    const handOvers: string[] = [];
    if (n.kind === 'question' || n.kind === 'choice') for (const o of n.options) if (o.tree) handOvers.push(o.tree);
    if (n.kind === 'action') handOvers.push(...(n.continueWith ?? []));
    for (const t of handOvers) if (!TREE_IDS.includes(t as never)) p.push(`Node "${n.id}" hands over to an unknown tree "${t}".`);
  }

  // Kind-specific rules.
  for (const n of tree.nodes) {
    switch (n.kind) {
      case 'question':
      case 'choice': {
        if (n.options.length === 0) p.push(`Node "${n.id}" has no answers: a dead end.`);
        const ids = new Set<string>();
        for (const o of n.options) {
          if (ids.has(o.id)) p.push(`Node "${n.id}" has the answer id "${o.id}" twice.`);
          ids.add(o.id);
          if ((o.next === undefined) === (o.tree === undefined)) p.push(`Answer "${o.label}" of node "${n.id}" must lead to exactly one next node or one tree.`);
        }
        if (n.kind === 'choice' && n.multiple && n.options.some((o) => !o.tree)) p.push(`Node "${n.id}" allows several answers, so every answer must hand over to a tree.`);
        if (n.kind === 'question' && n.options.some((o) => o.tree)) p.push(`Question "${n.id}" hands over to a tree; only a choice may.`);
        const exits = n.options.filter((o) => !o.loop);
        if (exits.length === 0) p.push(`Node "${n.id}" has only looping answers: the walk could never leave it.`);
        break;
      }
      case 'gate': {
        if (n.roles.length === 0) p.push(`Gate "${n.id}" names no role allowed to do the step.`);
        if (n.asks.length === 0) p.push(`Gate "${n.id}" asks for nothing.`);
        // The gate's asks match the work it guards.
        const work = n.guards;
        for (const a of GATE_ASKS[work] ?? []) if (!n.asks.includes(a)) p.push(`Gate "${n.id}" guards ${work} work but does not ask for ${a}.`);
        for (const a of GATE_MUST_NOT_ASK[work] ?? []) if (n.asks.includes(a)) p.push(`Gate "${n.id}" guards ${work} work but asks for ${a}, which does not fit that work.`);
        if (!GATE_ASKS[work]) p.push(`Gate "${n.id}" guards an unknown kind of work "${String(work)}".`);
        const behind = byId.get(n.next);
        if (behind && (work === 'covers-off' || work === 'energised') && behind.access !== work) {
          p.push(`Gate "${n.id}" guards ${work} work but the step behind it ("${behind.id}") is declared ${behind.access ?? 'without access'}.`);
        }
        if (behind) for (const c of behind.cards ?? []) if (!(n.cards ?? []).includes(c)) p.push(`Gate "${n.id}" does not show the "${c}" card of the step behind it ("${behind.id}").`);
        const refuse = byId.get(n.refuse);
        if (refuse && refuse.kind !== 'action') p.push(`Gate "${n.id}" must send a refusal to an action leaf (stop and escalate), not to "${n.refuse}".`);
        break;
      }
      case 'measure': {
        const m = n.measure;
        if (!m.quantity || !m.tool || !m.how) p.push(`Measurement "${n.id}" must say what to measure, with which tool, and how.`);
        if (!unitKnown(m.unit)) p.push(`Measurement "${n.id}" uses an unknown unit "${m.unit}".`);
        for (const u of m.altUnits ?? []) if (!sameDimension(u, m.unit)) p.push(`Measurement "${n.id}" offers unit "${u}", which does not measure the same thing as "${m.unit}".`);
        const b = n.branches;
        if (n.expect) {
          for (const k of ['pass', 'borderline', 'low', 'high'] as const) {
            if (b[k] === undefined && b.otherwise === undefined) p.push(`Measurement "${n.id}" has nowhere to go on verdict "${k}": a dead end.`);
          }
        } else if (b.otherwise === undefined) {
          p.push(`Measurement "${n.id}" has no expected value, so it needs an "otherwise" branch.`);
        }
        const all: Array<Expectation | CalcRef> = [...(n.expect ? [n.expect] : []), ...(n.derived ?? [])];
        for (const e of all) {
          if ('calc' in e) {
            const info = EXPECTATION_INFO[e.calc];
            if (!info) {
              p.push(`Measurement "${n.id}" names the computation "${e.calc}", which is not in the expectations registry.`);
              continue;
            }
            const given = new Set((e.inputs ?? []).map((i) => i.key));
            for (const k of info.inputs) {
              // Optional physics inputs (temperature, diameter) have defaults in the registry.
              if (!given.has(k) && k !== 'temperature' && k !== 'diameter') p.push(`Measurement "${n.id}" does not give input "${k}" to "${e.calc}".`);
            }
            for (const i of e.inputs ?? []) {
              if (!unitKnown(i.unit)) p.push(`Input "${i.key}" of "${n.id}" uses an unknown unit "${i.unit}".`);
              if (!(i.min <= i.max)) p.push(`Input "${i.key}" of "${n.id}" has min above max.`);
              if (i.default !== undefined && (i.default < i.min || i.default > i.max)) p.push(`Input "${i.key}" of "${n.id}" has a default outside its range.`);
              if (i.fromReading && !sameDimension(i.unit, m.unit)) p.push(`Input "${i.key}" of "${n.id}" is taken from the reading but its unit "${i.unit}" differs in kind from "${m.unit}".`);
            }
            if (e === n.expect && info.unit !== 'as-entered' && !sameDimension(info.unit, m.unit)) {
              p.push(`Measurement "${n.id}" is entered in "${m.unit}" but "${e.calc}" gives "${info.unit}".`);
            }
          } else {
            if (!(e.range.low <= e.range.high)) p.push(`Measurement "${n.id}" has an expected range whose low end is above its high end.`);
            if (!e.source) p.push(`Measurement "${n.id}" gives a range without a source.`);
          }
          if (!('tolerance' in e)) continue;
          const t = e.tolerance;
          if (t.kind !== 'range' && !(t.pass >= 0 && t.borderline >= t.pass)) p.push(`Measurement "${n.id}" has a tolerance whose borderline band is narrower than its pass band.`);
        }
        break;
      }
      case 'action': {
        if (n.steps.length === 0) p.push(`Action "${n.id}" lists no steps.`);
        if (!n.closing || n.closing.kind !== 're-measure-and-record' || !n.closing.what) {
          p.push(`Action "${n.id}" does not end with "re-measure and record".`);
        }
        break;
      }
    }
    // Hazards carry their cards.
    for (const h of n.hazards ?? []) {
      const card = HAZARD_CARD[h];
      if (!card) p.push(`Node "${n.id}" names an unknown hazard "${h}".`);
      else if (!(n.cards ?? []).includes(card)) p.push(`Node "${n.id}" involves ${h} but does not carry the "${card}" safety card.`);
    }
    for (const c of n.cards ?? []) if (!SAFETY_CARDS[c]) p.push(`Node "${n.id}" carries an unknown safety card "${c}".`);
    if (n.access === 'covers-off' && !(n.cards ?? []).includes('lockout')) p.push(`Node "${n.id}" takes covers off but does not carry the "lockout" card.`);
    // Hands-on steps declare their access; covers-on work carries its hazard card.
    const word = handsOnWord(n);
    if (word && (n.access === undefined || n.access === 'read-back')) {
      p.push(`Node "${n.id}" puts hands on the instrument ("${word}") but does not declare covers-off, energised, or covers-on access.`);
    }
    if (n.access === 'covers-on' && ((n.hazards ?? []).length === 0 || (n.cards ?? []).length === 0)) {
      p.push(`Node "${n.id}" is covers-on hands-on work but names no hazard and card.`);
    }
    if (n.access === 'energised' && !(n.hazards ?? []).some((h) => h === 'high-voltage' || h === 'rf')) {
      p.push(`Node "${n.id}" is energised work but names no high-voltage or RF hazard.`);
    }
    // Covers-off or energised work sits behind a gate that asks the full set (directly, or after steps of the same access).
    if (n.access === 'covers-off' || n.access === 'energised') {
      const before = preds.get(n.id) ?? [];
      if (n.id === tree.entry || before.length === 0) p.push(`Node "${n.id}" needs covers off or energised work but no gate comes before it.`);
      for (const q of before) {
        // A run of steps of the same kind of work may follow one gate.
        if (q.kind !== 'gate' && q.access === n.access) continue;
        if (q.kind !== 'gate' || q.next !== n.id) p.push(`Node "${n.id}" needs covers off or energised work but is reached from "${q.id}" without passing an acknowledgement gate.`);
      }
    }
  }

  // Reachability from the entry.
  const seen = new Set<string>();
  const stack = [tree.entry];
  while (stack.length) {
    const id = stack.pop() as string;
    if (seen.has(id)) continue;
    seen.add(id);
    const n = byId.get(id);
    if (n) for (const e of edgesOf(n)) if (byId.has(e.to)) stack.push(e.to);
  }
  for (const n of tree.nodes) if (!seen.has(n.id)) p.push(`Node "${n.id}" cannot be reached from the entry "${tree.entry}".`);

  // Cycles: only edges marked as bounded loops may close one.
  const state = new Map<string, 1 | 2>();
  const cycles: string[] = [];
  const visit = (id: string, trail: string[]) => {
    state.set(id, 1);
    const n = byId.get(id);
    if (n) {
      for (const e of edgesOf(n)) {
        if (e.loop || !byId.has(e.to)) continue;
        const s = state.get(e.to);
        if (s === 1) {
          const path = [...trail, id];
          cycles.push([...path.slice(Math.max(0, path.indexOf(e.to))), e.to].join(' → '));
        }
        else if (s === undefined) visit(e.to, [...trail, id]);
      }
    }
    state.set(id, 2);
  };
  for (const n of tree.nodes) if (!state.has(n.id)) visit(n.id, []);
  for (const c of cycles) p.push(`There is an unmarked cycle ${c}; mark it as a bounded loop or remove it.`);

  // Every node can still reach an end (a leaf, or a hand-over to another tree).
  const canEnd = new Set<string>();
  let grew = true;
  const ends = (n: DiagnoseNode) => n.kind === 'action' || ((n.kind === 'choice' || n.kind === 'question') && n.options.some((o) => o.tree));
  while (grew) {
    grew = false;
    for (const n of tree.nodes) {
      if (canEnd.has(n.id)) continue;
      if (ends(n) || edgesOf(n).some((e) => !e.loop && canEnd.has(e.to))) {
        canEnd.add(n.id);
        grew = true;
      }
    }
  }
  for (const n of tree.nodes) if (seen.has(n.id) && !canEnd.has(n.id)) p.push(`From node "${n.id}" no path reaches an action: a dead end.`);

  return p;
}

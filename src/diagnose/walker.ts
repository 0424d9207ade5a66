/**
 * The walker: pure functions over a plain, JSON-serialisable walk state.
 *
 *   start(tree, instrument?)            → state at the tree's entry
 *   startDirect(entry, symptom, inst?)  → state at the shared safety gate; once confirmed, hands over to `symptom`
 *   answer(state, tree, input)          → new state (an option, several options, a gate, or a measured value)
 *   record(state, tree, input)          → new state with a reading stored, without moving (re-measure, as-left)
 *   enter(state, tree)                  → new state walking the next tree (after a hand-over or a leaf)
 *   back(state)                         → new state with the last answer undone (its readings kept, marked withdrawn)
 *
 * Nothing here reads the clock unless no time is given, touches storage, or mutates its inputs.
 */
import { expectations, type ExpectationFn, type ExpectedValue } from './expectations';
import { judge, type Judgement } from './judge';
import type {
  ActionNode,
  CalcRef,
  ComputedExpectation,
  DiagnoseInstrument,
  DiagnoseNode,
  GateItem,
  MeasureNode,
  Role,
  Tolerance,
  Tree,
  TreeId,
  Verdict,
  VerdictBranch,
} from './types';
import { SYMPTOM_ORDER } from './types';
import { convert, sameDimension, toSI, UNITS } from '../records/units';

export const WALK_FORMAT = 'rodside-walk/1';

export type Registry = Record<string, ExpectationFn>;

export interface WalkOptions {
  /** ISO time stamp for this step (default: now). */
  at?: string;
  /** Expected-value registry (default: the engine-backed registry once the engine is linked). */
  registry?: Registry | null;
}

export type AnswerInput =
  | { kind: 'option'; optionId: string; note?: string }
  | { kind: 'options'; optionIds: string[]; note?: string }
  | { kind: 'gate'; role: Role; confirmed: GateItem[]; note?: string }
  | {
      kind: 'measure';
      value: number;
      /** Unit the value is in (default: the node's unit). */
      unit?: string;
      /** Inputs to the expected-value computation, in the units the node declares. */
      inputs?: Record<string, number>;
      /** The engineer's own verdict, used only when no expected value can be computed. */
      verdict?: { verdict: Verdict; side?: 'low' | 'high' };
      note?: string;
    };

export interface DerivedFigure {
  calc: string;
  value: number | null;
  unit: string;
  basis: string;
}

export interface Reading {
  id: string;
  treeId: TreeId;
  nodeId: string;
  quantity: string;
  unit: string;
  value: number;
  tool: string;
  /** Expected value, limits and tolerance, in `unit`; null where none applies or none could be computed. */
  expected: number | null;
  low: number | null;
  high: number | null;
  /** Limits used, in `unit`; null where a side is open (kept finite so the state stays plain JSON). */
  tolerance: (Tolerance & { passLow: number | null; passHigh: number | null; borderLow: number | null; borderHigh: number | null }) | null;
  verdict: Verdict | 'recorded';
  side?: 'low' | 'high';
  judgedBy: 'expected' | 'engineer' | 'none';
  basis: string;
  inputs: Record<string, { value: number; unit: string }>;
  derived: DerivedFigure[];
  phase: 'as-found' | 'as-left';
  at: string;
  note?: string;
  /** Set when the answer this reading belonged to was undone; the reading itself is kept. */
  withdrawn?: boolean;
}

export type StoredAnswer =
  | { kind: 'option'; optionId: string; label: string }
  | { kind: 'options'; optionIds: string[]; labels: string[] }
  | { kind: 'gate'; role: Role; confirmed: GateItem[]; accepted: boolean }
  | { kind: 'measure'; readingId: string; verdict: Verdict | 'recorded'; side?: 'low' | 'high' }
  | { kind: 'enter'; toTree: TreeId; fromStatus: 'hand-over' | 'at-leaf'; fromHandOver: TreeId | null; fromOutcome: WalkOutcome | null };

export interface WalkStep {
  treeId: TreeId;
  nodeId: string;
  at: string;
  answer: StoredAnswer;
  note?: string;
  queueBefore: TreeId[];
}

export interface WalkOutcome {
  treeId: TreeId;
  nodeId: string;
  title: string;
  escalate: boolean;
  continueWith: TreeId[];
  closing: string;
}

export interface WalkState {
  format: typeof WALK_FORMAT;
  treeId: TreeId;
  nodeId: string;
  instrument: DiagnoseInstrument | null;
  startedAt: string;
  updatedAt: string;
  status: 'walking' | 'at-leaf' | 'hand-over';
  steps: WalkStep[];
  readings: Reading[];
  /** Trees still to walk, in work order (from the entry's symptom choice). */
  queue: TreeId[];
  /** The tree the walk is handed to when status is 'hand-over'. */
  handOver: TreeId | null;
  outcome: WalkOutcome | null;
  /** Nodes visited in order, the current one last. */
  path: Array<{ treeId: TreeId; nodeId: string }>;
  /**
   * Set on a direct start (startDirect): the symptom tree the walk goes to once the shared safety gate is
   * confirmed, skipping the as-found record. Absent on a walk started at the shared entry or straight in a tree.
   */
  direct?: TreeId;
}

/** Registry used when the caller gives none: the engine-backed one. */
const defaultRegistry: Registry = expectations;

const now = (o?: WalkOptions) => o?.at ?? new Date().toISOString();
/** Open limits (±∞) are stored as null: JSON has no infinity. */
const fin = (x: number): number | null => (Number.isFinite(x) ? x : null);

function nodeOf(tree: Tree, id: string): DiagnoseNode {
  const n = tree.nodes.find((x) => x.id === id);
  if (!n) throw new RangeError(`node "${id}" is not in tree "${tree.id}"`);
  return n;
}

function pathOf(steps: WalkStep[], treeId: TreeId, nodeId: string): WalkState['path'] {
  return [...steps.map((s) => ({ treeId: s.treeId, nodeId: s.nodeId })), { treeId, nodeId }];
}

function outcomeOf(tree: Tree, leaf: ActionNode): WalkOutcome {
  return {
    treeId: tree.id,
    nodeId: leaf.id,
    title: leaf.title,
    escalate: leaf.escalate === true,
    continueWith: leaf.continueWith ?? [],
    closing: `Re-measure and record: ${leaf.closing.what}`,
  };
}

/** Move to `nextId`, setting the status from the node kind. */
function arrive(state: WalkState, tree: Tree, nextId: string, step: WalkStep, at: string, extra?: Partial<WalkState>): WalkState {
  const next = nodeOf(tree, nextId);
  const steps = [...state.steps, step];
  return {
    ...state,
    ...extra,
    treeId: tree.id,
    nodeId: nextId,
    steps,
    updatedAt: at,
    status: next.kind === 'action' ? 'at-leaf' : 'walking',
    handOver: null,
    outcome: next.kind === 'action' ? outcomeOf(tree, next) : null,
    path: pathOf(steps, tree.id, nextId),
  };
}

export function start(tree: Tree, instrument?: DiagnoseInstrument | null, options?: WalkOptions): WalkState {
  const at = now(options);
  const first = nodeOf(tree, tree.entry);
  return {
    format: WALK_FORMAT,
    treeId: tree.id,
    nodeId: tree.entry,
    instrument: instrument ?? null,
    startedAt: at,
    updatedAt: at,
    status: first.kind === 'action' ? 'at-leaf' : 'walking',
    steps: [],
    readings: [],
    queue: [],
    handOver: null,
    outcome: first.kind === 'action' ? outcomeOf(tree, first) : null,
    path: [{ treeId: tree.id, nodeId: tree.entry }],
  };
}

/**
 * Start straight at one symptom without skipping the shared safety gate: the walk opens at the shared entry's
 * gate (the same node, so a refusal still stops and escalates) and, once it is confirmed, hands over to
 * `symptom` instead of going on to the as-found record.
 */
export function startDirect(entry: Tree, symptom: Tree, instrument?: DiagnoseInstrument | null, options?: WalkOptions): WalkState {
  const gate = nodeOf(entry, entry.entry);
  if (gate.kind !== 'gate') throw new RangeError(`tree "${entry.id}" must open with a safety gate to start a walk through it; it opens with a ${gate.kind}`);
  if (symptom.id === entry.id) throw new RangeError(`a direct start goes to a symptom tree, not back to "${entry.id}"`);
  return { ...start(entry, instrument, options), direct: symptom.id };
}

/** Order symptom trees in work order: vacuum, leak, no signal, mass axis, peak shape, sensitivity, noise. */
export function orderSymptoms(ids: TreeId[]): TreeId[] {
  const uniq = [...new Set(ids)];
  return uniq.sort((a, b) => SYMPTOM_ORDER.indexOf(a) - SYMPTOM_ORDER.indexOf(b));
}

function countTaken(state: WalkState, treeId: TreeId, nodeId: string, optionId: string): number {
  return state.steps.filter(
    (s) => s.treeId === treeId && s.nodeId === nodeId && s.answer.kind === 'option' && s.answer.optionId === optionId,
  ).length;
}

// ---------------------------------------------------------------------------
// Expected values.

export interface Preview {
  ok: boolean;
  /** In the requested unit. */
  expected: number | null;
  low: number | null;
  high: number | null;
  basis: string;
  /** Why no expected value could be found (no instrument, bad input). */
  error?: string;
}

function isComputed(e: MeasureNode['expect']): e is ComputedExpectation {
  return !!e && (e as ComputedExpectation).calc !== undefined;
}

/** Inputs in SI, from the node's declared defaults overlaid with the engineer's entries; plus the display copy. */
function siInputs(
  calc: CalcRef,
  given: Record<string, number> | undefined,
  measured: { value: number; unit: string } | undefined,
): { si: Record<string, number>; shown: Record<string, { value: number; unit: string }> } {
  const si: Record<string, number> = {};
  const shown: Record<string, { value: number; unit: string }> = {};
  for (const spec of calc.inputs ?? []) {
    let v: number | undefined;
    let unit = spec.unit;
    if (spec.fromReading) {
      if (!measured) continue;
      v = convert(measured.value, measured.unit, spec.unit);
    } else {
      v = given?.[spec.key] ?? spec.default;
      if (v === undefined || !Number.isFinite(v)) throw new RangeError(`${spec.label} is needed: enter a value between ${spec.min} and ${spec.max} ${spec.unit}.`);
      if (v < spec.min || v > spec.max) throw new RangeError(`${spec.label} (${spec.key}) must be between ${spec.min} and ${spec.max} ${spec.unit}; got ${v}`);
    }
    unit = spec.unit;
    shown[spec.key] = { value: v, unit };
    si[spec.key] = toSI(v, spec.unit);
  }
  return { si, shown };
}

/** Convert a registry result into `unit` ('as-entered' results are SI values of the node's dimension). */
function resultIn(r: ExpectedValue, unit: string): { value: number; low: number | null; high: number | null } {
  const c = (x: number) => (r.unit === 'as-entered' ? x / UNITS[unit].factor : convert(x, r.unit, unit));
  if (r.unit !== 'as-entered' && !sameDimension(r.unit, unit)) throw new RangeError(`expected value comes in ${r.unit}, which cannot be shown in ${unit}`);
  return { value: c(r.value), low: r.low === undefined ? null : c(r.low), high: r.high === undefined ? null : c(r.high) };
}

/**
 * Expected value of a measure node for an instrument and inputs, in `unit` (default: the node's unit).
 * Never throws: a problem comes back as { ok: false, error }.
 */
export function preview(
  node: MeasureNode,
  instrument: DiagnoseInstrument | null,
  inputs?: Record<string, number>,
  unit?: string,
  registry?: Registry | null,
  measured?: number,
): Preview {
  const u = unit ?? node.measure.unit;
  const e = node.expect;
  if (!e) return { ok: false, expected: null, low: null, high: null, basis: 'No expected value for this step: record what you read.', error: 'none' };
  if (!isComputed(e)) {
    return {
      ok: true,
      expected: null,
      low: convert(e.range.low, node.measure.unit, u),
      high: convert(e.range.high, node.measure.unit, u),
      basis: e.source,
    };
  }
  const reg = registry === undefined ? defaultRegistry : registry;
  const fn = reg?.[e.calc];
  if (!fn) return { ok: false, expected: null, low: null, high: null, basis: '', error: `The computation "${e.calc}" is not available yet; judge the reading yourself.` };
  try {
    const { si } = siInputs(e, inputs, measured === undefined ? undefined : { value: measured, unit: u });
    const r = fn(instrument, si);
    const v = resultIn(r, u);
    return { ok: true, expected: v.value, low: v.low, high: v.high, basis: r.basis };
  } catch (err) {
    return { ok: false, expected: null, low: null, high: null, basis: '', error: (err as Error).message };
  }
}

function derivedFigures(node: MeasureNode, instrument: DiagnoseInstrument | null, inputs: Record<string, number> | undefined, measured: { value: number; unit: string }, reg: Registry | null): DerivedFigure[] {
  const out: DerivedFigure[] = [];
  for (const d of node.derived ?? []) {
    const fn = reg?.[d.calc];
    if (!fn) {
      out.push({ calc: d.calc, value: null, unit: '', basis: `The computation "${d.calc}" is not available yet.` });
      continue;
    }
    try {
      const { si } = siInputs(d, inputs, measured);
      const r = fn(instrument, si);
      out.push({ calc: d.calc, value: fin(r.value), unit: r.unit, basis: r.basis });
    } catch (err) {
      out.push({ calc: d.calc, value: null, unit: '', basis: (err as Error).message });
    }
  }
  return out;
}

/**
 * A measure node's tolerance for a reading entered in `unit`: absolute tolerances and explicit borderline ends
 * are stated in the node's own unit and are converted; relative and decade tolerances need no change.
 */
export function toleranceIn(node: MeasureNode, unit: string): Tolerance | null {
  const tol = node.expect?.tolerance;
  if (!tol) return null;
  if (unit === node.measure.unit) return tol;
  if (tol.kind === 'absolute') return { ...tol, pass: convert(tol.pass, node.measure.unit, unit), borderline: convert(tol.borderline, node.measure.unit, unit) };
  if (tol.kind === 'range' && tol.outer) return { ...tol, outer: { low: convert(tol.outer.low, node.measure.unit, unit), high: convert(tol.outer.high, node.measure.unit, unit) } };
  return tol;
}

/** Figures computed from a reading and shown beside it (e.g. mean free path at the pressure read). Never throws. */
export function previewDerived(
  node: MeasureNode,
  instrument: DiagnoseInstrument | null,
  inputs: Record<string, number> | undefined,
  measured: { value: number; unit: string },
  registry?: Registry | null,
): DerivedFigure[] {
  return derivedFigures(node, instrument, inputs, measured, registry === undefined ? defaultRegistry : registry);
}

function makeReading(
  state: WalkState,
  tree: Tree,
  node: MeasureNode,
  input: Extract<AnswerInput, { kind: 'measure' }>,
  at: string,
  reg: Registry | null,
  phase: Reading['phase'],
): Reading {
  const unit = input.unit ?? node.measure.unit;
  if (unit !== node.measure.unit && !(node.measure.altUnits ?? []).includes(unit)) {
    throw new RangeError(`unit must be ${[node.measure.unit, ...(node.measure.altUnits ?? [])].join(' or ')} for ${node.measure.quantity}; got ${unit}`);
  }
  if (typeof input.value !== 'number' || !Number.isFinite(input.value)) {
    throw new RangeError(`${node.measure.quantity} must be a finite number in ${unit}`);
  }
  const measured = { value: input.value, unit };
  let shown: Reading['inputs'] = {};
  const e = node.expect;
  if (e && isComputed(e)) {
    try {
      shown = siInputs(e, input.inputs, measured).shown;
    } catch {
      shown = {};
    }
  }
  const base = {
    id: `r${state.readings.length + 1}-${tree.id}-${node.id}`,
    treeId: tree.id,
    nodeId: node.id,
    quantity: node.measure.quantity,
    unit,
    value: input.value,
    tool: node.measure.tool,
    inputs: shown,
    derived: derivedFigures(node, state.instrument, input.inputs, measured, reg),
    phase,
    at,
    ...(input.note ? { note: input.note } : {}),
  };
  if (!e) {
    return { ...base, expected: null, low: null, high: null, tolerance: null, verdict: 'recorded', judgedBy: 'none', basis: 'No expected value for this step.' };
  }
  const pv = preview(node, state.instrument, input.inputs, unit, reg, input.value);
  if (!pv.ok) {
    if (!input.verdict) throw new RangeError(`${pv.error} Give your own verdict (pass, borderline or fail) to go on.`);
    return {
      ...base,
      expected: null,
      low: null,
      high: null,
      tolerance: null,
      verdict: input.verdict.verdict,
      ...(input.verdict.verdict !== 'pass' && input.verdict.side ? { side: input.verdict.side } : {}),
      judgedBy: 'engineer',
      basis: `Judged by the engineer: ${pv.error}`,
    };
  }
  const tolInUnit = toleranceIn(node, unit) as Tolerance;
  const j: Judgement = judge(
    input.value,
    { value: pv.expected ?? undefined, low: pv.low ?? undefined, high: pv.high ?? undefined },
    tolInUnit,
  );
  return {
    ...base,
    expected: pv.expected,
    low: pv.low,
    high: pv.high,
    tolerance: { ...tolInUnit, passLow: fin(j.passLow), passHigh: fin(j.passHigh), borderLow: fin(j.borderLow), borderHigh: fin(j.borderHigh) },
    verdict: j.verdict,
    ...(j.side ? { side: j.side } : {}),
    judgedBy: 'expected',
    basis: pv.basis,
  };
}

function branchFor(node: MeasureNode, r: Reading): string {
  let key: VerdictBranch | undefined;
  if (r.verdict === 'pass') key = 'pass';
  else if (r.verdict === 'borderline') key = 'borderline';
  else if (r.verdict === 'fail') key = r.side ?? 'high';
  const next = (key && node.branches[key]) ?? node.branches.otherwise;
  if (!next) throw new RangeError(`node "${node.id}" has no branch for verdict ${r.verdict}`);
  return next;
}

// ---------------------------------------------------------------------------

function checkCurrent(state: WalkState, tree: Tree): DiagnoseNode {
  if (state.format !== WALK_FORMAT) throw new RangeError(`walk format must be ${WALK_FORMAT}; got ${String(state.format)}`);
  if (tree.id !== state.treeId) throw new RangeError(`this walk is in tree "${state.treeId}", not "${tree.id}"`);
  return nodeOf(tree, state.nodeId);
}

export function answer(state: WalkState, tree: Tree, input: AnswerInput, options?: WalkOptions): WalkState {
  const node = checkCurrent(state, tree);
  if (state.status !== 'walking') throw new RangeError(`the walk is ${state.status === 'at-leaf' ? 'at an action' : 'handing over to another tree'}; there is no question to answer`);
  const at = now(options);
  const reg = options?.registry === undefined ? defaultRegistry : options.registry;
  const stepBase = { treeId: tree.id, nodeId: node.id, at, queueBefore: state.queue, ...(input.note ? { note: input.note } : {}) };

  switch (node.kind) {
    case 'question':
    case 'choice': {
      if (input.kind === 'options') {
        if (node.kind !== 'choice' || !node.multiple) throw new RangeError(`node "${node.id}" takes one answer`);
        if (input.optionIds.length === 0) throw new RangeError('pick at least one answer');
        const picked = input.optionIds.map((id) => {
          const o = node.options.find((x) => x.id === id);
          if (!o) throw new RangeError(`answer "${id}" is not offered at node "${node.id}"`);
          return o;
        });
        const ordered = orderSymptoms(picked.map((o) => o.tree as TreeId));
        const step: WalkStep = { ...stepBase, answer: { kind: 'options', optionIds: picked.map((o) => o.id), labels: picked.map((o) => o.label) } };
        const steps = [...state.steps, step];
        return {
          ...state,
          steps,
          updatedAt: at,
          status: 'hand-over',
          handOver: ordered[0],
          queue: [...ordered.slice(1), ...state.queue.filter((t) => !ordered.includes(t))],
          outcome: null,
          path: pathOf(steps, state.treeId, state.nodeId),
        };
      }
      if (input.kind !== 'option') throw new RangeError(`node "${node.id}" needs an answer chosen from its options`);
      const o = node.options.find((x) => x.id === input.optionId);
      if (!o) throw new RangeError(`answer "${input.optionId}" is not offered at node "${node.id}"`);
      if (o.loop && countTaken(state, tree.id, node.id, o.id) >= o.loop.max) {
        throw new RangeError(`"${o.label}" has already been taken ${o.loop.max} times in this walk; choose another answer`);
      }
      const step: WalkStep = { ...stepBase, answer: { kind: 'option', optionId: o.id, label: o.label } };
      if (o.tree) {
        const steps = [...state.steps, step];
        return { ...state, steps, updatedAt: at, status: 'hand-over', handOver: o.tree, outcome: null, path: pathOf(steps, state.treeId, state.nodeId) };
      }
      return arrive(state, tree, o.next as string, step, at);
    }
    case 'gate': {
      if (input.kind !== 'gate') throw new RangeError(`node "${node.id}" is an acknowledgement gate: give the role and what is confirmed`);
      const roleOk = node.roles.includes(input.role);
      const accepted = roleOk && node.asks.every((a) => (a === 'role' ? roleOk : input.confirmed.includes(a)));
      const step: WalkStep = { ...stepBase, answer: { kind: 'gate', role: input.role, confirmed: [...input.confirmed], accepted } };
      if (accepted && state.direct && state.steps.length === 0) {
        // A direct start's opening gate: confirmed, the walk goes to the chosen symptom (Back returns here).
        const steps = [...state.steps, step];
        return { ...state, steps, updatedAt: at, status: 'hand-over', handOver: state.direct, outcome: null, path: pathOf(steps, state.treeId, state.nodeId) };
      }
      return arrive(state, tree, accepted ? node.next : node.refuse, step, at);
    }
    case 'measure': {
      if (input.kind === 'option') {
        const o = (node.alternatives ?? []).find((x) => x.id === input.optionId);
        if (!o || !o.next) throw new RangeError(`answer "${input.optionId}" is not offered at node "${node.id}"`);
        const step: WalkStep = { ...stepBase, answer: { kind: 'option', optionId: o.id, label: o.label } };
        return arrive(state, tree, o.next, step, at);
      }
      if (input.kind !== 'measure') throw new RangeError(`node "${node.id}" needs a measured value`);
      const reading = makeReading(state, tree, node, input, at, reg, 'as-found');
      const next = branchFor(node, reading);
      const step: WalkStep = {
        ...stepBase,
        answer: { kind: 'measure', readingId: reading.id, verdict: reading.verdict, ...(reading.side ? { side: reading.side } : {}) },
      };
      return arrive(state, tree, next, step, at, { readings: [...state.readings, reading] });
    }
    case 'action':
      throw new RangeError('an action has no answer: do it, then re-measure and record');
  }
}

/**
 * Store a reading at the current node without moving on: a repeat measurement at a measure node, or the
 * as-left reading that closes an action ("re-measure and record"). At an action, give quantity and unit.
 */
export function record(
  state: WalkState,
  tree: Tree,
  input: Extract<AnswerInput, { kind: 'measure' }> & { quantity?: string; tool?: string },
  options?: WalkOptions,
): WalkState {
  const node = checkCurrent(state, tree);
  const at = now(options);
  const reg = options?.registry === undefined ? defaultRegistry : options.registry;
  let reading: Reading;
  if (node.kind === 'measure') {
    reading = makeReading(state, tree, node, input, at, reg, 'as-found');
  } else if (node.kind === 'action') {
    if (!input.quantity || !input.unit) throw new RangeError('an as-left reading needs its quantity and unit');
    if (!(input.unit in UNITS)) throw new RangeError(`unit must be one of ${Object.keys(UNITS).join(', ')}; got ${input.unit}`);
    if (typeof input.value !== 'number' || !Number.isFinite(input.value)) throw new RangeError(`${input.quantity} must be a finite number in ${input.unit}`);
    reading = {
      id: `r${state.readings.length + 1}-${tree.id}-${node.id}`,
      treeId: tree.id,
      nodeId: node.id,
      quantity: input.quantity,
      unit: input.unit,
      value: input.value,
      tool: input.tool ?? '',
      expected: null,
      low: null,
      high: null,
      tolerance: null,
      verdict: 'recorded',
      judgedBy: 'none',
      basis: 'As-left reading after the action; compare with the as-found value and the baseline.',
      inputs: {},
      derived: [],
      phase: 'as-left',
      at,
      ...(input.note ? { note: input.note } : {}),
    };
  } else {
    throw new RangeError(`node "${node.id}" takes no reading`);
  }
  return { ...state, readings: [...state.readings, reading], updatedAt: at };
}

/** Walk the next tree: the hand-over target, or (from a leaf) a queued or suggested tree. */
export function enter(state: WalkState, tree: Tree, options?: WalkOptions): WalkState {
  if (state.format !== WALK_FORMAT) throw new RangeError(`walk format must be ${WALK_FORMAT}`);
  const allowed =
    state.status === 'hand-over'
      ? [state.handOver]
      : state.status === 'at-leaf'
        ? [...state.queue, ...(state.outcome?.continueWith ?? [])]
        : [];
  if (!allowed.includes(tree.id)) {
    throw new RangeError(`the walk cannot move to tree "${tree.id}" now; it can go to ${allowed.filter(Boolean).join(', ') || 'no other tree'}`);
  }
  const at = now(options);
  const step: WalkStep = {
    treeId: state.treeId,
    nodeId: state.nodeId,
    at,
    queueBefore: state.queue,
    answer: { kind: 'enter', toTree: tree.id, fromStatus: state.status as 'hand-over' | 'at-leaf', fromHandOver: state.handOver, fromOutcome: state.outcome },
  };
  const steps = [...state.steps, step];
  const first = nodeOf(tree, tree.entry);
  return {
    ...state,
    treeId: tree.id,
    nodeId: tree.entry,
    steps,
    queue: state.queue.filter((t) => t !== tree.id),
    updatedAt: at,
    status: first.kind === 'action' ? 'at-leaf' : 'walking',
    handOver: null,
    outcome: first.kind === 'action' ? outcomeOf(tree, first) : null,
    path: pathOf(steps, tree.id, tree.entry),
  };
}

/** Undo the last answer (or tree hand-over). Readings taken with it stay in the walk, marked withdrawn. */
export function back(state: WalkState, options?: WalkOptions): WalkState {
  const last = state.steps[state.steps.length - 1];
  if (!last) return state;
  const steps = state.steps.slice(0, -1);
  const withdrawnId = last.answer.kind === 'measure' ? last.answer.readingId : null;
  return {
    ...state,
    treeId: last.treeId,
    nodeId: last.nodeId,
    steps,
    queue: last.queueBefore,
    updatedAt: now(options),
    status: last.answer.kind === 'enter' ? last.answer.fromStatus : 'walking',
    handOver: last.answer.kind === 'enter' ? last.answer.fromHandOver : null,
    outcome: last.answer.kind === 'enter' ? last.answer.fromOutcome : null,
    readings: withdrawnId ? state.readings.map((r) => (r.id === withdrawnId ? { ...r, withdrawn: true } : r)) : state.readings,
    path: pathOf(steps, last.treeId, last.nodeId),
  };
}

/** Current node of a walk in its tree. */
export function currentNode(state: WalkState, tree: Tree): DiagnoseNode {
  return checkCurrent(state, tree);
}

/** Readings still in force (not withdrawn by Back). */
export function activeReadings(state: WalkState): Reading[] {
  return state.readings.filter((r) => !r.withdrawn);
}

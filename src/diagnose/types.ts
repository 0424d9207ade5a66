/**
 * Diagnose: decision trees as data. A run through a tree is a walk (see walker.ts).
 *
 * Node kinds: question (one answer), choice (pick one, or several where `multiple`), measure (a measured
 * value judged against an expected value), gate (acknowledgement before invasive or energised work) and
 * action (a leaf: what to do, always closed by "re-measure and record").
 *
 * Node IDs are short and stable: saved walks refer to them. Never renumber a shipped node.
 */

import type { InstrumentKind, InstrumentProfile } from '../records/types';

export type { InstrumentKind };

/** The fields of an instrument profile that diagnosis needs (structural, so any full profile fits). */
export type DiagnoseInstrument = Pick<
  InstrumentProfile,
  'id' | 'name' | 'kind' | 'rodFieldRadius' | 'rodLength' | 'rfFrequency' | 'maxRfAmplitude' | 'axialEnergy' | 'readbackConvention'
>;

export type TreeId = 'entry' | 'vacuum' | 'leak' | 'no-signal' | 'mass-axis' | 'peak-shape' | 'sensitivity' | 'noise';

/** Work order when several symptoms are present: vacuum and leaks cause most of the others (common practice). */
export const SYMPTOM_ORDER: readonly TreeId[] = ['vacuum', 'leak', 'no-signal', 'mass-axis', 'peak-shape', 'sensitivity', 'noise'];

export const TREE_IDS: readonly TreeId[] = ['entry', ...SYMPTOM_ORDER];

export type Hazard =
  | 'high-voltage'
  | 'rf'
  | 'stored-charge'
  | 'venting'
  | 'vacuum'
  | 'rotating'
  | 'hot-surface'
  | 'chemical'
  | 'gas-cylinder'
  | 'radioactive'
  | 'lifting'
  | 'tracer-gas';

export type SafetyCardId =
  | 'general'
  | 'lockout'
  | 'high-voltage'
  | 'rf'
  | 'stored-charge'
  | 'vacuum'
  | 'turbo'
  | 'hot-surface'
  | 'chemical'
  | 'gas'
  | 'radiation'
  | 'mechanical'
  | 'tracer';

/** Who may do a step. */
export type Role = 'analyst' | 'specialist' | 'field-engineer' | 'vacuum-engineer';

/**
 * How the step touches the instrument. 'covers-off' (de-energised, opened) and 'energised' (measuring on live
 * parts behind covers) must sit directly behind a gate of the same kind. 'covers-on' is hands-on work from the
 * outside (gas lines, pumps, cylinders, a tracer spray) and carries its hazard card. Every step whose words put
 * hands on the instrument declares one of these three (checked by treeProblems).
 */
export type Access = 'read-back' | 'covers-on' | 'covers-off' | 'energised';

/** The work a gate guards: the access of the step right behind it ('covers-on' for a general gate). */
export type GateWork = Exclude<Access, 'read-back'>;

export interface NodeBase {
  id: string;
  title: string;
  /** What to do or decide, in plain words. */
  text: string;
  /** Short points shown under the text. */
  points?: string[];
  hazards?: Hazard[];
  cards?: SafetyCardId[];
  access?: Access;
  /** Where the facts of this step come from, with class (published / computed / common practice / from memory). */
  source?: string;
}

export interface Option {
  id: string;
  label: string;
  /** Next node in this tree. */
  next?: string;
  /** Or: hand the walk to another tree (entry symptom choice). */
  tree?: TreeId;
  /** A deliberate bounded loop back to an earlier node: taken at most `max` times in one walk. */
  loop?: { max: number };
  /** Instrument kinds this answer usually fits (a hint on screen; the engineer still chooses). */
  fits?: InstrumentKind[];
}

export interface QuestionNode extends NodeBase {
  kind: 'question';
  options: Option[];
}

export interface ChoiceNode extends NodeBase {
  kind: 'choice';
  options: Option[];
  /** Several options may be picked; then every option must hand over to a tree. */
  multiple?: boolean;
}

/**
 * What a gate asks the engineer to confirm. De-energised work asks for lockout and the discharge of stored
 * energy; live work asks for live-work authorisation and rated measuring equipment instead of a lockout.
 */
export type GateItem = 'role' | 'lockout' | 'discharge' | 'live-work' | 'meter-rating' | 'ppe' | 'procedure' | 'permit';

export interface GateNode extends NodeBase {
  kind: 'gate';
  /** The kind of work behind the gate; its asks must match (see GATE_ASKS in safety.ts). */
  guards: GateWork;
  /** Roles allowed to do the step behind the gate. */
  roles: Role[];
  asks: GateItem[];
  next: string;
  /** Where the walk goes when the gate cannot be confirmed: an action leaf (stop and escalate). */
  refuse: string;
}

/** An input to an expected-value computation, entered in `unit` (converted to SI before the call). */
export interface ExpectInput {
  key: string;
  label: string;
  unit: string;
  default?: number;
  min: number;
  max: number;
  /** Take the value measured at this node (converted to SI) instead of asking. */
  fromReading?: boolean;
}

export type Tolerance =
  /** |measured − expected| ≤ pass·|expected| passes; ≤ borderline·|expected| is borderline. */
  | { kind: 'relative'; pass: number; borderline: number }
  /** Same, in the node's unit. */
  | { kind: 'absolute'; pass: number; borderline: number }
  /** |log10(measured / expected)| ≤ pass passes (pressures span decades). */
  | { kind: 'decades'; pass: number; borderline: number }
  /**
   * Inside [low, high] passes; inside the range widened by `borderline` (a share of the span, or decades when
   * `log`) is borderline. `outer` gives the borderline band's ends directly instead (in the node's unit).
   */
  | { kind: 'range'; borderline: number; log?: boolean; outer?: { low: number; high: number } };

/** A named computation in the expectations registry, with its inputs. */
export interface CalcRef {
  calc: string;
  inputs?: ExpectInput[];
}

export interface ComputedExpectation extends CalcRef {
  tolerance: Tolerance;
}

export interface FixedExpectation {
  /** A generic range in the node's unit; the instrument's own limit, where known, wins. */
  range: { low: number; high: number };
  tolerance: Extract<Tolerance, { kind: 'range' }>;
  source: string;
}

export type Expectation = ComputedExpectation | FixedExpectation;

export interface MeasureSpec {
  quantity: string;
  /** Unit the engineer enters (see units.ts). */
  unit: string;
  /** Other units the engineer may enter in (same dimension). */
  altUnits?: string[];
  tool: string;
  /** A screen of the app that makes this measurement (path and its name), linked beside the tool. */
  toolLink?: { path: string; label: string };
  how: string;
  /** Reading type in the visit log's catalogue this measurement is recorded as, when one fits. */
  visitType?: string;
}

export type VerdictBranch = 'pass' | 'borderline' | 'low' | 'high';

export interface MeasureNode extends NodeBase {
  kind: 'measure';
  measure: MeasureSpec;
  expect?: Expectation;
  /** Extra figures computed from the reading and shown beside it (no verdict), e.g. mean free path. */
  derived?: CalcRef[];
  /** Where each verdict leads. `otherwise` covers any verdict not listed (and readings with no expected value). */
  branches: Partial<Record<VerdictBranch, string>> & { otherwise?: string };
  /** Ways forward without a number (e.g. no safe monitor point). */
  alternatives?: Option[];
}

export interface ClosingStep {
  kind: 're-measure-and-record';
  /** What to re-measure after the action, recorded as-left and compared with baseline. */
  what: string;
}

export interface ActionNode extends NodeBase {
  kind: 'action';
  steps: string[];
  /** Hand the walk on to these trees afterwards (offered, not forced). */
  continueWith?: TreeId[];
  escalate?: boolean;
  closing: ClosingStep;
}

export type DiagnoseNode = QuestionNode | ChoiceNode | GateNode | MeasureNode | ActionNode;

export interface Tree {
  id: TreeId;
  title: string;
  summary: string;
  entry: string;
  nodes: DiagnoseNode[];
}

export interface SafetyCard {
  id: SafetyCardId;
  title: string;
  hazards: string[];
  precautions: string[];
  /** Standards and references named as sources. */
  sources: string[];
  /** Always the maker / site / codes / licensed practice deferral. */
  deferral: string;
}

export type Verdict = 'pass' | 'borderline' | 'fail';

import { useState } from 'preact/hooks';
import {
  answer,
  enter,
  EXPECTATION_INFO,
  judge,
  preview,
  previewDerived,
  toleranceIn,
  record,
  treeById,
  type ActionNode,
  type ChoiceNode,
  type GateItem,
  type GateNode,
  type MeasureNode,
  type QuestionNode,
  type Role,
  type Tolerance,
  type Tree,
  type TreeId,
  type WalkState,
} from '../../../diagnose';
import {
  catalogueType, checkTyped, errorWords, factorWords, rfConventionSuspects, rfFactor, rfFormWords, specForMeasure, UNITS,
} from '../../../records';
import { rfFormOf } from '../../../engine';
import { ConventionChoice, useProbeConvention } from '../../components/ConventionChoice';
import { NumberEntry } from '../../components/NumberEntry';
import { formatNumber } from '../../format';
import { parseNumber } from './parse';
import { SafetyCards } from './SafetyCards';
import { VerdictWord } from './VerdictWord';

/** What the engineer has typed at a node, kept in the walk's draft so a reload never loses it. */
export type Typed = Record<string, string>;

export interface NodeViewProps {
  walk: WalkState;
  tree: Tree;
  typed: Typed;
  /** A change to some of this step's typed fields; the screen merges it into the latest copy. */
  onTyped: (patch: Typed) => void;
  onWalk: (w: WalkState) => void;
  onFinish: () => void;
}

const ROLE_LABEL: Record<Role, string> = {
  analyst: 'Lab analyst (user maintenance)',
  specialist: 'In-house instrument specialist',
  'field-engineer': 'Field service engineer (qualified for live work)',
  'vacuum-engineer': 'Vacuum engineer or technician',
};

const ASK_LABEL: Record<Exclude<GateItem, 'role'>, string> = {
  lockout: 'Lockout/tagout is applied (or planned) for every energy source this step touches',
  discharge: 'Stored energy is released: the discharge time has passed, absence of voltage is proved with a rated tester, hot parts have cooled',
  'live-work': 'Live work is authorised for this step (site authorisation or permit), with someone else present',
  'meter-rating': 'The meter, probe or pickup is rated for the voltage present (voltage rating and measurement category, e.g. CAT II 1000 V; a divider probe for kilovolts) and was checked before use',
  ppe: 'The PPE this step needs is on',
  procedure: "The maker's procedure for this model is at hand",
  permit: "The site's permit for this work is in place",
};

export const TREE_TITLE = (id: TreeId) => treeById(id).title;

function Intro(props: { node: { title: string; text: string; points?: string[]; source?: string }; kind: string }) {
  const n = props.node;
  return (
    <>
      <p class="walk-kind">{props.kind}</p>
      <h2 class="walk-title" data-testid="walk-title">{n.title}</h2>
      <p class="walk-text">{n.text}</p>
      {n.points && n.points.length > 0 && <ul class="walk-points">{n.points.map((p) => <li key={p}>{p}</li>)}</ul>}
      {n.source && <p class="hint">Source: {n.source}</p>}
    </>
  );
}

export function NodeView(props: NodeViewProps) {
  const { walk, tree } = props;
  const node = tree.nodes.find((n) => n.id === walk.nodeId);
  if (!node) return <p class="notice">This walk points at a step that this version does not have. Use Back to return to a known step.</p>;
  if (walk.status === 'hand-over' && walk.handOver) return <HandOver {...props} to={walk.handOver} />;
  switch (node.kind) {
    case 'question':
    case 'choice':
      return <ChoiceView {...props} node={node} />;
    case 'gate':
      return <GateView {...props} node={node} />;
    case 'measure':
      return <MeasureView key={`${tree.id}/${node.id}`} {...props} node={node} />;
    case 'action':
      return <ActionView {...props} node={node} />;
  }
}

function HandOver(props: NodeViewProps & { to: TreeId }) {
  const later = props.walk.queue;
  return (
    <div class="walk-step" data-testid="walk-node" data-node-id="hand-over">
      <p class="walk-kind">Next tree</p>
      <h2 class="walk-title" data-testid="walk-title">Continue with: {TREE_TITLE(props.to)}</h2>
      {later.length > 0 && <p class="walk-text">After that: {later.map(TREE_TITLE).join(', then ')}.</p>}
      {props.walk.direct && props.walk.treeId === 'entry' && (
        <p class="notice" data-testid="as-found-skipped">
          Direct start: the as-found record (analyser pressure, last change, how it started) is skipped. It is optional
          here; if this visit needs it, record the as-found values in the visit log before you change anything.
        </p>
      )}
      <button type="button" class="btn btn-primary btn-block" onClick={() => props.onWalk(enter(props.walk, treeById(props.to)))}>
        Start “{TREE_TITLE(props.to)}”
      </button>
    </div>
  );
}

function ChoiceView(props: NodeViewProps & { node: QuestionNode | ChoiceNode }) {
  const { node, walk, tree } = props;
  const multiple = node.kind === 'choice' && node.multiple;
  const picked = (props.typed.picked ?? '').split(',').filter(Boolean);
  const [problem, setProblem] = useState<string | null>(null);
  const loopUsed = (id: string) => walk.steps.filter((s) => s.treeId === tree.id && s.nodeId === node.id && s.answer.kind === 'option' && s.answer.optionId === id).length;

  function choose(optionId: string) {
    try {
      props.onWalk(answer(walk, tree, { kind: 'option', optionId, ...(props.typed.note ? { note: props.typed.note } : {}) }));
    } catch (err) {
      setProblem(errorWords(err));
    }
  }
  return (
    <div class="walk-step" data-testid="walk-node" data-node-id={node.id}>
      <Intro node={node} kind={node.kind === 'question' ? 'Question' : multiple ? 'Pick all that apply' : 'Choice'} />
      <SafetyCards ids={node.cards} />
      {multiple ? (
        <fieldset class="fieldset">
          <legend>Symptoms seen</legend>
          {node.options.map((o) => (
            <label key={o.id} class="check-row">
              <input
                type="checkbox"
                checked={picked.includes(o.id)}
                onChange={(e) => {
                  const on = (e.target as HTMLInputElement).checked;
                  const next = on ? [...picked, o.id] : picked.filter((x) => x !== o.id);
                  props.onTyped({ picked: next.join(',') });
                }}
              />
              <span>{o.label}</span>
            </label>
          ))}
          <button
            type="button"
            class="btn btn-primary btn-block"
            disabled={picked.length === 0}
            onClick={() => {
              try {
                props.onWalk(answer(walk, tree, { kind: 'options', optionIds: picked }));
              } catch (err) {
                setProblem(errorWords(err));
              }
            }}
          >
            Continue with {picked.length || 'no'} symptom{picked.length === 1 ? '' : 's'}
          </button>
        </fieldset>
      ) : (
        <div class="choice-list" role="group" aria-label="Answers">
          {node.options.map((o) => {
            const spent = o.loop ? loopUsed(o.id) >= o.loop.max : false;
            return (
              <button key={o.id} type="button" class="btn btn-block" disabled={spent} onClick={() => choose(o.id)}>
                {o.label}
                {o.loop && <span class="hint"> ({loopUsed(o.id)} of {o.loop.max} used)</span>}
                {o.fits && walk.instrument && o.fits.includes(walk.instrument.kind) && <span class="tag fits-tag">fits this instrument</span>}
              </button>
            );
          })}
        </div>
      )}
      <NoteField typed={props.typed} onTyped={props.onTyped} />
      {problem && <p class="field-error" role="alert">{problem}</p>}
    </div>
  );
}

function NoteField(props: { typed: Typed; onTyped: (patch: Typed) => void }) {
  return (
    <div class="field">
      <label for="walk-note">Note (optional)</label>
      <textarea id="walk-note" rows={2} value={props.typed.note ?? ''} onInput={(e) => props.onTyped({ note: (e.target as HTMLTextAreaElement).value })} />
    </div>
  );
}

function GateView(props: NodeViewProps & { node: GateNode }) {
  const { node, walk, tree, typed } = props;
  const role = (typed.role as Role | undefined) ?? undefined;
  const confirmed = (typed.confirmed ?? '').split(',').filter(Boolean) as GateItem[];
  const asks = node.asks.filter((a): a is Exclude<GateItem, 'role'> => a !== 'role');
  const allRoles: Role[] = ['analyst', 'specialist', 'field-engineer', 'vacuum-engineer'];
  const ready = !!role && asks.every((a) => confirmed.includes(a));
  // Refusing sends nothing as confirmed, so the walker always takes the stop branch.
  const go = (r: Role, refuse = false) => props.onWalk(answer(walk, tree, { kind: 'gate', role: r, confirmed: refuse ? [] : confirmed }));
  return (
    <div class="walk-step" data-testid="walk-node" data-node-id={node.id}>
      <Intro node={node} kind="Safety gate" />
      <p class="notice"><strong>Who may do this step:</strong> {node.roles.map((r) => ROLE_LABEL[r]).join('; ')}.</p>
      <SafetyCards ids={node.cards} open />
      <fieldset class="fieldset">
        <legend>Your role</legend>
        {allRoles.map((r) => (
          <label key={r} class="check-row">
            <input type="radio" name={`role-${node.id}`} checked={role === r} onChange={() => props.onTyped({ role: r })} />
            <span>{ROLE_LABEL[r]}{!node.roles.includes(r) && <span class="hint"> — not for this step</span>}</span>
          </label>
        ))}
      </fieldset>
      <fieldset class="fieldset">
        <legend>Confirm each item</legend>
        {asks.map((a) => (
          <label key={a} class="check-row">
            <input
              type="checkbox"
              checked={confirmed.includes(a)}
              onChange={(e) => {
                const on = (e.target as HTMLInputElement).checked;
                const next = on ? [...confirmed, a] : confirmed.filter((x) => x !== a);
                props.onTyped({ confirmed: next.join(',') });
              }}
            />
            <span>{ASK_LABEL[a]}</span>
          </label>
        ))}
      </fieldset>
      <button type="button" class="btn btn-primary btn-block" disabled={!ready} onClick={() => role && go(role)}>
        Confirmed — continue
      </button>
      <button type="button" class="btn btn-block" onClick={() => go(role ?? node.roles[0], true)}>
        I cannot confirm all of this — stop
      </button>
    </div>
  );
}

function describeTolerance(t: Tolerance, unit: string): string {
  switch (t.kind) {
    case 'relative':
      return `pass within ±${formatNumber(t.pass * 100, 3)} %, borderline within ±${formatNumber(t.borderline * 100, 3)} %`;
    case 'absolute':
      return `pass within ±${formatNumber(t.pass)} ${unit}, borderline within ±${formatNumber(t.borderline)} ${unit}`;
    case 'decades':
      return `pass within × ${formatNumber(10 ** t.pass, 3)}, borderline within × ${formatNumber(10 ** t.borderline, 3)}`;
    case 'range':
      return t.outer
        ? `pass inside the range, borderline from ${formatNumber(t.outer.low)} to ${formatNumber(t.outer.high)} ${unit}`
        : t.log
          ? `pass inside the range, borderline within × ${formatNumber(10 ** t.borderline, 3)} outside it`
          : 'pass inside the range';
  }
}

/** An SI figure in the unit an engineer reads it in. */
function showSi(value: number, unit: string): string {
  if (unit === 'Pa') return `${formatNumber(value / 100)} mbar`;
  if (unit === '1') return `${formatNumber(value * 100, 3)} %`;
  if (unit === 'Pa·m³/s') return `${formatNumber(value * 10)} mbar·L/s`;
  return `${formatNumber(value)} ${unit}`;
}

function MeasureView(props: NodeViewProps & { node: MeasureNode }) {
  const { node, walk, tree, typed } = props;
  const units = [node.measure.unit, ...(node.measure.altUnits ?? [])];
  const unit = typed.unit && units.includes(typed.unit) ? typed.unit : node.measure.unit;
  const [problem, setProblem] = useState<string | null>(null);
  const [tried, setTried] = useState(false);
  const calcInputs = node.expect && 'calc' in node.expect ? (node.expect.inputs ?? []).filter((i) => !i.fromReading) : [];
  const inputText = (key: string, dflt?: number) => typed[`in:${key}`] ?? (dflt === undefined ? '' : String(dflt));

  // Inputs as numbers; a field left empty falls back to its default; a bad one is reported beside it.
  const inputErrors: Record<string, string> = {};
  const inputs: Record<string, number> = {};
  for (const i of calcInputs) {
    const text = inputText(i.key, i.default);
    if (text.trim() === '') continue;
    const p = parseNumber(text, i.label);
    if (p.ok) inputs[i.key] = p.value;
    else inputErrors[i.key] = p.message;
  }
  const measuredText = typed.value ?? '';
  const visitType = node.measure.visitType ? catalogueType(node.measure.visitType) : undefined;
  const spec = specForMeasure(node.measure.quantity, unit, visitType);
  const checked = measuredText.trim() === '' ? null : checkTyped(measuredText, spec);
  // RF at the probe: the engineer says how it was read; expected and measured meet in the instrument's read-back.
  const rfStep = node.measure.visitType === 'rf-amplitude' && !!walk.instrument;
  const readback = rfFormOf(walk.instrument?.readbackConvention ?? { amplitude: 'zero-to-peak', reference: 'per-rod' });
  const [chosen, choose] = useProbeConvention(walk.instrument?.id, readback);
  const toReadback = rfStep ? rfFactor(readback) / rfFactor(chosen) : 1;
  const measured = checked && checked.ok ? { ok: true as const, value: checked.value * toReadback } : checked;
  const pv = node.expect ? preview(node, walk.instrument, inputs, unit, undefined, measured?.ok ? measured.value : undefined) : null;
  const tol = toleranceIn(node, unit);
  let live: ReturnType<typeof judge> | null = null;
  if (pv?.ok && tol && measured?.ok) {
    try {
      live = judge(measured.value, { value: pv.expected ?? undefined, low: pv.low ?? undefined, high: pv.high ?? undefined }, tol);
    } catch {
      live = null;
    }
  }
  // A reading that misses but would pass in another convention: say so before anyone acts on "fail".
  const suspect = rfStep && live && live.verdict !== 'pass' && checked?.ok && pv?.ok && tol
    ? rfConventionSuspects(checked.value, chosen, (v) => {
        try {
          return judge(v * toReadback, { value: pv.expected ?? undefined, low: pv.low ?? undefined, high: pv.high ?? undefined }, tol).verdict === 'pass';
        } catch {
          return false;
        }
      })[0]
    : undefined;
  const shownExpected = (x: number) => formatNumber(x / toReadback);
  const derived = node.derived && measured?.ok ? previewDerived(node, walk.instrument, inputs, { value: measured.value, unit }) : [];
  const needManual = !!node.expect && !pv?.ok;
  const manual = typed.verdict ?? '';

  function submit() {
    setProblem(null);
    if (!measured || !measured.ok) {
      // The field itself says what is wrong (one message); nothing is recorded.
      setTried(true);
      return;
    }
    if (Object.keys(inputErrors).length) {
      setProblem('Fix the inputs marked above first.');
      return;
    }
    let verdict: { verdict: 'pass' | 'borderline' | 'fail'; side?: 'low' | 'high' } | undefined;
    if (needManual) {
      if (!manual) {
        setProblem('No expected value here: choose your own verdict below.');
        return;
      }
      const [v, side] = manual.split(':') as ['pass' | 'borderline' | 'fail', 'low' | 'high' | undefined];
      verdict = { verdict: v, ...(side ? { side } : {}) };
    }
    try {
      props.onWalk(answer(walk, tree, { kind: 'measure', value: measured.value, unit, inputs, ...(verdict ? { verdict } : {}), ...(typed.note ? { note: typed.note } : {}) }));
    } catch (err) {
      setProblem(errorWords(err));
    }
  }

  return (
    <div class="walk-step" data-testid="walk-node" data-node-id={node.id}>
      <Intro node={node} kind="Measurement" />
      <SafetyCards ids={node.cards} />
      <dl class="facts">
        <div><dt>Measure</dt><dd>{node.measure.quantity}</dd></div>
        <div><dt>Tool</dt><dd>{node.measure.tool}{node.measure.toolLink && <> · <a href={node.measure.toolLink.path} data-testid="tool-link">{node.measure.toolLink.label}</a></>}</dd></div>
        <div><dt>How</dt><dd>{node.measure.how}</dd></div>
      </dl>
      {calcInputs.map((i) => (
        <div key={i.key} class={inputErrors[i.key] ? 'field has-error' : 'field'}>
          <label for={`in-${i.key}`}>{i.label}<span class="unit"> ({i.unit})</span></label>
          <input id={`in-${i.key}`} type="text" inputMode="decimal" autoComplete="off" value={inputText(i.key, i.default)}
            onInput={(e) => props.onTyped({ [`in:${i.key}`]: (e.target as HTMLInputElement).value })} />
          {inputErrors[i.key] && <p class="field-error" role="alert">{inputErrors[i.key]}</p>}
        </div>
      ))}
      {pv && (
        <div class="card expect-box" data-testid="expected">
          {pv.ok ? (
            <>
              <p class={rfStep ? 'expect-big' : 'big'} data-testid="expected-value">
                Expected: {pv.expected !== null ? `${shownExpected(pv.expected)} ${unit}` : ''}
                {pv.low !== null || pv.high !== null
                  ? ` ${pv.expected !== null ? '(' : ''}${pv.low !== null && pv.high !== null ? `${shownExpected(pv.low)} to ${shownExpected(pv.high)}` : pv.high !== null ? `at most ${shownExpected(pv.high)}` : `at least ${shownExpected(pv.low!)}`} ${unit}${pv.expected !== null ? ')' : ''}`
                  : ''}
              </p>
              {rfStep && <p class="big" data-testid="expected-convention">{rfFormWords[chosen]}</p>}
              {tol && <p class="hint">Tolerance: {describeTolerance(tol, unit)}.</p>}
              <p class="hint">{pv.basis}</p>
            </>
          ) : (
            <p class="notice">{pv.error === 'none' ? pv.basis : pv.error}</p>
          )}
        </div>
      )}
      {rfStep && <ConventionChoice id="probe-convention" value={chosen} readback={readback} onChange={(f) => choose(f)} />}
      <div class="row measure-row">
        <NumberEntry id="walk-value" class="grow" label={`Measured: ${node.measure.quantity}`} spec={spec} value={measuredText}
          showError={tried} onInput={(t) => { setTried(false); props.onTyped({ value: t }); }}
          hint="Exponent as 2.5e-5; a minus sign where the value can be negative." />
        {units.length > 1 ? (
          <div class="field">
            <label for="walk-unit">Unit</label>
            <select id="walk-unit" value={unit} onChange={(e) => props.onTyped({ unit: (e.target as HTMLSelectElement).value })}>
              {units.map((u) => <option key={u} value={u}>{u}</option>)}
            </select>
          </div>
        ) : (
          <p class="unit-fixed">{unit}</p>
        )}
      </div>
      {live && (
        <p data-testid="live-verdict">
          This reading would be: {suspect ? <VerdictWord verdict="convention" /> : <VerdictWord verdict={live.verdict} side={live.side} />}
        </p>
      )}
      {suspect && (
        <p class="notice" data-testid="convention-hint">
          Off by a factor of {factorWords(Math.max(suspect.factor, 1 / suspect.factor))}, the size of a convention slip: read as {rfFormWords[suspect.form]} it
          would match. Check how the reading was taken and choose that convention above, before acting on a failure.
        </p>
      )}
      {derived.length > 0 && (
        <div class="card derived" data-testid="derived">
          {derived.map((d) => (
            <div key={d.calc}>
              <p>
                <strong>{EXPECTATION_INFO[d.calc]?.label ?? d.calc}:</strong> {d.value === null ? 'not available' : showSi(d.value, d.unit)}
              </p>
              <p class="hint">{d.basis}</p>
            </div>
          ))}
        </div>
      )}
      {needManual && (
        <fieldset class="fieldset">
          <legend>Your verdict (no expected value could be computed)</legend>
          {(['pass', 'borderline:low', 'borderline:high', 'fail:low', 'fail:high'] as const).map((v) => (
            <label key={v} class="check-row">
              <input type="radio" name={`verdict-${node.id}`} checked={manual === v} onChange={() => props.onTyped({ verdict: v })} />
              <span>{v === 'pass' ? 'Pass' : `${v.startsWith('fail') ? 'Fail' : 'Borderline'}, ${v.endsWith('low') ? 'low' : 'high'}`}</span>
            </label>
          ))}
        </fieldset>
      )}
      <NoteField typed={typed} onTyped={props.onTyped} />
      <button type="button" class="btn btn-primary btn-block" onClick={submit}>Record reading and continue</button>
      {problem && <p class="field-error" role="alert">{problem}</p>}
      {node.alternatives && node.alternatives.length > 0 && (
        <div class="choice-list" role="group" aria-label="Other ways forward">
          <p class="hint">No number to enter?</p>
          {node.alternatives.map((o) => (
            <button key={o.id} type="button" class="btn btn-block" onClick={() => props.onWalk(answer(walk, tree, { kind: 'option', optionId: o.id }))}>
              {o.label}
            </button>
          ))}
        </div>
      )}
    </div>
  );
}

function ActionView(props: NodeViewProps & { node: ActionNode }) {
  const { node, walk, tree, typed } = props;
  const [problem, setProblem] = useState<string | null>(null);
  const unitList = Object.keys(UNITS);
  const leftUnit = typed.leftUnit ?? 'V';
  const next = [...new Set([...walk.queue, ...node.continueWith ?? []])];
  const asLeft = walk.readings.filter((r) => r.phase === 'as-left' && r.nodeId === node.id && r.treeId === tree.id);

  function recordLeft() {
    setProblem(null);
    const v = parseNumber(typed.leftValue ?? '', 'the as-left value');
    if (!v.ok) return setProblem(v.message);
    const quantity = (typed.leftQuantity ?? '').trim();
    if (!quantity) return setProblem('Say what you re-measured.');
    try {
      props.onWalk(record(walk, tree, { kind: 'measure', value: v.value, unit: leftUnit, quantity, ...(typed.note ? { note: typed.note } : {}) }));
      props.onTyped({ leftValue: '' });
    } catch (err) {
      setProblem(errorWords(err));
    }
  }

  return (
    <div class="walk-step" data-testid="walk-node" data-node-id={node.id}>
      <Intro node={node} kind={node.escalate ? 'Action — escalate' : 'Action'} />
      <SafetyCards ids={node.cards} />
      <ol class="walk-points">{node.steps.map((s) => <li key={s}>{s}</li>)}</ol>
      <div class="card closing" data-testid="closing">
        <p class="big">Then re-measure and record</p>
        <p>{node.closing.what}; record it as-left and compare with the as-found value and the baseline.</p>
        <div class="field">
          <label for="left-quantity">What you re-measured</label>
          <input id="left-quantity" type="text" value={typed.leftQuantity ?? ''} onInput={(e) => props.onTyped({ leftQuantity: (e.target as HTMLInputElement).value })} />
        </div>
        <div class="row measure-row">
          <div class="field grow">
            <label for="left-value">As-left value</label>
            <input id="left-value" type="text" inputMode="decimal" autoComplete="off" value={typed.leftValue ?? ''} onInput={(e) => props.onTyped({ leftValue: (e.target as HTMLInputElement).value })} />
          </div>
          <div class="field">
            <label for="left-unit">Unit</label>
            <select id="left-unit" value={leftUnit} onChange={(e) => props.onTyped({ leftUnit: (e.target as HTMLSelectElement).value })}>
              {unitList.map((u) => <option key={u} value={u}>{u}</option>)}
            </select>
          </div>
        </div>
        <button type="button" class="btn btn-block" onClick={recordLeft}>Record as-left reading</button>
        {problem && <p class="field-error" role="alert">{problem}</p>}
        {asLeft.length > 0 && <p class="hint">{asLeft.length} as-left reading{asLeft.length === 1 ? '' : 's'} recorded here.</p>}
      </div>
      {next.map((t) => (
        <button key={t} type="button" class="btn btn-primary btn-block" onClick={() => props.onWalk(enter(walk, treeById(t)))}>
          Continue with “{TREE_TITLE(t)}”
        </button>
      ))}
      <button type="button" class="btn btn-block" onClick={props.onFinish}>Finish this walk</button>
    </div>
  );
}

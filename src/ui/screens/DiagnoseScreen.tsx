// Diagnose: walk a decision tree step by step, with expected values for the selected instrument, safety cards
// and gates, and every reading kept. The walk is saved after every change so a reload resumes it.
import { useEffect, useRef, useState } from 'preact/hooks';
import { back, start, treeById, trees, WALK_FORMAT, type Tree, type TreeId, type WalkState } from '../../diagnose';
import { useApp } from '../context';
import { formatNumber } from '../format';
import { navigate, usePath } from '../router';
import { LeakCheckPanel, type LeakTyped } from './diagnose/LeakCheckPanel';
import { NodeView, TREE_TITLE, type Typed } from './diagnose/NodeView';
import { VerdictWord } from './diagnose/VerdictWord';

/** Draft keys in the store (drafts survive reloads and crashes). */
export const WALK_DRAFT_KEY = 'diagnose:walk';
export const LAST_WALK_DRAFT_KEY = 'diagnose:last-walk';
export const LEAK_DRAFT_KEY = 'diagnose:leak-check';

export interface WalkDraft {
  walk: WalkState;
  /** Typed but not yet submitted input, per tree/node. */
  typed: Record<string, Typed>;
  finished: boolean;
}

function isWalkDraft(x: unknown): x is WalkDraft {
  const d = x as WalkDraft | undefined;
  return !!d && typeof d === 'object' && !!d.walk && d.walk.format === WALK_FORMAT && typeof d.walk.treeId === 'string' && typeof d.walk.nodeId === 'string';
}

export function DiagnoseScreen() {
  const path = usePath();
  const sub = path.slice('/diagnose'.length).replace(/^\//, '');
  return (
    <section class="screen diagnose">
      <h1>Diagnose</h1>
      <nav class="row" aria-label="Diagnose tools">
        <a class={sub === '' ? 'btn btn-small btn-primary' : 'btn btn-small'} href="/diagnose" aria-current={sub === '' ? 'page' : undefined}>Walk</a>
        <a class={sub === 'leak-check' ? 'btn btn-small btn-primary' : 'btn btn-small'} href="/diagnose/leak-check" aria-current={sub === 'leak-check' ? 'page' : undefined}>Leak check</a>
      </nav>
      {sub === 'leak-check' ? <LeakCheck /> : <Walk />}
    </section>
  );
}

function LeakCheck() {
  const { store } = useApp();
  const [typed, setTyped] = useState<LeakTyped | null>(null);
  useEffect(() => {
    if (!store || typed) return;
    void store.getDraft<LeakTyped>(LEAK_DRAFT_KEY).then((t) => setTyped(t ?? {})).catch(() => setTyped({}));
  }, [store, typed]);
  const current = typed ?? {};
  return (
    <LeakCheckPanel
      typed={current}
      onTyped={(t) => {
        setTyped(t);
        void store?.putDraft(LEAK_DRAFT_KEY, t).catch(() => undefined);
      }}
    />
  );
}

function Walk() {
  const { store, storeProblem, instrument, instruments, selectInstrument, notify } = useApp();
  const [draft, setDraft] = useState<WalkDraft | null>(null);
  const [loaded, setLoaded] = useState(false);
  const [resumed, setResumed] = useState(false);
  const [unreadable, setUnreadable] = useState(false);
  const latest = useRef<WalkDraft | null>(null);
  latest.current = draft;

  useEffect(() => {
    if (!store || loaded) return;
    void store
      .getDraft<unknown>(WALK_DRAFT_KEY)
      .then((kept) => {
        if (kept === undefined) return;
        if (isWalkDraft(kept) && trees.some((t) => t.id === kept.walk.treeId)) {
          setDraft(kept);
          setResumed(true);
        } else {
          // Keep the unreadable draft where it is: nothing recorded is ever thrown away silently.
          setUnreadable(true);
        }
      })
      .catch(() => undefined)
      .finally(() => setLoaded(true));
  }, [store, loaded]);

  function save(next: WalkDraft | null) {
    latest.current = next;
    setDraft(next);
    if (!store) return;
    const p = next ? store.putDraft(WALK_DRAFT_KEY, next) : store.clearDraft(WALK_DRAFT_KEY);
    void p.catch((err: { userMessage?: string }) => notify(err.userMessage ?? 'The walk could not be saved on this device; keep this tab open.'));
  }

  function begin(tree: Tree) {
    const walk = start(tree, instrument ?? null);
    setResumed(false);
    save({ walk, typed: {}, finished: false });
  }

  if (!loaded && !storeProblem) return <p>Loading…</p>;

  if (!draft) {
    return (
      <div class="walk-start">
        {unreadable && <p class="notice">A saved walk from another version could not be read here. It is kept on this device; starting a new walk replaces it.</p>}
        {storeProblem && <p class="notice">Walks cannot be saved while the database is closed; a reload would lose this walk.</p>}
        <div class="card">
          <h2 class="card-title">Instrument</h2>
          {instruments.length === 0 ? (
            <p>No instrument yet. <a href="/instruments/new">Add one</a> for expected values computed for it, or walk without one.</p>
          ) : (
            <div class="field">
              <label for="walk-instrument">Expected values are computed for</label>
              <select id="walk-instrument" value={instrument?.id ?? ''} onChange={(e) => selectInstrument((e.target as HTMLSelectElement).value)}>
                {instruments.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
              </select>
            </div>
          )}
        </div>
        <button type="button" class="btn btn-primary btn-block" onClick={() => begin(treeById('entry'))}>
          Start a walk: safety, as-found state, symptoms
        </button>
        <details class="card">
          <summary>Go straight to one symptom</summary>
          <div class="choice-list">
            {trees.filter((t) => t.id !== 'entry').map((t) => (
              <button key={t.id} type="button" class="btn btn-block" onClick={() => begin(t)}>
                {t.title}
              </button>
            ))}
          </div>
          <p class="hint">Going straight skips the shared safety gate and as-found record; steps behind covers still have their own gates.</p>
        </details>
      </div>
    );
  }

  const { walk } = draft;
  const tree = treeById(walk.treeId as TreeId);
  const key = `${walk.treeId}/${walk.nodeId}`;
  const typed = draft.typed[key] ?? {};

  if (draft.finished) {
    return (
      <div class="walk-done">
        <h2>Walk finished</h2>
        <WalkSummary walk={walk} />
        <button
          type="button"
          class="btn btn-primary btn-block"
          onClick={() => {
            void store?.putDraft(LAST_WALK_DRAFT_KEY, draft).catch(() => undefined);
            save(null);
          }}
        >
          Start a new walk
        </button>
        <button type="button" class="btn btn-block" onClick={() => save({ ...draft, finished: false })}>Reopen this walk</button>
      </div>
    );
  }

  return (
    <div class="walk">
      {resumed && (
        <p class="notice" data-testid="resumed">
          Resumed the walk started {new Date(walk.startedAt).toLocaleString()} — nothing was lost.
        </p>
      )}
      <div class="walk-head">
        <p class="walk-tree"><strong>{tree.title}</strong> · step {walk.steps.length + 1}</p>
        <p class="hint">
          {walk.instrument ? `Expected values for ${walk.instrument.name}` : 'No instrument: expected values that need geometry are not shown'}
          {walk.queue.length > 0 && ` · then: ${walk.queue.map(TREE_TITLE).join(', ')}`}
        </p>
      </div>
      <NodeView
        walk={walk}
        tree={tree}
        typed={typed}
        onTyped={(t) => {
          const d = latest.current!;
          save({ ...d, typed: { ...d.typed, [key]: t } });
        }}
        onWalk={(w) => {
          setResumed(false);
          const d = latest.current!;
          save({ ...d, walk: w });
        }}
        onFinish={() => save({ ...latest.current!, finished: true })}
      />
      <div class="row walk-nav">
        <button type="button" class="btn btn-back" disabled={walk.steps.length === 0} onClick={() => save({ ...draft, walk: back(walk) })}>
          ← Back
        </button>
        <button
          type="button"
          class="btn btn-danger"
          onClick={() => {
            if (!confirm('Stop this walk? Its readings are kept as the last walk on this device.')) return;
            void store?.putDraft(LAST_WALK_DRAFT_KEY, { ...draft, finished: true }).catch(() => undefined);
            save(null);
            navigate('/diagnose');
          }}
        >
          Stop walk
        </button>
      </div>
      <details class="card">
        <summary>Readings in this walk ({walk.readings.length})</summary>
        <WalkSummary walk={walk} />
      </details>
    </div>
  );
}

function WalkSummary(props: { walk: WalkState }) {
  const { walk } = props;
  return (
    <div class="walk-summary">
      {walk.outcome && (
        <p>
          Last action: <strong>{walk.outcome.title}</strong>
          {walk.outcome.escalate ? ' (escalate)' : ''}. {walk.outcome.closing}
        </p>
      )}
      {walk.readings.length === 0 ? (
        <p class="hint">No readings yet.</p>
      ) : (
        <div class="scroll-x">
          <table class="values" data-testid="walk-readings">
            <thead>
              <tr><th>Step</th><th>Reading</th><th>Value</th><th>Expected</th><th>Verdict</th></tr>
            </thead>
            <tbody>
              {walk.readings.map((r) => (
                <tr key={r.id} class={r.withdrawn ? 'withdrawn' : ''}>
                  <td>{r.treeId}/{r.nodeId}{r.phase === 'as-left' ? ' (as-left)' : ''}</td>
                  <td>{r.quantity}{r.withdrawn ? ' — withdrawn by Back' : ''}</td>
                  <td>{formatNumber(r.value)} {r.unit}</td>
                  <td>
                    {r.expected !== null
                      ? `${formatNumber(r.expected)} ${r.unit}`
                      : r.low !== null || r.high !== null
                        ? `${r.low !== null ? formatNumber(r.low) : '…'} to ${r.high !== null ? formatNumber(r.high) : '…'} ${r.unit}`
                        : '—'}
                    {r.judgedBy === 'engineer' ? ' (judged by the engineer)' : ''}
                  </td>
                  <td><VerdictWord verdict={r.verdict} side={r.side} /></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}

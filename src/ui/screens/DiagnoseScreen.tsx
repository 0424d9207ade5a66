// Diagnose: walk a decision tree step by step, with expected values for the selected instrument, safety cards
// and gates, and every reading kept. The walk is saved after every change so a reload resumes it.
import { useEffect, useRef, useState } from 'preact/hooks';
import { activeReadings, back, start, startDirect, treeById, trees, WALK_FORMAT, type Tree, type TreeId, type WalkState } from '../../diagnose';
import { noteThis } from '../noteThis';
import { plainNote, visitNote } from './diagnose/toVisit';
import { useApp } from '../context';
import { formatNumber } from '../format';
import { formatDateTime, formatTime } from '../locale';
import { markSaved, markUnsaved } from '../offline';
import { DraftProblem } from '../components/DraftProblem';
import { useDraft } from '../components/useDraft';
import { navigate, usePath } from '../router';
import { LeakCheckPanel, type LeakTyped } from './diagnose/LeakCheckPanel';
import { NodeView, TREE_TITLE, type Typed } from './diagnose/NodeView';
import { VerdictWord } from './diagnose/VerdictWord';
import { ConfirmAction } from '../components/ConfirmAction';
import { errorText, storeSentence } from '../errorText';

/** Walks live in the store's walks records; this older draft key is only read once to carry a walk over. */
export const WALK_DRAFT_KEY = 'diagnose:walk';
const WALK_UNSAVED_KEY = 'diagnose-walk';
export const LEAK_DRAFT_KEY = 'diagnose:leak-check';

export interface WalkDraft {
  walk: WalkState;
  /** Typed but not yet submitted input, per tree/node. */
  typed: Record<string, Typed>;
  finished: boolean;
  /** Set once the walk's readings were copied into the visit log, so they are not copied twice. */
  notedToVisit?: boolean;
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
  const { store, storeProblem } = useApp();
  // Typing before the kept copy is read wins over it; two inputs in one frame merge into the latest copy.
  const kept = useDraft<LeakTyped>({ key: LEAK_DRAFT_KEY, what: 'the leak check', initial: () => ({}), unsaved: false });
  if (!kept.value && store && !storeProblem) return <p>Loading…</p>;
  return (
    <>
      <DraftProblem problem={kept.problem} />
      <LeakCheckPanel typed={kept.value ?? {}} onTyped={(patch) => void kept.update(patch)} />
    </>
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
  // The walk's record id in the store, and a queue so saves land in order and never create two records.
  const walkId = useRef<string | null>(null);
  // The walk was picked up from an older build's form draft, which is removed once the walk is saved.
  const legacyDraft = useRef(false);
  const saving = useRef<Promise<void>>(Promise.resolve());
  const pending = useRef(0);
  // The visit this walk belongs to (the instrument's open visit), so the visit log lists it.
  const visitId = useRef<string | null>(null);
  const [saveState, setSaveState] = useState<'saved' | 'saving' | 'failed'>('saved');
  useEffect(() => () => markSaved(WALK_UNSAVED_KEY), []);

  useEffect(() => {
    if (!store || loaded) return;
    void (async () => {
      try {
        const rec = await store.latestInProgressWalk();
        // An older build kept the walk as a form draft: pick it up once, then keep it in the walks store.
        const kept: unknown = rec ? rec.state : await store.getDraft<unknown>(WALK_DRAFT_KEY);
        if (kept === undefined) return;
        legacyDraft.current = !rec;
        if (isWalkDraft(kept) && trees.some((t) => t.id === kept.walk.treeId)) {
          walkId.current = rec?.id ?? null;
          visitId.current = rec?.visitId ?? null;
          setDraft(kept);
          setResumed(true);
        } else {
          // Keep the unreadable record where it is: nothing recorded is ever thrown away silently.
          setUnreadable(true);
        }
      } catch (err) {
        notify(storeSentence(err) ?? `The last walk could not be read: ${String(err)}`);
      } finally {
        setLoaded(true);
      }
    })();
    // Read once per store; notify only reports a failure and must not start the read again.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [store, loaded]);

  /** Keep the walk: every answer, reading and keystroke goes to the walks store at once. */
  function save(next: WalkDraft | null, status?: 'finished' | 'abandoned') {
    latest.current = next;
    setDraft(next);
    if (!store) return;
    // While a save is on its way, an app update must not reload the page under it.
    pending.current += 1;
    setSaveState('saving');
    markUnsaved(WALK_UNSAVED_KEY, 'the diagnosis walk');
    saving.current = saving.current.then(async () => {
      let ok = true;
      try {
        if (next === null) {
          walkId.current = null;
          return;
        }
        const rec = await store.saveWalk({
          ...(walkId.current ? { id: walkId.current } : {}),
          ...(next.walk.instrument ? { instrumentId: next.walk.instrument.id } : {}),
          ...(visitId.current ? { visitId: visitId.current } : {}),
          treeId: next.walk.treeId,
          state: next,
          status: status ?? (next.finished ? 'finished' : 'in-progress'),
        });
        walkId.current = rec.id;
        if (legacyDraft.current) {
          // The walk now lives in the walks store; the old copy is only spare. Removing it may fail: say so
          // once (it would be offered again after a reload), the walk itself is kept either way.
          legacyDraft.current = false;
          await store.clearDraft(WALK_DRAFT_KEY).catch((err: unknown) =>
            notify(`The walk is kept, but its older copy could not be removed: ${errorText(err)}`));
        }
      } catch (err) {
        ok = false;
        notify(storeSentence(err) ?? `The walk could not be kept on this device: ${String(err)}`);
      } finally {
        pending.current -= 1;
        if (!ok) setSaveState('failed');
        else if (pending.current === 0) {
          setSaveState('saved');
          markSaved(WALK_UNSAVED_KEY);
        }
      }
    });
  }

  /** Close the current walk record (finished or stopped) and clear the screen for a new one. */
  function close(status: 'finished' | 'abandoned') {
    const d = latest.current;
    if (d) save({ ...d, finished: true }, status);
    saving.current = saving.current.then(() => {
      walkId.current = null;
      visitId.current = null;
    });
    latest.current = null;
    setDraft(null);
  }

  /** Copy the walk's readings (not those withdrawn by Back) into the instrument's current visit. */
  async function copyToVisit() {
    const d = latest.current;
    if (!d) return;
    const profile = instruments.find((p) => p.id === d.walk.instrument?.id) ?? null;
    let done = 0;
    let problem: string | null = null;
    for (const r of activeReadings(d.walk)) {
      // As a catalogue reading where the step names one; if the visit log refuses that, as a plain noted value.
      let res = await noteThis(store, profile, visitNote(r, d.walk.instrument));
      if (!res.ok) res = await noteThis(store, profile, plainNote(r));
      if (!res.ok) {
        problem = res.message;
        break;
      }
      done += 1;
    }
    if (problem) notify(`${done} readings added; then: ${problem}`);
    else {
      notify(`${done} readings added to the visit log.`);
      // The readings went into the instrument's open visit: the walk belongs to it too.
      visitId.current = (await openVisitOf(d.walk.instrument?.id)) ?? visitId.current;
      save({ ...d, notedToVisit: true });
    }
  }

  /** The instrument's open visit, if the visit log has one (the same one "Note this" writes to). */
  async function openVisitOf(instrumentId: string | undefined): Promise<string | null> {
    if (!store || !instrumentId) return null;
    try {
      return (await store.currentVisit(instrumentId))?.id ?? null;
    } catch (err) {
      // The walk is still kept, only without its visit: say so, so the engineer can add it to a visit by hand.
      notify(`The walk is kept, but the open visit could not be read to link it: ${errorText(err)}`);
      return null;
    }
  }

  /** Start at the shared entry, or (given a symptom) at the shared safety gate and then straight to that symptom. */
  function begin(tree: Tree, symptom?: Tree) {
    const walk = symptom ? startDirect(tree, symptom, instrument ?? null) : start(tree, instrument ?? null);
    setResumed(false);
    walkId.current = null;
    visitId.current = null;
    // Link to the open visit before the first save is queued, so the walk record carries it from the start.
    saving.current = saving.current.then(async () => {
      visitId.current = await openVisitOf(walk.instrument?.id);
    });
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
              <button key={t.id} type="button" class="btn btn-block" onClick={() => begin(treeById('entry'), t)}>
                {t.title}
              </button>
            ))}
          </div>
          <p class="hint">Going straight still starts with the shared safety gate, then skips the as-found record (optional here); steps behind covers still have their own gates.</p>
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
        <p><SaveState state={saveState} /></p>
        <WalkSummary walk={walk} />
        <button type="button" class="btn btn-block" disabled={!!draft.notedToVisit || activeReadings(walk).length === 0} onClick={copyToVisit}>
          {draft.notedToVisit ? 'Readings are in the visit log' : `Add ${activeReadings(walk).length} readings to the visit log`}
        </button>
        <button
          type="button"
          class="btn btn-primary btn-block"
          onClick={() => close('finished')}
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
          Resumed the walk started {formatDateTime(new Date(walk.startedAt))} — nothing was lost.
        </p>
      )}
      <div class="walk-head">
        <p class="walk-tree">
          <strong>{tree.title}</strong> · step {walk.steps.length + 1} ·{' '}
          <SaveState state={saveState} />
        </p>
        <p class="hint">
          {walk.instrument ? `Expected values for ${walk.instrument.name}` : 'No instrument: expected values that need geometry are not shown'}
          {walk.direct && walk.treeId === 'entry' && ` · then: ${TREE_TITLE(walk.direct)}`}
          {walk.queue.length > 0 && ` · then: ${walk.queue.map(TREE_TITLE).join(', ')}`}
        </p>
      </div>
      <NodeView
        walk={walk}
        tree={tree}
        typed={typed}
        onTyped={(patch) => {
          const d = latest.current!;
          save({ ...d, typed: { ...d.typed, [key]: { ...(d.typed[key] ?? {}), ...patch } } });
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
        <ConfirmAction danger label="Stop walk" question="Stop this walk? It is kept on this device, marked as stopped, with all its readings."
          confirmLabel="Yes, stop the walk" onConfirm={() => { close('abandoned'); navigate('/diagnose'); }} />
      </div>
      <details class="card">
        <summary>Readings in this walk ({walk.readings.length})</summary>
        <WalkSummary walk={walk} />
      </details>
    </div>
  );
}

function SaveState(props: { state: 'saved' | 'saving' | 'failed' }) {
  return (
    <span class={`save-state save-${props.state}`} data-testid="save-state" role="status">
      {props.state === 'saved' ? '✓ kept on this device' : props.state === 'saving' ? '… saving' : '✗ not saved — keep this tab open'}
    </span>
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
        <ul class="reading-list" data-testid="walk-readings">
          {walk.readings.map((r) => (
            <li key={r.id} class={r.withdrawn ? 'reading withdrawn' : 'reading'}>
              <p class="reading-head">
                <strong>{r.quantity}</strong>
                {r.phase === 'as-left' ? ' (as-left)' : ''}
                {r.withdrawn ? ' — withdrawn by Back' : ''}
              </p>
              <p class="reading-line">
                <span class="reading-value">{formatNumber(r.value)} {r.unit}</span>{' '}
                <VerdictWord verdict={r.verdict} side={r.side} />
              </p>
              <p class="hint">
                {r.expected !== null
                  ? `Expected ${formatNumber(r.expected)} ${r.unit}`
                  : r.low !== null || r.high !== null
                    ? `Expected ${r.low !== null ? formatNumber(r.low) : '…'} to ${r.high !== null ? formatNumber(r.high) : '…'} ${r.unit}`
                    : 'No expected value'}
                {r.tolerance ? `; pass ${r.tolerance.passLow === null ? '…' : formatNumber(r.tolerance.passLow)} to ${r.tolerance.passHigh === null ? '…' : formatNumber(r.tolerance.passHigh)} ${r.unit}` : ''}
                {r.judgedBy === 'engineer' ? '; judged by the engineer' : ''}
                {` · step ${r.treeId}/${r.nodeId} · ${formatTime(new Date(r.at))}`}
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

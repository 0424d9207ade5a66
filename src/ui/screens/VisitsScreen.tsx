// Visits: the service record of each instrument. Paths: /visits (list, trends, backup), /visits/new,
// /visits/<id> (readings), /visits/<id>/edit, /visits/<id>/report (printable record).
import { useCallback, useEffect, useState } from 'preact/hooks';
import {
  DEMO_LAB, formatNumber, fromBase, keysInTitle, readingTitle, shownValue, visitReasons, type InstrumentProfile, type Reading, type ReadingType, type Visit,
  type WalkRecord, type BackupReminder,
} from '../../store';
import type { trees as Trees } from '../../diagnose';
import { More } from '../components/Fold';
import { lazy } from '../lazy';
import { useApp } from '../context';
import { navigate, usePath } from '../router';
import { BackupPanel, BackupReminderNote } from '../visits/BackupPanel';
import { shareOrDownload, canShareFiles, showDate } from '../visits/files';
import { errorText } from '../errorText';
import { ReadingEntry } from '../visits/ReadingEntry';
import { TrendPanel } from '../visits/TrendPanel';
import { VerdictBadge } from '../visits/Verdict';
import { MakerLimits } from '../visits/MakerLimits';
import { OwnTypeForm } from '../visits/OwnTypeForm';
import { VisitForm } from '../visits/VisitForm';
import '../visits/visits.css';
import { ConfirmAction } from '../components/ConfirmAction';
import { ReadingEdit } from '../visits/ReadingEdit';
import { Fragment } from 'preact';
import { historyLines } from '../../records';

export function VisitsScreen() {
  const path = usePath();
  const parts = path.slice('/visits'.length).split('/').filter(Boolean).map(decodeURIComponent);
  if (parts.length === 0) return <VisitList />;
  if (parts[0] === 'new') return <NewVisit />;
  const [id, sub] = parts;
  return <VisitPage key={id} id={id} sub={sub} />;
}

const reasonLabel = (r: string) => visitReasons.find((x) => x.value === r)?.label ?? r;

function useReadingTypes(): [ReadingType[], () => void] {
  const { store, notify } = useApp();
  const [types, setTypes] = useState<ReadingType[]>([]);
  const reload = useCallback(() => {
    if (store) void store.listReadingTypes().then(setTypes).catch((err: unknown) => notify(`The reading types could not be read: ${errorText(err)}`));
  }, [store, notify]);
  useEffect(reload, [reload]);
  return [types, reload];
}

function VisitList() {
  const { store, storeProblem, instrument, demoLoading } = useApp();
  const [types, reloadTypes] = useReadingTypes();
  const [visits, setVisits] = useState<Visit[] | null>(null);
  // The backup reminder is read with the visits, so the list and the note above it appear together (no jump).
  const [reminder, setReminder] = useState<BackupReminder | null | undefined>(undefined);
  const [counts, setCounts] = useState<Record<string, { n: number; fail: number; borderline: number }>>({});
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    // On a first start the demo visits are read once they are all written.
    if (!store || !instrument || demoLoading) return;
    let stale = false;
    (async () => {
      try {
        // Without the backup status the list still shows; the reminder's absence is then said, not silent.
        const status = await store.backupStatus().catch((err: unknown) => {
          if (!stale) setProblem(`Whether a backup is due could not be read: ${errorText(err)}`);
          return null;
        });
        if (!stale) setReminder(status);
        const list = await store.listVisits(instrument.id);
        const readings = await store.listInstrumentReadings(instrument.id);
        const c: Record<string, { n: number; fail: number; borderline: number }> = {};
        for (const r of readings) {
          const x = (c[r.visitId] ??= { n: 0, fail: 0, borderline: 0 });
          x.n++;
          if (r.verdict === 'fail') x.fail++;
          if (r.verdict === 'borderline') x.borderline++;
        }
        if (!stale) { setVisits(list); setCounts(c); }
      } catch (err) {
        if (!stale) setProblem(errorText(err));
      }
    })();
    return () => { stale = true; };
  }, [store, instrument, demoLoading]);

  // Until the database has answered and the list is read, only the heading shows: the rest arrives in one piece
  // below it, so nothing on screen is pushed down while it loads.
  const loading = (!store && !storeProblem) || (!!instrument && (visits === null || demoLoading) && !problem);
  if (loading) {
    return (
      <section class="screen">
        <h1>Visits</h1>
        <p class="lede">Service visits with as-found and as-left readings, each judged against the instrument’s baseline, a calculation or a generic range.</p>
        <p class="muted" aria-live="polite">Loading visits…</p>
      </section>
    );
  }

  return (
    <section class="screen">
      <h1>Visits</h1>
      <p class="lede">Service visits with as-found and as-left readings, each judged against the instrument’s baseline, a calculation or a generic range.</p>
      {!instrument ? (
        <>
          <p class="notice">Pick or create an instrument first: visits belong to an instrument. <a href="/instruments/new">New instrument</a></p>
          <BackupReminderNote />
        </>
      ) : (
        <>
          <div class="row">
            <a class="btn btn-primary" href="/visits/new">New visit</a>
            <span class="muted">for {instrument.name}</span>
          </div>
          {/* The day's first move comes first; the backup reminder right after it. */}
          <BackupReminderNote initial={reminder} />
          {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
          {visits && visits.length === 0 && <p class="notice">No visits recorded for this instrument yet.</p>}
          {visits && visits.length > 0 && (
            <VisitItems label={`Visits to ${instrument.name}`} visits={visits.slice(0, RECENT_VISITS)} counts={counts} />
          )}
          {visits && visits.length > RECENT_VISITS && (
            <details class="card more" data-testid="older-visits">
              <summary><strong>Older visits ({visits.length - RECENT_VISITS})</strong></summary>
              <VisitItems label={`Older visits to ${instrument.name}`} visits={visits.slice(RECENT_VISITS)} counts={counts} />
            </details>
          )}
          {types.length > 0 && <More title="Trends across visits" class="more-tool" testId="trend-fold"><TrendPanel instrumentId={instrument.id} types={types} /></More>}
          {types.length > 0 && <MakerLimits key={instrument.id} instrument={instrument} types={types} />}
          <OwnTypeForm onAdded={reloadTypes} />
        </>
      )}
      <More title="Backup and export" class="more-tool" testId="backup-fold" open={typeof location !== 'undefined' && location.hash === '#backup'}><BackupPanel /></More>
    </section>
  );
}

/** How many visits the list shows before the rest fold away under "Older visits". */
const RECENT_VISITS = 4;

function VisitItems(props: { label: string; visits: Visit[]; counts: Record<string, { n: number; fail: number; borderline: number }> }) {
  return (
    <ul class="visit-list" aria-label={props.label}>
      {props.visits.map((v) => {
        const c = props.counts[v.id];
        return (
          <li key={v.id}>
            <a class="visit-item" href={`/visits/${encodeURIComponent(v.id)}`} data-testid="visit-item">
              <span class="when">{showDate(v.startedAt)} · {reasonLabel(v.reason)}{v.baseline ? ' · ★ baseline' : ''}{v.demo ? ' · demo' : ''}</span>
              <span class="counts">
                {v.engineer || 'engineer not recorded'}{v.site ? ` · ${v.site}` : ''} · {c?.n ?? 0} readings
                {c?.fail ? ` · ✗ ${c.fail} fail` : ''}{c?.borderline ? ` · △ ${c.borderline} borderline` : ''}
              </span>
            </a>
          </li>
        );
      })}
    </ul>
  );
}

function NewVisit() {
  const { instrument } = useApp();
  return (
    <section class="screen">
      <h1>New visit</h1>
      {instrument ? (
        <>
          <p class="lede">For {instrument.name}. Everything you type is kept as a draft until you save.</p>
          <VisitForm instrumentId={instrument.id} />
        </>
      ) : (
        <p class="notice">Pick or create an instrument first. <a href="/instruments/new">New instrument</a></p>
      )}
    </section>
  );
}

function VisitPage(props: { id: string; sub?: string }) {
  const { store, instruments, notify } = useApp();
  const [types] = useReadingTypes();
  const [visit, setVisit] = useState<Visit | null | undefined>(undefined);
  const [readings, setReadings] = useState<Reading[]>([]);
  const [walks, setWalks] = useState<WalkRecord[]>([]);
  const [problem, setProblem] = useState<string | null>(null);

  const load = useCallback(async () => {
    if (!store) return;
    try {
      const v = await store.getVisit(props.id);
      setVisit(v ?? null);
      if (v) {
        setReadings(await store.listReadings(v.id));
        setWalks(await store.listWalks(v.id));
        // Opening a visit makes it the one "Note this" writes to; if that cannot be kept, the visit still shows.
        await store.setCurrentVisit(v.instrumentId, v.id).catch((err: unknown) =>
          notify(`This visit is shown, but “Note this” could not be pointed at it: ${errorText(err)}`));
      }
    } catch (err) {
      setProblem(errorText(err));
    }
  }, [store, props.id, notify]);
  useEffect(() => void load(), [load]);

  if (problem) return <section class="screen"><p class="banner banner-problem" role="alert">{problem}</p></section>;
  if (visit === undefined) return <section class="screen"><p>Loading…</p></section>;
  if (visit === null) {
    return (
      <section class="screen">
        <h1>Visit not found</h1>
        <p>There is no visit with this address on this device. It may have been deleted, or it lives on another device.</p>
        <a class="btn" href="/visits">Back to visits</a>
      </section>
    );
  }
  const instrument = instruments.find((i) => i.id === visit.instrumentId);
  const typeOf = (id: string) => types.find((t) => t.id === id);

  if (props.sub === 'edit') {
    return (
      <section class="screen">
        <h1>Edit visit</h1>
        <VisitForm visit={visit} instrumentId={visit.instrumentId} />
      </section>
    );
  }
  if (props.sub === 'report') return <ReportView visit={visit} instrument={instrument} readings={readings} walks={walks} typeOf={typeOf} />;

  async function toggleBaseline() {
    if (!store || !visit) return;
    try {
      const next = await store.markBaseline(visit.id, !visit.baseline);
      setVisit(next);
      notify(next.baseline ? 'This visit’s as-left readings are now the baseline: later readings compare with them.' : 'Baseline mark removed.');
    } catch (err) {
      notify(errorText(err));
    }
  }

  async function removeReading(r: Reading) {
    if (!store) return;
    try {
      const gone = await store.deleteReading(r.id);
      await load();
      if (gone) notify('Reading deleted.', { label: 'Undo', run: () => void store.restoreReading(gone).then(load) });
    } catch (err) {
      notify(errorText(err));
    }
  }

  async function removeVisit() {
    if (!store || !visit) return;
    try {
      const bundle = await store.deleteVisit(visit.id);
      navigate('/visits');
      if (bundle) notify('Visit deleted.', { label: 'Undo', run: () => void store.restoreVisit(bundle).then(() => navigate(`/visits/${encodeURIComponent(bundle.visit.id)}`)) });
    } catch (err) {
      notify(errorText(err));
    }
  }

  async function saveReport(viaShare: boolean) {
    if (!store || !visit) return;
    try {
      const html = await store.visitReport(visit.id);
      await shareOrDownload(`rodside-visit-${visit.startedAt.slice(0, 10)}.html`, 'text/html;charset=utf-8', html, viaShare);
    } catch (err) {
      notify(errorText(err));
    }
  }

  async function saveCsv() {
    if (!store || !visit) return;
    try {
      await shareOrDownload(`rodside-visit-${visit.startedAt.slice(0, 10)}.csv`, 'text/csv;charset=utf-8', await store.readingsCsv({ visitId: visit.id }), false);
    } catch (err) {
      notify(errorText(err));
    }
  }

  return (
    <section class="screen">
      <p><a class="btn btn-small" href="/visits">← All visits</a></p>
      <h1>Visit of {showDate(visit.startedAt)}</h1>
      <div class="card" data-testid="visit-summary">
        <dl class="facts">
          <div><dt>Instrument</dt><dd>{instrument?.name ?? 'deleted instrument'}</dd></div>
          <div><dt>Reason</dt><dd>{reasonLabel(visit.reason)}</dd></div>
          <div><dt>Engineer</dt><dd>{visit.engineer || '—'}</dd></div>
          <div><dt>Site</dt><dd>{visit.site || '—'}</dd></div>
          <div><dt>Baseline</dt><dd>{visit.baseline ? '★ yes' : 'no'}</dd></div>
        </dl>
        {visit.testEquipment && <p class="notes"><strong>Test equipment:</strong> {visit.testEquipment}</p>}
        {visit.partsUsed && <p class="notes"><strong>Parts used:</strong> {visit.partsUsed}</p>}
        {visit.notes && <p class="notes" data-testid="visit-notes">{visit.notes}</p>}
        <div class="row">
          <a class="btn" href={`/visits/${encodeURIComponent(visit.id)}/edit`}>Edit visit</a>
          <button type="button" class="btn" onClick={toggleBaseline}>{visit.baseline ? 'Remove baseline mark' : 'Mark as-left values as baseline'}</button>
          <a class="btn" href={`/visits/${encodeURIComponent(visit.id)}/report`}>Printable record</a>
          <button type="button" class="btn" onClick={() => saveReport(false)}>Download record</button>
          {canShareFiles() && <button type="button" class="btn" onClick={() => saveReport(true)}>Share record…</button>}
          <button type="button" class="btn" onClick={saveCsv}>CSV</button>
          <ConfirmAction danger label="Delete visit" question="Delete this visit with all its readings? You can undo right after." confirmLabel="Yes, delete the visit" onConfirm={removeVisit} />
        </div>
      </div>
      <ReadingTable title="As found" readings={readings.filter((r) => r.phase === 'as-found')} typeOf={typeOf} onDelete={removeReading} onEdited={() => void load()} />
      <ReadingTable title="As left" readings={readings.filter((r) => r.phase === 'as-left')} typeOf={typeOf} onDelete={removeReading} onEdited={() => void load()} />
      {types.length > 0 && <ReadingEntry visit={visit} types={types} onSaved={() => void load()} />}
      {walks.length > 0 && (
        <div class="card">
          <h2 class="card-title">Diagnosis walks</h2>
          <ul>{walks.map((w) => <li key={w.id}>{w.treeId} — {w.status}, started {showDate(w.startedAt)}</li>)}</ul>
        </div>
      )}
    </section>
  );
}

function expectedText(r: Reading, type: ReadingType | undefined): string {
  const e = r.expected;
  if (!e) return '—';
  const unit = type?.units.find((u) => u.label === r.entered.unit) ?? type?.units.find((u) => u.id === type.defaultUnit);
  const f = (x: number) => (unit ? formatNumber(fromBase(unit, x)) : formatNumber(x));
  const range = e.value !== undefined ? f(e.value) : `${e.low !== undefined ? f(e.low) : '…'} to ${e.high !== undefined ? f(e.high) : '…'}`;
  return `${range} ${unit?.label ?? ''} (${e.basis})`;
}

/**
 * The diagnosis trees, loaded when a table first shows a reading taken on a walk (most visits have none, and the
 * trees are the largest part of the app's code: the visit list does not wait for them).
 */
type WalkTrees = typeof Trees;
const walkTrees = lazy(() => import('../../diagnose').then((m) => m.trees));
function useWalkTrees(needed: boolean): WalkTrees | null {
  const [loaded, setLoaded] = useState<WalkTrees | null>(walkTrees.now());
  useEffect(() => {
    if (!needed || loaded) return;
    let live = true;
    walkTrees.get().then((t) => live && setLoaded(t), () => undefined /* the step keeps its plain wording */);
    return () => {
      live = false;
    };
  }, [needed, loaded]);
  return loaded;
}

/** A walk step by its title, never its internal code ("from a diagnosis walk" until the trees are loaded). */
function walkStepText(ref: string, trees: WalkTrees | null): string {
  const [treeId, nodeId] = ref.split('/');
  const tree = trees?.find((t) => t.id === treeId);
  const node = tree?.nodes.find((n) => n.id === nodeId);
  return node ? `diagnosis walk: ${tree!.title}, “${node.title}”` : 'from a diagnosis walk';
}

function contextText(r: Reading, trees: WalkTrees | null): string {
  const said = keysInTitle(r.typeId, r.context);
  return Object.entries(r.context ?? {})
    .filter(([k]) => k !== 'convention' && k !== 'label' && k !== 'unit' && !said.includes(k))
    .map(([k, v]) => (k === 'mz' ? `m/z ${v}` : k === 'referenceMz' ? `relative to m/z ${v}` : k === 'gaugeGas' ? `gauge: ${v}` : k === 'setpoint' ? 'set value given'
      : k === 'argonPercent' ? `m/z 40 = ${v} % of m/z 28` : k === 'formula' ? `formula ${v}` : k === 'walkStep' ? walkStepText(String(v), trees) : `${k} ${v}`))
    .join(' · ');
}

function ReadingTable(props: { title: string; readings: Reading[]; typeOf: (id: string) => ReadingType | undefined; onDelete?: (r: Reading) => void; onEdited?: () => void }) {
  const [editing, setEditing] = useState<string | null>(null);
  const actions = !!props.onDelete;
  const trees = useWalkTrees(props.readings.some((r) => r.context?.walkStep !== undefined));
  return (
    <div class="card">
      <h2 class="card-title">{props.title}</h2>
      {props.readings.length === 0 ? (
        <p class="muted">None recorded yet.</p>
      ) : (
        <div class="scroll-x">
          <table class="values reading-table stack-table" data-testid={`readings-${props.title === 'As found' ? 'as-found' : 'as-left'}`}>
            <thead><tr><th>Reading</th><th>Value</th><th>Verdict</th><th>Expected</th><th>Note</th>{actions && <th><span class="visually-hidden">Actions</span></th>}</tr></thead>
            <tbody>
              {props.readings.map((r) => {
                const t = props.typeOf(r.typeId);
                const ctx = contextText(r, trees);
                const earlier = historyLines(r);
                const label = t?.label ?? 'reading';
                return (
                  <Fragment key={r.id}>
                    <tr data-testid="reading-row">
                      <td class="what stack-head">{r.typeId === 'noted-value' ? String(r.context?.label ?? 'Noted value') : readingTitle(r, t)}{ctx && <span class="ctx">{ctx}</span>}</td>
                      <td class="value">{shownValue(r, t)}
                        {earlier.length > 0 && <span class="ctx" data-testid="reading-history">Earlier: {earlier.join('; ')}</span>}
                      </td>
                      <td class="judged stack-side"><VerdictBadge verdict={r.verdict} /></td>
                      <td class="expected" data-label="Expected">{expectedText(r, t)}{r.expected?.summary && <span class="ctx">{r.expected.summary}</span>}</td>
                      <td class={r.note ? 'note' : 'note empty'} data-label="Note">{r.note}</td>
                      {actions && (
                        <td class="actions">
                          {t && t.id !== 'noted-value' && (
                            <button type="button" class="btn btn-small no-print" onClick={() => setEditing(editing === r.id ? null : r.id)} aria-label={`Edit ${label}`} aria-expanded={editing === r.id}>Edit</button>
                          )}
                          <button type="button" class="btn btn-small no-print" onClick={() => props.onDelete!(r)} aria-label={`Delete ${label}`}>Delete</button>
                        </td>
                      )}
                    </tr>
                    {editing === r.id && t && (
                      <tr class="no-print"><td colSpan={6}>
                        <ReadingEdit reading={r} type={t} onDone={(saved) => { setEditing(null); if (saved) props.onEdited?.(); }} />
                      </td></tr>
                    )}
                  </Fragment>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}

function ReportView(props: { visit: Visit; instrument?: InstrumentProfile; readings: Reading[]; walks: WalkRecord[]; typeOf: (id: string) => ReadingType | undefined }) {
  const { visit: v, instrument: i, readings } = props;
  const counts = { pass: 0, borderline: 0, fail: 0, convention: 0 };
  for (const r of readings) if (r.verdict) counts[r.verdict]++;
  return (
    <section class="screen">
      <div class="row no-print">
        <a class="btn" href={`/visits/${encodeURIComponent(v.id)}`}>← Back to the visit</a>
        <button type="button" class="btn btn-primary" onClick={() => window.print()}>Print</button>
      </div>
      <article class="visit-report" data-testid="visit-report">
        <h1>Service visit record — {i?.name ?? 'deleted instrument'}</h1>
        {i?.demo && <p>{DEMO_LAB}</p>}
        <dl>
          <dt>Started</dt><dd>{showDate(v.startedAt)}</dd>
          <dt>Site</dt><dd>{v.site || '—'}</dd>
          <dt>Engineer</dt><dd>{v.engineer || '—'}</dd>
          <dt>Reason</dt><dd>{reasonLabel(v.reason)}</dd>
          <dt>Test equipment</dt><dd>{v.testEquipment || '—'}</dd>
          <dt>Parts used</dt><dd>{v.partsUsed || '—'}</dd>
          <dt>Baseline</dt><dd>{v.baseline ? 'Yes: this visit’s as-left readings are the instrument’s baseline' : 'No'}</dd>
        </dl>
        <h2>Summary</h2>
        <p>{readings.length} readings: {counts.pass} pass (✓), {counts.borderline} borderline (△), {counts.fail} fail (✗){counts.convention ? `, ${counts.convention} check the convention (⇄)` : ''}.</p>
        <h2>Notes</h2>
        <p class="notes">{v.notes || '—'}</p>
        <ReadingTable title="As found" readings={readings.filter((r) => r.phase === 'as-found')} typeOf={props.typeOf} />
        <ReadingTable title="As left" readings={readings.filter((r) => r.phase === 'as-left')} typeOf={props.typeOf} />
        {props.walks.length > 0 && (
          <>
            <h2>Diagnosis walks</h2>
            <ul>{props.walks.map((w) => <li key={w.id}>{w.treeId} — {w.status}, started {showDate(w.startedAt)}</li>)}</ul>
          </>
        )}
        <div class="sign"><div>Engineer: name, signature, date</div><div>Customer: name, signature, date</div></div>
        <p><small>Expected values are guides; the instrument maker’s limits and procedures take precedence.</small></p>
      </article>
    </section>
  );
}

// Overview: where an engineer starts. The instrument in front of them, what is already open (a visit, a walk),
// the usual first moves, then every area. Only facts the device holds; nothing is guessed.
import { useEffect, useState } from 'preact/hooks';
import { instrumentKinds, visitReasons, type Visit, type WalkRecord } from '../../store';
import { areas } from '../areas';
import { useApp } from '../context';
import { formatConvention, formatSi } from '../format';
import { subscribeOffline, type OfflineState } from '../offline';
import { More } from '../components/Fold';
import { StorageStatus } from '../components/StorageStatus';
import { showDate } from '../visits/files';
import { errorText } from '../errorText';

/** Title of a walk's tree. The trees load only when a walk is open, so the overview stays small at start-up (only the
 * trees, not the whole diagnose module: the Bench and Stability cautions share its small safety module instead). */
async function walkTitle(treeId: string): Promise<string> {
  try {
    const { treeById } = await import('../../diagnose/trees/index');
    return treeById(treeId as Parameters<typeof treeById>[0]).title;
  } catch {
    return 'a diagnosis';
  }
}

export function HomeScreen() {
  const { store, storeProblem, instrument, instruments } = useApp();
  // Until the database has answered, the overview keeps the shape it will have with an instrument (the usual case),
  // so the instrument line, the latest visit and the first moves arrive without pushing anything down.
  const opening = !store && !storeProblem;
  const [offline, setOffline] = useState<OfflineState | null>(null);
  const [latestVisit, setLatestVisit] = useState<Visit | null | undefined>(undefined);
  const [openWalk, setOpenWalk] = useState<{ record: WalkRecord; title: string } | null>(null);
  const [walkProblem, setWalkProblem] = useState<string | null>(null);
  useEffect(() => subscribeOffline(setOffline), []);
  useEffect(() => {
    if (!store || !instrument) return;
    let live = true;
    // What is already under way; a failed read leaves the line out and says so in one quiet line.
    store.listVisits(instrument.id).then((v) => live && setLatestVisit(v[0] ?? null), (err: unknown) => {
      if (!live) return;
      setLatestVisit(undefined);
      setWalkProblem(`Could not read the latest visit: ${errorText(err)}`);
    });
    store.latestInProgressWalk()
      .then(async (w) => {
        const title = w ? await walkTitle(w.treeId) : '';
        if (live) setOpenWalk(w ? { record: w, title } : null);
      })
      .catch((err: unknown) => {
        // The start page stays usable; the Diagnose screen reads the walk again and reports there too.
        if (live) setWalkProblem(`Could not check for a walk in progress: ${errorText(err)}`);
      });
    return () => { live = false; };
    // Read again when another instrument is chosen, not when the same profile object is rebuilt.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [store, instrument?.id]);

  return (
    <section class="screen">
      <h1>Overview</h1>
      <div class="card card-current" data-testid="current-instrument" aria-busy={opening ? 'true' : undefined}>
        <h2 class="card-title">Working on</h2>
        {opening ? (
          <>
            <p class="big muted">Opening this device's records…</p>
            <p class="muted">Instrument profiles, visits and walks are kept on this device.</p>
          </>
        ) : instrument ? (
          <>
            <p class="big">{instrument.name}</p>
            <p class="muted">
              {instrumentKinds.find((k) => k.value === instrument.kind)?.label} · r0 {formatSi(instrument.rodFieldRadius * 1e3, 'mm')} ·{' '}
              RF {formatSi(instrument.rfFrequency / 1e6, 'MHz')} · read-backs {formatConvention(instrument.readbackConvention)}
            </p>
            <p class="muted">Change it with the picker at the top. {instruments.length} profile{instruments.length === 1 ? '' : 's'} on this device.</p>
            {latestVisit && (
              <p data-testid="home-latest-visit">
                Latest visit: <a class="tap-link" href={`/visits/${encodeURIComponent(latestVisit.id)}`}>{showDate(latestVisit.startedAt)} · {visitReasons.find((r) => r.value === latestVisit.reason)?.label ?? 'visit'}</a>
              </p>
            )}
            {latestVisit === null && <p class="muted">No visits recorded for this instrument yet.</p>}
          </>
        ) : (
          <p>No instrument profile yet. <a href="/instruments/new">Create one</a> to get expected values.</p>
        )}
        {walkProblem && <p class="hint" role="status">{walkProblem}</p>}
        {openWalk && (
          <p class="notice" data-testid="home-open-walk">
            A walk is in progress: {openWalk.title}, last step {showDate(openWalk.record.updatedAt)}. <a class="tap-link" href="/diagnose">Carry on with it</a>
          </p>
        )}
      </div>
      <nav aria-label="Start here">
        <h2 class="card-title">Start here</h2>
        <ul class="quick-links">
          {/* Without a profile there are no expected values and no visits: the first move is to add one. */}
          {instrument || opening
            ? <li><a class="btn btn-primary" href="/bench">Expected voltages</a></li>
            : <li><a class="btn btn-primary" href="/instruments/new">Add an instrument</a></li>}
          <li><a class="btn" href="/diagnose">{openWalk ? 'Diagnose' : 'Start a walk'}</a></li>
          {(instrument || opening) && <li><a class="btn" href="/visits/new">New visit</a></li>}
          <li><a class="btn" href="/scan">Check a scan</a></li>
          <li><a class="btn" href="/safety">Safety cards</a></li>
        </ul>
      </nav>
      <h2 class="card-title">All areas</h2>
      <ul class="tiles" aria-label="All areas">
        {areas.filter((a) => a.id !== 'home').map((a) => (
          <li key={a.id}>
            <a class="tile" href={a.path}>
              <a.icon />
              <span class="tile-title">{a.title}</span>
              <span class="tile-blurb">{a.blurb}</span>
            </a>
          </li>
        ))}
      </ul>
      <More title={`This device: ${offline?.offlineReady ? '✓ ready offline' : '… preparing offline use'}`}>
        <p>{offline?.offlineReady ? '✓ Ready to work offline.' : '… Preparing offline use (needs one complete load).'}</p>
        <StorageStatus />
        <p class="hint">Expected values, stability, peak simulation, guided diagnosis and the visit log all run on this device, with or without a network. Ideal-field physics throughout; the instrument maker's limits and procedures come first.</p>
      </More>
    </section>
  );
}

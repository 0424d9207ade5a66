import { useEffect, useState } from 'preact/hooks';
import { instrumentKinds } from '../../store';
import { areas } from '../areas';
import { useApp } from '../context';
import { formatConvention, formatSi } from '../format';
import { subscribeOffline, type OfflineState } from '../offline';
import { StorageStatus } from '../components/StorageStatus';

export function HomeScreen() {
  const { instrument, instruments } = useApp();
  const [offline, setOffline] = useState<OfflineState | null>(null);
  useEffect(() => subscribeOffline(setOffline), []);
  return (
    <section class="screen">
      <h1>Rodside</h1>
      <p class="lede">Expected voltages, stability and resolution, peak simulation, guided diagnosis and a visit log for quadrupole analysers. Everything runs on this device, with or without a network.</p>
      <div class="card" data-testid="current-instrument">
        <h2 class="card-title">Working on</h2>
        {instrument ? (
          <>
            <p class="big">{instrument.name}</p>
            <p class="muted">
              {instrumentKinds.find((k) => k.value === instrument.kind)?.label} · r0 {formatSi(instrument.rodFieldRadius * 1e3, 'mm')} ·{' '}
              {formatSi(instrument.rfFrequency / 1e6, 'MHz')} · read-backs {formatConvention(instrument.readbackConvention)}
            </p>
            <p class="muted">Change it with the picker at the top. {instruments.length} profile{instruments.length === 1 ? '' : 's'} on this device.</p>
          </>
        ) : (
          <p>No instrument profile yet. <a href="/instruments/new">Create one</a> to get expected values.</p>
        )}
      </div>
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
      <div class="card">
        <h2 class="card-title">This device</h2>
        <p>{offline?.offlineReady ? '✓ Ready to work offline.' : '… Preparing offline use (needs one complete load).'}</p>
        <StorageStatus />
      </div>
    </section>
  );
}

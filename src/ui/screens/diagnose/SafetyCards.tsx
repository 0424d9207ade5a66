import { SAFETY_CARDS } from '../../../diagnose/safety';
import type { SafetyCardId } from '../../../diagnose/types';

/** The hazard cards a step carries: hazards and precautions shown, sources and the deferral one tap away. */
export function SafetyCards(props: { ids: SafetyCardId[] | undefined; open?: boolean }) {
  const ids = [...new Set(props.ids ?? [])];
  if (ids.length === 0) return null;
  return (
    <div class="walk-cards" aria-label="Safety for this step">
      {ids.map((id) => {
        const c = SAFETY_CARDS[id];
        return (
          <details key={id} class="card caution safety-card" open={props.open} data-testid="safety-card">
            <summary>
              <span aria-hidden="true">⚠ </span>
              <strong>{c.title}</strong>
            </summary>
            <p class="safety-sub">Hazards</p>
            <ul>{c.hazards.map((h) => <li key={h}>{h}</li>)}</ul>
            <p class="safety-sub">Precautions</p>
            <ul>{c.precautions.map((h) => <li key={h}>{h}</li>)}</ul>
            <p class="hint">Sources: {c.sources.join('; ')}.</p>
            <p class="safety-deferral">{c.deferral}</p>
          </details>
        );
      })}
    </div>
  );
}

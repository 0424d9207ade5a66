// The caution shown beside any value above the hazardous-live levels: the levels and what is exceeded, the two
// precautions that matter at the bench, the shared deferral, and the full high-voltage, RF and stored-charge
// cards of the one card set (src/diagnose/safety.ts) one tap away.
import { DEFERRAL } from '../../diagnose/safety';
import { HAZARDOUS_LIVE_LEVELS, HAZARDOUS_LIVE_SOURCE, hazardousLive } from '../../engine';
import { IconCaution } from '../components/icons';
import { SafetyCards } from '../screens/diagnose/SafetyCards';

/** `compact` keeps the levels, the deferral and the cards (for screens where the voltages are not the main answer). */
export function HvCaution(props: { exceeded?: string[]; compact?: boolean; /** Anchor for a short caution that links here. */ id?: string }) {
  const dry = HAZARDOUS_LIVE_LEVELS.dry;
  const wet = HAZARDOUS_LIVE_LEVELS.wet;
  return (
    <div class="card caution" role="note" data-testid="hv-caution" id={props.id} tabIndex={props.id ? -1 : undefined}>
      <h2 class="card-title"><IconCaution /> Hazardous live: high voltage and RF on the rods</h2>
      <p>
        Above {dry.rms} V rms, {dry.peak} V peak or {dry.dc} V DC (dry; wet: {wet.rms} V rms, {wet.peak} V peak, {wet.dc} V DC) a part is
        treated as hazardous live ({HAZARDOUS_LIVE_SOURCE}).
      </p>
      {!props.compact && props.exceeded && props.exceeded.length > 0 && (
        <p><strong>Exceeded here:</strong> {props.exceeded.join(' · ')}.</p>
      )}
      {!props.compact && <ul>
        <li>Read RF at the instrument's monitor point, or with a low-capacitance probe rated for the voltage at that frequency, clipped on with the power off.</li>
        <li>RF near 1 MHz burns with little warning; keep hands clear while energised. Supplies and RF tanks hold charge after switch-off: verify before touching.</li>
      </ul>}
      <p class="safety-deferral">{DEFERRAL}</p>
      <SafetyCards ids={['high-voltage', 'rf', 'stored-charge']} />
    </div>
  );
}

/** Whether rod voltages U, V (per rod, V zero-to-peak) are hazardous live; values beyond the engine's range are. */
export function isHazardousLive(dc: number, rf: number): boolean {
  try {
    return hazardousLive({ dc, rf }).hazardous;
  } catch {
    return true;
  }
}

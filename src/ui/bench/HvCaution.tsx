// The short high-voltage / RF card shown beside any value above the hazardous-live levels (domain.md §4 S-HV, S-RF).
import { HAZARDOUS_LIVE_LEVELS, HAZARDOUS_LIVE_SOURCE } from '../../engine';
import { IconCaution } from '../components/icons';

export function HvCaution(props: { exceeded?: string[] }) {
  const dry = HAZARDOUS_LIVE_LEVELS.dry;
  const wet = HAZARDOUS_LIVE_LEVELS.wet;
  return (
    <div class="card caution" role="note" data-testid="hv-caution">
      <h2 class="card-title"><IconCaution /> ⚠ High voltage and RF on the rods</h2>
      <p>
        These values are above the hazardous-live levels ({dry.rms} V rms, {dry.peak} V peak or {dry.dc} V DC in dry locations;{' '}
        {wet.rms} V rms, {wet.peak} V peak or {wet.dc} V DC in wet ones — {HAZARDOUS_LIVE_SOURCE}).
        {props.exceeded && props.exceeded.length > 0 && <> Exceeded here: {props.exceeded.join('; ')}.</>}
      </p>
      <ul>
        <li>RF near 1 MHz can burn with little warning sensation, and arcs jump small gaps. Keep hands clear while energised.</li>
        <li>Measure only at the instrument's RF monitor point, or with a low-capacitance probe rated for the voltage at that frequency; clip on with power off and remove it before closing up (a forgotten probe detunes the RF and shifts the mass scale).</li>
        <li>Use meters rated for the voltage and measurement category. Never lift an oscilloscope's protective earth.</li>
        <li>Supplies and RF tanks hold charge after switch-off: wait the documented time, then verify absence of voltage with a rated tester. Do not defeat interlocks; use lockout/tagout before work behind covers.</li>
      </ul>
      <p class="muted">Always follow the instrument maker's procedures for the exact model, the site's safety rules and permits, local codes and regulations, and licensed or authorised practice for electrical work. This card is generic guidance and replaces none of them.</p>
    </div>
  );
}

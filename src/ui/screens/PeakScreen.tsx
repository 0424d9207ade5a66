// Peak: simulated peak shape and transmission for the selected instrument and settings.
import { PeakSimulation } from '../peak/PeakSimulation';

export function PeakScreen() {
  return (
    <section class="screen">
      <h1>Peak · simulated shape and transmission</h1>
      <PeakSimulation />
      <p class="lede">How the peak of an ideal filter looks for this analyser: transmission across m/z, resolution at 50 % and 10 % height, and what resolution costs in transmission.</p>
    </section>
  );
}

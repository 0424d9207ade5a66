// Bench: expected voltages for the instrument in front of you (/bench) and the vacuum check (/bench/vacuum).
import { SubNav } from '../bench/SubNav';
import { VacuumCheck } from '../bench/VacuumCheck';
import { Voltages } from '../bench/Voltages';
import { usePath } from '../router';

export const benchParts = [
  { path: '/bench', title: 'Voltages' },
  { path: '/bench/vacuum', title: 'Vacuum check' },
] as const;

export function BenchScreen() {
  const path = usePath();
  const vacuum = path === '/bench/vacuum';
  return (
    <section class="screen">
      <h1>{vacuum ? 'Bench · vacuum check' : 'Bench · expected voltages'}</h1>
      <SubNav label="Bench parts" current={vacuum ? '/bench/vacuum' : '/bench'} items={benchParts} />
      {vacuum ? <VacuumCheck /> : (
        <>
          <Voltages />
          <p class="hint">Expected RF and DC for each m/z on this analyser, from ideal-field physics.</p>
        </>
      )}
    </section>
  );
}

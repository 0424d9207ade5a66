import { Pending } from '../components/Pending';

export function BenchScreen() {
  return <Pending title="Bench" what="Expected RF and DC amplitudes for an m/z on the selected instrument, in every voltage convention, with the inverse and a proportionality check." />;
}

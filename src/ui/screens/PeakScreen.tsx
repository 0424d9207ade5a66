import { Pending } from '../components/Pending';

export function PeakScreen() {
  return <Pending title="Peak" what="Simulated peak shape and transmission for the selected instrument and settings." />;
}

import { Pending } from '../components/Pending';

export function VisitsScreen() {
  return <Pending title="Visits" what="Service visits with as-found and as-left readings, judged against expectations." />;
}

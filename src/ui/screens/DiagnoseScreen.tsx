import { Pending } from '../components/Pending';

export function DiagnoseScreen() {
  return <Pending title="Diagnose" what="Guided fault finding with measured steps, expected values and safety gates." />;
}

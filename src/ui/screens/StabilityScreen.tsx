import { Pending } from '../components/Pending';

export function StabilityScreen() {
  return <Pending title="Stability" what="The first stability region, operating points, pass band and resolution planning for the selected instrument." />;
}

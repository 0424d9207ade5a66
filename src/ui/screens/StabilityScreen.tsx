// Stability: the diagram with operating points and pass band (/stability) and the resolution planner
// (/stability/resolution).
import { SubNav } from '../bench/SubNav';
import { usePath } from '../router';
import { ResolutionPlanner } from '../stability/ResolutionPlanner';
import { StabilityDiagram } from '../stability/StabilityDiagram';

export const stabilityParts = [
  { path: '/stability', title: 'Diagram' },
  { path: '/stability/resolution', title: 'Resolution' },
] as const;

export function StabilityScreen() {
  const path = usePath();
  const resolution = path === '/stability/resolution';
  return (
    <section class="screen">
      <h1>{resolution ? 'Stability · resolution planner' : 'Stability · diagram'}</h1>
      <SubNav label="Stability parts" current={resolution ? '/stability/resolution' : '/stability'} items={stabilityParts} />
      {resolution ? (
        <>
          <ResolutionPlanner />
          <p class="lede">What resolution a setting gives, what limits it, the setting for a target resolution, and how long a scan takes.</p>
        </>
      ) : (
        <>
          <StabilityDiagram />
        </>
      )}
    </section>
  );
}

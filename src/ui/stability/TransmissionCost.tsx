// What a resolution costs in transmission: the band-centre transmission at the target setting against RF only
// at the same V, computed by the peak simulation in its worker (cancelled when a setting changes).
import { useEffect, useState } from 'preact/hooks';
import { InputRangeError } from '../../engine';
import { engineErrorWords } from '../../records';
import type { InstrumentProfile } from '../../store';
import { isAbortError, simClient } from '../../worker/client';
import { NumberField } from '../components/Field';
import { peakDefaults } from '../peak/peakInputs';
import { formatNumber } from '../format';
import { parseNumber, usePersistentInputs } from '../bench/inputs';
import { Result } from '../bench/NoteButton';
import { DraftProblem } from '../components/DraftProblem';

type BeamInputs = { beamRadius: string; transverseEnergy: string };
// The same beam the Peak area starts from, so the two areas agree until someone changes one.
const beamDefaults = (p: InstrumentProfile | null): BeamInputs => {
  const peak = peakDefaults(p);
  return { beamRadius: peak.beamRadiusMm, transverseEnergy: peak.transverseEnergy };
};

type State =
  | { status: 'idle' }
  | { status: 'running'; progress: number }
  | { status: 'done'; target: number; open: number }
  | { status: 'failed'; message: string; field?: string };

export function TransmissionCost(props: { mz: number; dc: number; rf: number; r0: number; frequency: number; rodLength: number; axialEnergy: number; targetR: number }) {
  const [inputs, update, inputsProblem] = usePersistentInputs<BeamInputs>('beam', beamDefaults);
  const [state, setState] = useState<State>({ status: 'idle' });
  const radius = parseNumber(inputs.beamRadius, 'Beam radius', '0.5');
  const energy = parseNumber(inputs.transverseEnergy, 'Transverse energy', '0.1');
  const { mz, dc, rf, r0, frequency, rodLength, axialEnergy } = props;
  const key = [mz, dc, rf, r0, frequency, rodLength, axialEnergy, inputs.beamRadius, inputs.transverseEnergy].join('|');

  useEffect(() => {
    if (!radius.ok || !energy.ok) return;
    const controller = new AbortController();
    const base = { mz, r0, frequency, rf, rodLength, axialVoltage: axialEnergy, beamRadius: radius.value / 1e3, transverseEnergy: energy.value };
    // A short pause so typing does not start a run per keystroke; a change cancels the run in flight.
    const timer = setTimeout(async () => {
      setState({ status: 'running', progress: 0 });
      try {
        const client = simClient();
        const target = await client.run('transmission', { ...base, dc }, { signal: controller.signal, onProgress: (f) => setState({ status: 'running', progress: f / 2 }) });
        const open = await client.run('transmission', { ...base, dc: 0 }, { signal: controller.signal, onProgress: (f) => setState({ status: 'running', progress: 0.5 + f / 2 }) });
        setState({ status: 'done', target: target.transmission, open: open.transmission });
      } catch (err) {
        if (isAbortError(err)) return;
        if (err instanceof InputRangeError) setState({ status: 'failed', message: engineErrorWords(err), field: err.field });
        else setState({ status: 'failed', message: `The peak simulation could not run here (${(err as Error)?.message ?? String(err)}).` });
      }
    }, 300);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  const cost = state.status === 'done' && state.open > 0 ? 1 - state.target / state.open : null;
  const beamError = (field: string) => (state.status === 'failed' && state.field === field ? state.message : null);
  return (
    <div class="fieldset" data-testid="transmission-cost">
      <h3 class="card-title">Transmission cost</h3>
      <DraftProblem problem={inputsProblem} />
      <div class="pair">
        <NumberField id="beam-radius" label="Beam radius at entry" unit="mm" value={inputs.beamRadius} error={radius.ok ? beamError('beamRadius') : radius.message} onInput={(t) => update({ beamRadius: t })} />
        <NumberField id="beam-energy" label="Transverse energy" unit="eV" value={inputs.transverseEnergy} error={energy.ok ? beamError('transverseEnergy') : energy.message} onInput={(t) => update({ transverseEnergy: t })} />
      </div>
      {state.status === 'running' && <p class="hint" role="status">Simulating in the background… {Math.round(state.progress * 100)} %</p>}
      {state.status === 'done' && cost !== null && (
        <>
          <Result label={`Band-centre transmission at m/Δm ${formatNumber(props.targetR, 4)}`} value={`${formatNumber(state.target * 100, 3)} %`} testId="transmission-target"
            note={{ label: `Simulated band-centre transmission at m/Δm ${props.targetR}, m/z ${mz}`, value: state.target * 100, unit: '%', origin: 'calculator', context: { beamRadiusMm: inputs.beamRadius, transverseEnergyEv: inputs.transverseEnergy } }} />
          <Result label="RF only at the same V (wide open)" value={`${formatNumber(state.open * 100, 3)} %`}
            note={{ label: `Simulated RF-only transmission at m/z ${mz}`, value: state.open * 100, unit: '%', origin: 'calculator' }} />
          <p class="big" data-testid="transmission-loss">Resolving to m/Δm {formatNumber(props.targetR, 4)} costs {formatNumber(cost * 100, 3)} % of the ions that RF only would pass.</p>
        </>
      )}
      {state.status === 'failed' && !state.field && <p class="notice">{state.message} Transmission cost: see the Peak area.</p>}
      {state.status === 'failed' && state.field && state.field !== 'beamRadius' && state.field !== 'transverseEnergy' && (
        <p class="notice">The peak simulation refused these settings: {state.message}</p>
      )}
      <p class="hint">Ideal field, no fringe fields, a uniformly filled entrance disc; the Peak area shows the whole peak for these settings.</p>
    </div>
  );
}

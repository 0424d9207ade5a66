// Ions offered as one-tap lists. Demo suggestions of common practice, not an instrument's own routine.
import type { InstrumentProfile } from '../../store';

export interface IonList {
  label: string;
  values: number[];
}

export function ionListsFor(p: InstrumentProfile | null): IonList[] {
  if (p?.kind === 'rga') {
    return [
      { label: 'Residual gas: H2, H2O, N2/CO, O2, Ar, CO2', values: [2, 18, 28, 32, 40, 44] },
      { label: 'Air leak: 28, 32, 40', values: [28, 32, 40] },
    ];
  }
  return [
    { label: 'Perfluorinated EI calibrant: 69, 219, 502', values: [69, 219, 502] },
    { label: 'Background gases: 18, 28, 32, 44', values: [18, 28, 32, 44] },
  ];
}

export function defaultIons(p: InstrumentProfile | null): number[] {
  return ionListsFor(p)[0].values;
}

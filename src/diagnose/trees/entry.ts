import type { Tree } from '../types';
import { ANY_ROLE, PRESSURE_FROM_READING, gate, leaf, opt, STOP_TEXT } from './build';

/** Shared entry: safety first, then the as-found state, then the symptom(s). */
export const entryTree: Tree = {
  id: 'entry',
  title: 'Start a diagnosis',
  summary: 'Confirm the safety basics, record the state as found, then pick the symptom or symptoms.',
  entry: 'E1',
  nodes: [
    gate('E1', 'covers-on', ANY_ROLE, ['general', 'lockout'], 'E2', 'E-stop', 'Before you touch anything', 'Confirm each item. Steps further on that need covers off or live work ask again.', ['permit', 'lockout']),
    leaf('E-stop', 'Stop and escalate', STOP_TEXT, [
      'Leave the instrument as it is; do not reset alarms or power-cycle.',
      'Call the person or service organisation authorised for this instrument and pass on what you saw.',
    ], 'nothing yet; record the as-found state (status, pressures, temperatures) for whoever takes over', { escalate: true, cards: ['general'] }),
    {
      id: 'E2',
      kind: 'measure',
      title: 'As found: analyser pressure',
      text: 'Read the high-vacuum gauge before changing anything. Note whether the reading is N2-equivalent (most ion gauges are).',
      points: [
        'Also note the status indicators, the fore-vacuum, the turbo speed and the source and transfer-line temperatures.',
        'Attach the last calibration report values if you have them.',
      ],
      measure: {
        visitType: 'vacuum-high', quantity: 'Analyser pressure (as found)',
        unit: 'mbar',
        altUnits: ['Torr', 'Pa'],
        tool: 'Instrument ion-gauge read-back',
        how: 'Read the displayed value; do not switch gauges on or off.',
      },
      derived: [{ calc: 'meanFreePath', inputs: [PRESSURE_FROM_READING] }],
      branches: { otherwise: 'E3' },
      alternatives: [opt('no-gauge', 'No high-vacuum gauge on this system', 'E3')],
    },
    {
      id: 'E3',
      kind: 'question',
      title: 'As found: what changed last?',
      text: 'Pick the most recent event before the symptom. Add a note for anything else.',
      points: ['A discrete event (a vent, a source service, a column or cylinder change, a power cut, a move, a software update) often explains a sudden fault.'],
      options: [
        opt('vent', 'Vented or cleaned', 'E4'),
        opt('consumable', 'Column, filament or other consumable changed', 'E4'),
        opt('cylinder', 'Gas cylinder or generator changed', 'E4'),
        opt('power', 'Power cut, move or relocation', 'E4'),
        opt('software', 'Software or method update', 'E4'),
        opt('none', 'Nothing known', 'E4'),
      ],
    },
    {
      id: 'E4',
      kind: 'question',
      title: 'As found: how did it start?',
      text: 'A sudden change points to a discrete failure or event; a slow drift points to wear or contamination (common practice).',
      options: [opt('sudden', 'Suddenly', 'E5'), opt('gradual', 'Gradually, over days or weeks', 'E5'), opt('unknown', 'Not known', 'E5')],
    },
    {
      id: 'E5',
      kind: 'choice',
      multiple: true,
      title: 'Which symptom?',
      text: 'Pick every symptom you see. The walk takes them in this order: vacuum, leak, no signal, mass axis, peak shape, sensitivity, noise — vacuum faults and leaks cause most of the others.',
      options: [
        { id: 'vacuum', label: 'Vacuum fault or pump problem', tree: 'vacuum' },
        { id: 'leak', label: 'High background or suspected air or water leak', tree: 'leak' },
        { id: 'no-signal', label: 'No signal at all', tree: 'no-signal' },
        { id: 'mass-axis', label: 'Mass axis shifted', tree: 'mass-axis' },
        { id: 'peak-shape', label: 'Poor resolution or peak shape', tree: 'peak-shape' },
        { id: 'sensitivity', label: 'Low sensitivity', tree: 'sensitivity' },
        { id: 'noise', label: 'Noisy or unstable signal', tree: 'noise' },
      ],
    },
  ],
};

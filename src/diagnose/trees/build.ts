/** Small helpers that keep the tree files readable. */
import { GATE_ASKS } from '../safety';
import type { ActionNode, ExpectInput, GateItem, GateNode, GateWork, Option, Role, SafetyCardId } from '../types';

export const opt = (id: string, label: string, next: string): Option => ({ id, label, next });

export function leaf(
  id: string,
  title: string,
  text: string,
  steps: string[],
  remeasure: string,
  extra: Partial<Omit<ActionNode, 'id' | 'kind' | 'title' | 'text' | 'steps' | 'closing'>> = {},
): ActionNode {
  return { id, kind: 'action', title, text, steps, closing: { kind: 're-measure-and-record', what: remeasure }, ...extra };
}

/**
 * A gate in one line: what it guards decides what it asks (GATE_ASKS: lockout and discharge before covers-off
 * work; live-work authorisation and rated meters before energised work). `also` adds items, e.g. a permit.
 */
export function gate(
  id: string,
  guards: GateWork,
  roles: Role[],
  cards: SafetyCardId[],
  next: string,
  refuse: string,
  title: string,
  text: string,
  also: GateItem[] = [],
): GateNode {
  return { id, kind: 'gate', title, text, guards, roles, asks: [...GATE_ASKS[guards], ...also], cards, next, refuse };
}

/** Roles for user maintenance (source cleaning, filament change), and for work behind covers or on live parts. */
export const ANY_ROLE: Role[] = ['analyst', 'specialist', 'field-engineer', 'vacuum-engineer'];
export const USER_MAINTENANCE: Role[] = ['analyst', 'specialist', 'field-engineer'];
export const BEHIND_COVERS: Role[] = ['specialist', 'field-engineer', 'vacuum-engineer'];
export const LIVE_WORK: Role[] = ['field-engineer'];

/** Inputs shared by the nodes that compare an ion-gauge reading with the carrier gas load. */
export const CARRIER_INPUTS: ExpectInput[] = [
  { key: 'flow', label: 'Carrier flow into the MS', unit: 'mL/min', default: 1, min: 0, max: 50 },
  { key: 'pumpingSpeed', label: 'Effective pumping speed for the carrier gas', unit: 'L/s', default: 200, min: 0.01, max: 100000 },
  { key: 'relativeSensitivity', label: 'Ion-gauge sensitivity of the carrier relative to N2 (He 0.18, H2 0.43, N2 1.0)', unit: '1', default: 0.18, min: 0.05, max: 10 },
];

export const PRESSURE_FROM_READING: ExpectInput = { key: 'pressure', label: 'Pressure read', unit: 'mbar', min: 0, max: 2000, fromReading: true };

export const STOP_TEXT = 'Stop here. The step needs someone authorised, the maker’s procedure, the permit, PPE and a lockout plan.';

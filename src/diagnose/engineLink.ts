/** The engine functions the expectations registry calls: the engine's public face, nothing re-derived here. */
import {
  apparentMassShift,
  convertDc,
  convertRf,
  dcForMass,
  GAS_PRESETS,
  massForRf,
  meanFreePath,
  rfForMass,
  rfOnlyLowMassCutoff,
  scatteringAlongRods,
} from '../engine';
import type { EngineFace } from './expectations';

export const engineFace: EngineFace = {
  rfForMass,
  dcForMass,
  massForRf,
  rfOnlyLowMassCutoff,
  meanFreePath,
  scatteringAlongRods,
  apparentMassShift,
  convertRf,
  convertDc,
  airDiameter: GAS_PRESETS.air.diameter,
};

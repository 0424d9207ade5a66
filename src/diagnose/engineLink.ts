/**
 * The engine functions the expectations registry calls. Functions the engine does not provide yet throw a
 * plain sentence; the walker then asks the engineer to judge the reading and says why.
 */
import type { EngineFace } from './expectations';

const notYet = (name: string) => (): never => {
  throw new RangeError(`The engine's ${name} is not in this build yet, so no expected value can be computed here; judge the reading yourself.`);
};

export const engineFace: EngineFace = {
  rfForMass: notYet('rfForMass'),
  dcForMass: notYet('dcForMass'),
  massForRf: notYet('massForRf'),
  passBand: notYet('passBand'),
  meanFreePath: notYet('meanFreePath'),
};

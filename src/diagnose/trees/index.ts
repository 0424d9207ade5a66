import type { Tree, TreeId } from '../types';
import { entryTree } from './entry';
import { leakTree } from './leak';
import { massAxisTree } from './massAxis';
import { noiseTree } from './noise';
import { noSignalTree } from './noSignal';
import { peakShapeTree } from './peakShape';
import { sensitivityTree } from './sensitivity';
import { vacuumTree } from './vacuum';

/** Every tree, the shared entry first, then the symptom trees in work order. */
export const trees: Tree[] = [entryTree, vacuumTree, leakTree, noSignalTree, massAxisTree, peakShapeTree, sensitivityTree, noiseTree];

export function treeById(id: TreeId): Tree {
  const t = trees.find((x) => x.id === id);
  if (!t) throw new RangeError(`tree must be one of ${trees.map((x) => x.id).join(', ')}; got ${id}`);
  return t;
}

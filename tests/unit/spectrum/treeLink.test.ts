// The verdict names the peak-shape diagnosis tree by id; the spectrum module may not import the diagnosis module,
// so this test holds the two together.
import { describe, expect, it } from 'vitest';
import { trees } from '../../../src/diagnose/index';
import { PEAK_SHAPE_TREE_ID } from '../../../src/spectrum/index';

describe('verdict → diagnosis tree', () => {
  it('PEAK_SHAPE_TREE_ID is a shipped tree about peak shape', () => {
    const tree = trees.find((t) => t.id === PEAK_SHAPE_TREE_ID);
    expect(tree).toBeDefined();
    expect(tree!.title).toMatch(/peak shape/i);
  });
});

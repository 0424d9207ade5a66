// Point labels on the stability diagram: close ions (m/z 68, 69, 70 next to the apex in the whole-region view)
// must not write over each other or over the apex label.
import { describe, expect, it } from 'vitest';
import { placeLabels, type LabelBox } from '../../../src/ui/stability/diagramData';

function box(at: { x: number; y: number }, w: number, h: number): LabelBox {
  return { x: at.x, y: at.y - h, w, h };
}
function overlap(a: LabelBox, b: LabelBox): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

describe('placeLabels', () => {
  it('a lone point keeps the usual spot, below and to the right of its marker', () => {
    expect(placeLabels([{ x: 100, y: 100, r: 6, w: 14, h: 12 }])).toEqual([{ x: 109, y: 118 }]);
  });

  it('three ions a pixel apart beside the apex label get labels that overlap nothing, or none at all', () => {
    const apex: LabelBox = { x: 104, y: 86, w: 24, h: 12 };
    const pts = [69, 68, 70].map((mz, i) => ({ x: 100 + i, y: 100 - i, r: 6, w: 14, h: 12, mz }));
    const spots = placeLabels(pts, [apex]);
    expect(spots[0]).not.toBeNull(); // the set m/z (first) always keeps a label when a spot is free
    const boxes = spots.flatMap((s) => (s ? [box(s, 14, 12)] : []));
    expect(boxes.length).toBeGreaterThanOrEqual(2);
    for (let i = 0; i < boxes.length; i++) {
      expect(overlap(boxes[i], apex)).toBe(false);
      for (let j = i + 1; j < boxes.length; j++) expect(overlap(boxes[i], boxes[j])).toBe(false);
    }
  });

  it('gives up (null) rather than overlap when every spot is taken', () => {
    const wall: LabelBox = { x: 0, y: 0, w: 1000, h: 1000 };
    expect(placeLabels([{ x: 500, y: 500, r: 6, w: 14, h: 12 }], [wall])).toEqual([null]);
  });
});

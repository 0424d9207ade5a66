// @vitest-environment happy-dom
// A chart waiting for its data starts loading the chart library; when it cannot be loaded (a part not kept for
// offline use), it says so instead of staying busy without a word, and no longer holds the start-up.
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { describe, expect, it, vi } from 'vitest';
import { waitFor } from './appHarness';
import { startUpHeld } from '../../../src/ui/startUp';

vi.mock('uplot', () => {
  throw new Error('not kept on this device');
});

describe('a chart whose library cannot be loaded', () => {
  it('says so', async () => {
    // A canvas that can draw (happy-dom has none): the chart then tries to load the library.
    vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockImplementation((() => ({ font: '', fillText() {} })) as never);
    const { Chart } = await import('../../../src/ui/components/Chart');
    const root = document.createElement('div');
    document.body.appendChild(root);
    await act(async () => render(<Chart data={null} options={{ series: [{}, {}] }} label="The simulated peak is being computed" />, root));
    const notice = await waitFor(() => root.querySelector('.notice')?.textContent, 'the notice');
    expect(notice).toMatch(/^The chart could not be loaded on this device yet/);
    expect(startUpHeld()).toBe(false);
    render(null, root);
  });
});

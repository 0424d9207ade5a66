// @vitest-environment happy-dom
// A chart's reserved space starts loading the chart library; when it cannot be loaded (a part not kept for
// offline use), the space says so instead of staying busy without a word.
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { describe, expect, it, vi } from 'vitest';
import { waitFor } from './appHarness';

vi.mock('uplot', () => {
  throw new Error('not kept on this device');
});

describe('ChartReserve', () => {
  it('says the chart could not be loaded when the library fails to load', async () => {
    const { ChartReserve } = await import('../../../src/ui/components/Chart');
    const root = document.createElement('div');
    document.body.appendChild(root);
    await act(async () => render(<ChartReserve label="The simulated peak is being computed" />, root));
    const notice = await waitFor(() => root.querySelector('.notice')?.textContent, 'the notice');
    expect(notice).toMatch(/^The chart could not be loaded on this device yet/);
    render(null, root);
  });
});

// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { Later } from '../../../src/ui/components/Fold';
import { waitFor } from '../waitFor';

describe('Later (sections below the answer)', () => {
  it('draws the answer first and joins the sections below it a task later, without moving what was drawn', async () => {
    const host = document.createElement('div');
    document.body.appendChild(host);
    await act(async () => {
      render(<><p id="answer">answer</p><Later><p id="below">below</p></Later></>, host);
    });
    // First draw: the answer, and a marker where the sections will go.
    expect(host.querySelector('#answer')).not.toBeNull();
    expect(host.querySelector('#below')).toBeNull();
    expect(host.querySelector('[data-later]')).not.toBeNull();
    await waitFor(() => host.querySelector('#below'), 'the sections below the answer');
    expect(host.querySelector('[data-later]')).toBeNull();
    expect(host.firstElementChild?.id).toBe('answer');
    render(null, host);
    host.remove();
  });
});

// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import PartActions from '../../../src/components/parts/PartActions';
import type { TeamSettingsAnswer } from '../../../src/components/parts/team-settings-query';
import { DEFAULT_LIFE_LIMITS, DEFAULT_TEAM_SETTINGS } from '../../../src/lib/register/team-settings';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// The team keeps its own gear-set limit of 40, so the form can only show 40 if it read these settings.
const SETTINGS: TeamSettingsAnswer = {
  ...DEFAULT_TEAM_SETTINGS,
  lifeLimitRuns: { 'gear-set': 40 },
  lifeLimitDefaults: DEFAULT_LIFE_LIMITS,
};

/** A fetch that answers the settings and the new part, and records what was asked. */
function stubApi() {
  const calls: { method: string; path: string; body?: unknown }[] = [];
  const fetch = vi.fn(async (path: string, init?: RequestInit) => {
    const method = init?.method ?? 'GET';
    calls.push({ method, path, body: init?.body ? JSON.parse(String(init.body)) : undefined });
    if (path === '/api/team/settings') return new Response(JSON.stringify(SETTINGS), { status: 200 });
    if (path === '/api/parts' && method === 'POST')
      return new Response(JSON.stringify({ id: 'new part/1', kind: 'gear-set', serial: 'GS-9001' }), { status: 201 });
    return new Response('{}', { status: 404 });
  });
  vi.stubGlobal('fetch', fetch);
  return calls;
}

describe('the parts page’s actions', () => {
  it('shows only the button until it is pressed, then asks for the settings and loads the form', async () => {
    const calls = stubApi();
    const user = userEvent.setup();
    render(<PartActions onAdded={() => undefined} />);
    expect(screen.queryByLabelText('Serial')).toBeNull();
    expect(calls).toEqual([]);

    await user.click(screen.getByRole('button', { name: 'Add a part' }));
    expect(calls.map((c) => c.path)).toEqual(['/api/team/settings']);
    expect(await screen.findByLabelText('Serial')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Add a part' })).toBeTruthy();
    await vi.waitFor(() => expect(screen.getByLabelText<HTMLInputElement>('Life limit, in runs').value).toBe('40'));
    // The form read the request the button started; it did not ask again.
    expect(calls.filter((c) => c.path === '/api/team/settings')).toHaveLength(1);
  });

  it('closes the form on Cancel and offers the button again', async () => {
    stubApi();
    const user = userEvent.setup();
    render(<PartActions onAdded={() => undefined} />);
    await user.click(screen.getByRole('button', { name: 'Add a part' }));
    await user.click(await screen.findByRole('button', { name: 'Cancel' }));
    expect(screen.queryByLabelText('Serial')).toBeNull();
    expect(screen.getByRole('button', { name: 'Add a part' })).toBeTruthy();
  });

  it('sends the new part and then goes to the plain parts page that names it', async () => {
    const calls = stubApi();
    const onAdded = vi.fn();
    const user = userEvent.setup();
    render(<PartActions onAdded={onAdded} />);
    await user.click(screen.getByRole('button', { name: 'Add a part' }));
    await user.type(await screen.findByLabelText('Serial'), 'GS-9001');
    await user.type(screen.getByLabelText('Ring gear teeth'), '41');
    await user.type(screen.getByLabelText('Pinion teeth'), '10');
    await user.click(screen.getByRole('button', { name: 'Add the part' }));
    await vi.waitFor(() => expect(onAdded).toHaveBeenCalledWith('/parts?added=new+part%2F1'));
    expect(calls.find((c) => c.method === 'POST')).toMatchObject({
      path: '/api/parts',
      body: { kind: 'gear-set', serial: 'GS-9001', ringTeeth: 41, pinionTeeth: 10, lifeLimitRuns: 40 },
    });
  });
});

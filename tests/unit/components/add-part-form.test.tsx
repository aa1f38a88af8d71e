// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import AddPartForm from '../../../src/components/parts/AddPartForm';
import { SETTINGS_KEY, type TeamSettingsAnswer } from '../../../src/components/parts/team-settings-query';
import { DEFAULT_LIFE_LIMITS, DEFAULT_TEAM_SETTINGS } from '../../../src/lib/register/team-settings';

afterEach(cleanup);

function renderForm(lifeLimitRuns: TeamSettingsAnswer['lifeLimitRuns'] = {}) {
  const client = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity } } });
  client.setQueryData(SETTINGS_KEY, {
    ...DEFAULT_TEAM_SETTINGS,
    lifeLimitRuns,
    lifeLimitDefaults: DEFAULT_LIFE_LIMITS,
  } satisfies TeamSettingsAnswer);
  const onCreated = vi.fn();
  render(
    <QueryClientProvider client={client}>
      <AddPartForm onCreated={onCreated} onCancel={() => undefined} />
    </QueryClientProvider>,
  );
  return { user: userEvent.setup(), onCreated };
}
const limitInput = () => screen.getByLabelText<HTMLInputElement>('Life limit, in runs');

describe('the add-part form', () => {
  it('shows the ratio as the tooth counts are typed', async () => {
    const { user } = renderForm();
    await user.type(screen.getByLabelText('Ring gear teeth'), '41');
    await user.type(screen.getByLabelText('Pinion teeth'), '10');
    expect(screen.getByTestId('ratio').textContent).toBe('Ratio 41:10 → 4.10:1');
  });

  it('prefills the common-practice life limit for the kind and says where it comes from', async () => {
    const { user } = renderForm();
    expect(limitInput().value).toBe('50');
    expect(
      screen.getByText(/Common practice \(CP\): ring-and-pinion sets are often replaced after roughly 50 runs/),
    ).toBeTruthy();
    await user.selectOptions(screen.getByLabelText('Kind'), 'spindle');
    expect(limitInput().value).toBe('100');
    await user.selectOptions(screen.getByLabelText('Kind'), 'axle');
    expect(limitInput().value).toBe('');
  });

  it('prefers the team’s own limit, and keeps a limit typed by hand', async () => {
    const { user } = renderForm({ 'gear-set': 40 });
    expect(limitInput().value).toBe('40');
    expect(screen.getByText(/The team’s own limit for this kind/)).toBeTruthy();
    await user.clear(limitInput());
    await user.type(limitInput(), '45');
    await user.selectOptions(screen.getByLabelText('Kind'), 'spindle');
    expect(limitInput().value).toBe('45');
  });

  it('refuses with the shared schema’s messages before anything is sent', async () => {
    const { user, onCreated } = renderForm();
    await user.type(screen.getByLabelText('Ring gear teeth'), '9');
    await user.type(screen.getByLabelText('Pinion teeth'), '41');
    await user.click(screen.getByRole('button', { name: 'Add the part' }));
    expect(await screen.findByText('Enter the serial.')).toBeTruthy();
    expect(screen.getByText('The ring gear has more teeth than the pinion.')).toBeTruthy();
    expect(screen.getByLabelText('Serial').getAttribute('aria-invalid')).toBe('true');
    await user.clear(screen.getByLabelText('Pinion teeth'));
    await user.click(screen.getByRole('button', { name: 'Add the part' }));
    expect(await screen.findByText('A gear set needs its pinion tooth count.')).toBeTruthy();
    expect(onCreated).not.toHaveBeenCalled();
  });
});

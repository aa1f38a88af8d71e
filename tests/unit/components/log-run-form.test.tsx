// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { LogRunForm } from '../../../src/components/runs/LogRunForm';
import type { Answer } from '../../../src/components/shared/api';
import type { RunView } from '../../../src/lib/server/register/runs';
import { checkRunTime, runCreateSchema } from '../../../src/lib/register/schemas';
import { zodIssuesToFields, zodIssuesToMessage } from '../../../src/lib/validation';

afterEach(cleanup);

const CARS = [
  { id: 'c1', name: '714 Ember', carClass: 'Doorslammer' },
  { id: 'c2', name: '22 Blackwater', carClass: 'Altered' },
];

/** Answers as POST /api/runs does: the shared schema, then the time check, with the same error shape. */
async function answerAsTheEndpoint(body: Record<string, unknown>): Promise<Answer<RunView>> {
  const parsed = runCreateSchema.safeParse(body);
  if (!parsed.success)
    return {
      ok: false,
      problem: {
        status: 400,
        message: zodIssuesToMessage(parsed.error, 'body'),
        fields: zodIssuesToFields(parsed.error),
      },
    };
  const ahead = checkRunTime(parsed.data.at, new Date());
  if (ahead) return { ok: false, problem: { status: 400, message: `at: ${ahead}`, fields: { at: ahead } } };
  const run = parsed.data;
  return {
    ok: true,
    status: 201,
    data: {
      id: 'r1',
      carId: run.carId,
      at: run.at,
      event: run.event ?? null,
      round: run.round ?? null,
      lane: run.lane ?? null,
      notes: run.notes ?? null,
      elapsedSeconds: run.elapsedSeconds ?? null,
      speedMph: run.speedMph ?? null,
      recordedBy: 'u1',
      createdAt: run.at,
    },
  };
}

function renderForm() {
  const send = vi.fn(answerAsTheEndpoint);
  const onSaved = vi.fn();
  render(<LogRunForm cars={CARS} lastEvent="Dry Lake Autumn Invitational" send={send} onSaved={onSaved} />);
  return { user: userEvent.setup(), send, onSaved };
}

describe('the log-run form', () => {
  it('asks for the car before sending anything', async () => {
    const { user, send } = renderForm();
    await user.click(screen.getByRole('button', { name: 'Log run' }));
    expect(send).not.toHaveBeenCalled();
    expect(screen.getByText('Choose the car.')).toBeTruthy();
    expect(screen.getByRole('alert').textContent).toBe('One field needs fixing; see the message beside it.');
  });

  it('shows the schema’s message beside each measure it refuses', async () => {
    const { user, send } = renderForm();
    await user.click(screen.getByRole('radio', { name: /714 Ember/ }));
    await user.type(screen.getByLabelText(/ET, seconds/), 'fast');
    await user.type(screen.getByLabelText(/Speed, mph/), '0');
    await user.click(screen.getByRole('button', { name: 'Log run for 714 Ember' }));
    expect(send).toHaveBeenCalledTimes(1);
    const et = screen.getByLabelText(/ET, seconds/);
    const speed = screen.getByLabelText(/Speed, mph/);
    expect(await screen.findByText('Elapsed time must be a number.')).toBeTruthy();
    expect(screen.getByText('Speed must be more than 0.')).toBeTruthy();
    expect(et.getAttribute('aria-invalid')).toBe('true');
    expect(document.getElementById(et.getAttribute('aria-describedby')!.split(' ').at(-1)!)?.textContent).toBe(
      'Elapsed time must be a number.',
    );
    expect(speed.getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByRole('alert').textContent).toBe('2 fields need fixing; see the messages beside them.');
  });

  it('refuses a run time more than a day ahead', async () => {
    const { user } = renderForm();
    await user.click(screen.getByRole('radio', { name: /22 Blackwater/ }));
    fireEvent.change(screen.getByLabelText('Time of the run'), { target: { value: '2099-06-01T10:00' } });
    await user.click(screen.getByRole('button', { name: 'Log run for 22 Blackwater' }));
    expect(await screen.findByText('The run is more than a day in the future; check the date.')).toBeTruthy();
    expect(screen.getByLabelText('Time of the run').getAttribute('aria-invalid')).toBe('true');
  });

  it('says so when a time typed by hand is cleared', async () => {
    const { user, send } = renderForm();
    await user.click(screen.getByRole('radio', { name: /714 Ember/ }));
    fireEvent.change(screen.getByLabelText('Time of the run'), { target: { value: '' } });
    await user.click(screen.getByRole('button', { name: 'Log run for 714 Ember' }));
    expect(send).not.toHaveBeenCalled();
    expect(screen.getByText('Enter the date and time of the run, or tap Now.')).toBeTruthy();
  });

  it('logs a valid run with the prefilled event, reads a decimal comma, and starts the next one', async () => {
    const { user, send, onSaved } = renderForm();
    expect(screen.getByLabelText<HTMLInputElement>('Event').value).toBe('Dry Lake Autumn Invitational');
    await user.click(screen.getByRole('radio', { name: /714 Ember/ }));
    await user.click(screen.getByRole('button', { name: 'Q2' }));
    await user.click(screen.getByRole('button', { name: 'Left lane' }));
    await user.type(screen.getByLabelText(/ET, seconds/), '5,981');
    await user.type(screen.getByLabelText(/Speed, mph/), '248.6');
    const before = Date.now();
    await user.click(screen.getByRole('button', { name: 'Log run for 714 Ember' }));
    const body = send.mock.calls[0]![0];
    expect(body).toMatchObject({
      carId: 'c1',
      event: 'Dry Lake Autumn Invitational',
      round: 'Q2',
      lane: 'left',
      elapsedSeconds: 5.981,
      speedMph: 248.6,
    });
    // The time follows the clock: the moment it was sent.
    expect(Date.parse(String(body.at))).toBeGreaterThanOrEqual(before - 1000);
    expect(onSaved).toHaveBeenCalledTimes(1);
    expect((await screen.findByText(/Run logged for 714 Ember/)).textContent).toContain(
      'Every part in the car counts it.',
    );
    expect(screen.queryByRole('alert')).toBeNull();
    expect(screen.getByRole<HTMLInputElement>('radio', { name: /714 Ember/ }).checked).toBe(false);
    expect(screen.getByLabelText<HTMLInputElement>('Event').value).toBe('Dry Lake Autumn Invitational');
    expect(screen.getByLabelText<HTMLInputElement>(/ET, seconds/).value).toBe('');
  });
});

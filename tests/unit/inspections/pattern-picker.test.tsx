// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { movePattern, PatternPicker, type PatternValue } from '../../../src/components/inspections/PatternPicker';

afterEach(cleanup);

function Harness({ onChange }: { onChange: (v: PatternValue | null) => void }) {
  const [value, setValue] = useState<PatternValue | null>(null);
  return (
    <PatternPicker
      side="drive"
      value={value}
      onChange={(v) => {
        setValue(v);
        onChange(v);
      }}
    />
  );
}

describe('the pattern picker', () => {
  it('places the pattern in the middle on the first arrow key, then moves it in 5 % steps', () => {
    const onChange = vi.fn();
    render(<Harness onChange={onChange} />);
    const picker = screen.getByTestId('pattern-drive');
    expect(picker.getAttribute('tabindex')).toBe('0');
    picker.focus();
    fireEvent.keyDown(picker, { key: 'ArrowRight' });
    expect(onChange).toHaveBeenLastCalledWith({ along: 0.5, up: 0.5, length: 0.4 });
    fireEvent.keyDown(picker, { key: 'ArrowRight' });
    fireEvent.keyDown(picker, { key: 'ArrowRight' });
    fireEvent.keyDown(picker, { key: 'ArrowUp' });
    expect(onChange).toHaveBeenLastCalledWith({ along: 0.6, up: 0.55, length: 0.4 });
    expect(screen.getByTestId('pattern-drive-words').textContent).toContain(
      '60 % from toe to heel, 55 % from flank to face',
    );
  });

  it('moves in 1 % steps with Shift, stops at the ends of the tooth and clears with Delete', () => {
    const onChange = vi.fn();
    render(<Harness onChange={onChange} />);
    const picker = screen.getByTestId('pattern-drive');
    fireEvent.keyDown(picker, { key: 'ArrowLeft' });
    fireEvent.keyDown(picker, { key: 'ArrowDown', shiftKey: true });
    expect(onChange).toHaveBeenLastCalledWith({ along: 0.5, up: 0.49, length: 0.4 });
    for (let i = 0; i < 30; i++) fireEvent.keyDown(picker, { key: 'ArrowLeft' });
    expect(onChange.mock.lastCall![0].along).toBe(0);
    fireEvent.keyDown(picker, { key: 'Delete' });
    expect(onChange).toHaveBeenLastCalledWith(null);
    expect(screen.queryByTestId('pattern-drive-mark')).toBeNull();
  });

  it('ignores keys that do not move it, so Tab still leaves the picker', () => {
    expect(movePattern({ along: 0.5, up: 0.5 }, 'Tab', false)).toBeNull();
    expect(movePattern({ along: 0.5, up: 0.5 }, 'a', false)).toBeNull();
  });
});

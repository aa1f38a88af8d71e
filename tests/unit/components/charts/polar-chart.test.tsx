// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { PolarChart } from '../../../../src/components/charts/PolarChart';

afterEach(cleanup);

const one = {
  key: 'i1',
  name: '26 Oct 2026, run 44',
  readings: [0.009, 0.008, 0.007, 0.008],
  resolution: '0.001in' as const,
};

describe('PolarChart', () => {
  it('says what to do when nothing is read yet', () => {
    render(<PolarChart series={[{ ...one, readings: [null, null, null, null] }]} unit="in" />);
    expect(screen.getByTestId('polar-chart').getAttribute('data-state')).toBe('empty');
    expect(screen.getByTestId('polar-chart').textContent).toMatch(/read the lash at every marked position/);
  });

  it('is an image with a description that writes the tight spot and its angle', () => {
    render(<PolarChart series={[one]} unit="in" band={{ min: 0.005, max: 0.009 }} />);
    const svg = screen.getByRole('img');
    expect(svg.getAttribute('width')).toBe('400');
    expect(svg.getAttribute('height')).toBe('400');
    expect(svg.querySelector('desc')!.textContent).toMatch(/tight spot at 180° from the marked tooth/);
    expect(screen.getByTestId('polar-tight').textContent).toBe('tight 180°');
    expect(screen.getByTestId('polar-readout').textContent).toMatch(/tight spot at 180°/);
  });

  it('gives every position in a table', () => {
    render(<PolarChart series={[one]} unit="in" />);
    const table = screen.getByTestId('polar-table');
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(5);
    expect(rows[3]!.textContent).toBe('3180°0.007 in0.007 in');
  });

  it('writes a reading out when it is tapped', () => {
    render(<PolarChart series={[one]} unit="in" />);
    fireEvent.pointerDown(screen.getAllByTestId('polar-point')[1]!);
    expect(screen.getByTestId('polar-readout').textContent).toBe('Position 2 at 90°: 0.008 in');
  });

  it('overlays two inspections with a legend entry and a table each', () => {
    render(
      <PolarChart
        series={[one, { ...one, key: 'i2', name: 'Earlier', readings: [0.008, 0.008, 0.008, 0.008] }]}
        unit="in"
      />,
    );
    expect(screen.getByRole('list', { name: 'Legend' }).textContent).toContain('Earlier');
    expect(screen.getAllByTestId('polar-table')).toHaveLength(2);
    expect(screen.getAllByTestId('polar-curve')).toHaveLength(2);
  });
});

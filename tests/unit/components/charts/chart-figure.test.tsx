// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { ChartFigure } from '../../../../src/components/charts/ChartFigure';
import { shapeBacklashTrend } from '../../../../src/lib/charts/backlash-trend';
import { shapeRunoutTrend } from '../../../../src/lib/charts/measure-trends';
import { makeInput, RISING } from '../../../helpers/chart-fixtures';
import { stubResizeObserver } from './setup';

beforeAll(stubResizeObserver);
afterEach(cleanup);

describe('ChartFigure', () => {
  it('shows an empty state that says what to do, with the way to do it', () => {
    render(
      <ChartFigure
        shape={shapeBacklashTrend(makeInput([]))}
        height={320}
        width={600}
        action={{ href: '/inspections/new?gearSetId=set-1', label: 'Record an inspection' }}
      />,
    );
    expect(screen.getByTestId('empty-backlash-mean').textContent).toMatch(/Record the first teardown inspection/);
    expect(screen.getByRole('link', { name: 'Record an inspection' }).getAttribute('href')).toBe(
      '/inspections/new?gearSetId=set-1',
    );
    expect(document.querySelector('svg.recharts-surface')).toBeNull();
  });

  it('says what a sparse chart needs', () => {
    render(<ChartFigure shape={shapeBacklashTrend(makeInput([{ runs: 4, mean: 0.007 }]))} height={320} width={600} />);
    expect(screen.getByTestId('message-backlash-mean').textContent).toBe('Two more inspections give a projection.');
  });

  it('gives every point as a row of a table, each linking to its inspection', () => {
    render(<ChartFigure shape={shapeBacklashTrend(makeInput(RISING))} height={320} width={600} />);
    const table = screen.getByTestId('table-backlash-mean');
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(1 + RISING.length);
    expect(
      within(table)
        .getAllByRole('columnheader')
        .map((h) => h.textContent),
    ).toEqual(['Inspection', 'Runs', 'Mean', 'Min–max around the gear']);
    expect(within(rows[4]!).getByRole('link').getAttribute('href')).toBe('/inspections/insp-4');
    expect(rows[4]!.textContent).toContain('0.008 in');
  });

  it('draws the chart with a link per point, named in words', () => {
    render(<ChartFigure shape={shapeBacklashTrend(makeInput(RISING))} height={320} width={600} />);
    const points = screen.getAllByTestId('chart-point');
    expect(points).toHaveLength(RISING.length);
    expect(points[0]!.getAttribute('href')).toBe('/inspections/insp-1');
    expect(points[3]!.getAttribute('aria-label')).toMatch(
      /at run 30: mean 0\.008 in, 0\.008–0\.009 in around the gear\. Open the inspection\./,
    );
    // The loosest point meets the printed 0.009 in (S: GM 1996) at run 40; the mean is not projected.
    expect(screen.getByTestId('message-backlash-mean').textContent).toMatch(/about run 40/);
  });

  it('has a legend in shapes and words, and a column per series', () => {
    render(
      <ChartFigure
        shape={shapeRunoutTrend(
          makeInput([
            { runs: 0, mean: 0.007, runout: 0.001, estimate: 0.0014 },
            { runs: 9, mean: 0.007, runout: 0.002, estimate: 0.0018 },
          ]),
        )}
        height={240}
        width={500}
      />,
    );
    const legend = screen.getByRole('list', { name: 'Legend' });
    expect(legend.textContent).toContain('Measured at the back face');
    expect(legend.textContent).toContain('Estimated from the lash');
    expect(legend.textContent).toContain('limit 0.003 in');
    const headers = within(screen.getByTestId('table-runout'))
      .getAllByRole('columnheader')
      .map((h) => h.textContent);
    expect(headers).toEqual(['Inspection', 'Runs', 'Measured at the back face', 'Estimated from the lash']);
  });
});

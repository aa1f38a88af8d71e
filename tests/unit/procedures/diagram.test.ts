import { describe, expect, it } from 'vitest';
import { computeTighteningSequence } from '../../../src/lib/analysis/tightening-sequence';
import { FINAL_CHECK_PASS, MAKER_FIGURES_NOTICE } from '../../../src/lib/procedures/cautions';
import { drawTighteningDiagram, sequenceToPlaces } from '../../../src/lib/procedures/diagram';
import { groupToPassTorques } from '../../../src/lib/procedures/fasteners';

/** The bolt labels of a diagram as drawn: the number in each bolt's own <text>, with its position. */
function readBoltLabels(svg: string): { place: number; x: number; y: number }[] {
  return [...svg.matchAll(/<text class="bolt-place"[^>]*\bx="([-\d.]+)" y="([-\d.]+)">([^<]*)<\/text>/g)].map(
    (match) => ({ x: Number(match[1]), y: Number(match[2]), place: Number(match[3]) }),
  );
}

/** The clockwise angle from the top of the circle's centre, in [0, 2π). */
function clockwiseFromTop(x: number, y: number, cx: number, cy: number): number {
  const angle = Math.atan2(x - cx, -(y - cy));
  return angle < 0 ? angle + 2 * Math.PI : angle;
}

function circleCentre(svg: string): { cx: number; cy: number } {
  const match = /<circle cx="([\d.]+)" cy="([\d.]+)" r="[\d.]+" fill="none"/.exec(svg);
  if (!match) throw new Error('no bolt circle in the diagram');
  return { cx: Number(match[1]), cy: Number(match[2]) };
}

const passes = (count: number) =>
  groupToPassTorques(
    {
      count,
      torque: { value: 50, unit: 'lbf-ft' },
      torqueSource: 'test',
      passesPercent: [30, 70, 100],
      sequence: true,
    },
    'lbf-ft',
  );

describe('the tightening diagram', () => {
  it('labels 5 bolts 1, 4, 2, 5, 3 clockwise from the top', () => {
    const svg = drawTighteningDiagram({ count: 5, passes: passes(5) });
    const { cx, cy } = circleCentre(svg);
    const labels = readBoltLabels(svg).sort(
      (a, b) => clockwiseFromTop(a.x, a.y, cx, cy) - clockwiseFromTop(b.x, b.y, cx, cy),
    );
    expect(labels.map((label) => label.place)).toEqual([1, 4, 2, 5, 3]);
  });

  for (let count = 3; count <= 36; count++) {
    it(`draws ${count} bolts round the circle, labelled with the engine's order`, () => {
      const svg = drawTighteningDiagram({ count, passes: passes(count) });
      const { cx, cy } = circleCentre(svg);
      const labels = readBoltLabels(svg);
      expect(labels).toHaveLength(count);
      // Clockwise from the top, bolt k sits k-th; read its place, then the bolts by place.
      const clockwise = [...labels].sort(
        (a, b) => clockwiseFromTop(a.x, a.y, cx, cy) - clockwiseFromTop(b.x, b.y, cx, cy),
      );
      const angles = clockwise.map((label) => clockwiseFromTop(label.x, label.y, cx, cy));
      angles.forEach((angle, k) => expect(angle).toBeCloseTo((2 * Math.PI * k) / count, 2));
      const order = clockwise
        .map((label, k) => ({ bolt: k + 1, place: label.place }))
        .sort((a, b) => a.place - b.place)
        .map((entry) => entry.bolt);
      expect(order).toEqual([...computeTighteningSequence(count)]);
      expect(sequenceToPlaces(computeTighteningSequence(count))).toEqual(clockwise.map((label) => label.place));
    });
  }

  it('lists the passes with their torques, the final check pass and the maker’s-figures line', () => {
    const svg = drawTighteningDiagram({ count: 8, passes: passes(8) });
    expect(svg).toContain('Pass 1: 30 % (15 lbf·ft)');
    expect(svg).toContain('Pass 2: 70 % (35 lbf·ft)');
    expect(svg).toContain('Pass 3: 100 % (50 lbf·ft)');
    const words = [...svg.matchAll(/<text class="note">(.*?)<\/text>/g)]
      .map((m) => m[1]!.replace(/<tspan[^>]*>([^<]*)<\/tspan>/g, '$1 ').trim())
      .join('\n');
    expect(words.replace(/&apos;/g, '’')).toContain(FINAL_CHECK_PASS);
    expect(words).toContain(MAKER_FIGURES_NOTICE);
  });
});

import { computeTighteningSequence } from '../analysis/tightening-sequence';
import { FINAL_CHECK_PASS, MAKER_FIGURES_NOTICE } from './cautions';
import { formatTorque, type PassTorque } from './fasteners';

/**
 * The tightening diagram: the bolt circle seen from the bolt heads, bolt k (1…N) at its clockwise
 * position from the top, each labelled with its place in the engine's order. Black on white, with the
 * places as numbers, so it reads without colour and in print.
 */

export interface BoltMark {
  /** The bolt's clockwise position, 1 at the top. */
  bolt: number;
  /** Its place in the tightening order, 1 first. */
  place: number;
  x: number;
  y: number;
}

/**
 * Where bolt `bolt` of `count` sits on a circle of `radius` round (cx, cy): clockwise from the top.
 * @example boltPosition(1, 4, 100, 0, 0) // { x: 0, y: -100 }
 */
export function boltPosition(
  bolt: number,
  count: number,
  radius: number,
  cx: number,
  cy: number,
): { x: number; y: number } {
  const angle = (2 * Math.PI * (bolt - 1)) / count;
  return { x: round(cx + radius * Math.sin(angle)), y: round(cy - radius * Math.cos(angle)) };
}

/**
 * Each bolt's place in the order: places[k - 1] is the place of bolt k.
 * @example sequenceToPlaces([1, 3, 5, 2, 4]) // [1, 4, 2, 5, 3]
 */
export function sequenceToPlaces(sequence: readonly number[]): number[] {
  const places = new Array<number>(sequence.length);
  sequence.forEach((bolt, i) => (places[bolt - 1] = i + 1));
  return places;
}

/** The bolts of a circle of `count` with their places, laid out on a circle of `radius` round (cx, cy). */
export function layOutBolts(count: number, radius: number, cx: number, cy: number): BoltMark[] {
  const places = sequenceToPlaces(computeTighteningSequence(count));
  return places.map((place, i) => ({ bolt: i + 1, place, ...boltPosition(i + 1, count, radius, cx, cy) }));
}

/** The radius of a bolt's mark so that neighbours never touch. */
export function boltMarkRadius(count: number, circleRadius: number): number {
  return round(Math.min(20, ((Math.PI * circleRadius) / count) * 0.8));
}

const round = (value: number) => Math.round(value * 100) / 100;
const escapeXml = (value: string) =>
  value.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[c]!);

function wrap(line: string, width: number): string[] {
  const lines: string[] = [];
  let current = '';
  for (const word of line.split(' ')) {
    if (current && current.length + word.length + 1 > width) {
      lines.push(current);
      current = word;
    } else current = current ? `${current} ${word}` : word;
  }
  if (current) lines.push(current);
  return lines;
}

export interface DiagramInput {
  count: number;
  passes: readonly PassTorque[];
  /** Shown under the passes when the figures are the demo's invented ones. */
  exampleNotice?: string;
  title?: string;
}

const SIZE = 320;
const CIRCLE = 125;

/** The whole diagram as SVG text (image/svg+xml). */
export function drawTighteningDiagram(input: DiagramInput): string {
  const c = SIZE / 2;
  const markRadius = boltMarkRadius(input.count, CIRCLE);
  const fontSize = round(Math.max(9, Math.min(16, markRadius * 0.95)));
  const bolts = layOutBolts(input.count, CIRCLE, c, c);
  const side: string[] = [];
  if (input.title) side.push(input.title);
  side.push(`${input.count} bolts, cross order, bolt 1 at the top (thick ring), clockwise.`);
  input.passes.forEach((pass) =>
    side.push(
      `Pass ${pass.pass}: ${pass.percent} %${pass.value === null ? '' : ` (${formatTorque(pass.value, pass.unit)})`}`,
    ),
  );
  side.push(FINAL_CHECK_PASS);
  if (input.exampleNotice) side.push(input.exampleNotice);
  side.push(MAKER_FIGURES_NOTICE);
  const paragraphs = side.map((line) => wrap(line, 44));
  const lineCount = paragraphs.reduce((sum, lines) => sum + lines.length + 1, 0);
  const height = Math.max(SIZE, 24 + lineCount * 18);
  let y = 24;
  const notes = paragraphs.map((lines) => {
    // One <text> per paragraph, its lines as <tspan>s, so a sentence reads whole to a screen reader.
    const spans = lines.map(
      (line, i) => `<tspan x="${SIZE + 16}" ${i === 0 ? `y="${y}"` : 'dy="18"'}>${escapeXml(line)}</tspan>`,
    );
    y += (lines.length + 1) * 18;
    return `<text class="note">${spans.join('')}</text>`;
  });
  const parts = [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 720 ${height}" width="720" height="${height}" role="img" aria-labelledby="diagram-title">`,
    `<title id="diagram-title">Tightening order for ${input.count} bolts</title>`,
    `<rect width="720" height="${height}" fill="#fff"/>`,
    `<circle cx="${c}" cy="${c}" r="${CIRCLE}" fill="none" stroke="#000" stroke-width="1" stroke-dasharray="4 4"/>`,
    `<g font-family="sans-serif" font-size="${fontSize}" font-weight="700" text-anchor="middle" dominant-baseline="central">`,
    ...bolts.map(
      (b) =>
        `<circle cx="${b.x}" cy="${b.y}" r="${markRadius}" fill="#fff" stroke="#000" stroke-width="${b.bolt === 1 ? 4 : 2}"/>` +
        `<text class="bolt-place" data-bolt="${b.bolt}" x="${b.x}" y="${b.y}">${b.place}</text>`,
    ),
    '</g>',
    `<g font-family="sans-serif" font-size="14" fill="#000">`,
    ...notes,
    '</g>',
    '</svg>',
  ];
  return parts.filter(Boolean).join('\n');
}

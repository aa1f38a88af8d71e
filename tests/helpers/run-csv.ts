/** CSV text of `count` runs for the named cars, one a minute from `start`. */
export function makeRunCsv(cars: string[], count: number, start = Date.UTC(2026, 3, 1, 9)): string {
  const lines = ['car,at,event,round,lane,elapsed_seconds,speed_mph,notes'];
  for (let i = 0; i < count; i += 1) {
    const at = new Date(start + i * 60_000).toISOString();
    lines.push(
      `${cars[i % cars.length]},${at},Import Meet,Q${(i % 4) + 1},${i % 2 ? 'left' : 'right'},${(6 + (i % 50) / 100).toFixed(3)},${(220 + (i % 30)).toFixed(2)},"row ${i + 1}, imported"`,
    );
  }
  return `${lines.join('\n')}\n`;
}

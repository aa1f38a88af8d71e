import fc from 'fast-check';

/**
 * Hostile input for the fuzzer (tests/api/fuzz.test.ts): values of every wrong shape, JSON text a
 * serialiser would never write, path segments and query values. Pure generators, no I/O.
 */

export const HOSTILE_STRINGS = [
  'NaN',
  'Infinity',
  '-Infinity',
  '1e309',
  '-1e309',
  '0x1F',
  '1_000',
  ' 42 ',
  '',
  ' ',
  '\u0000',
  '\u0000\u0000abc',
  '\u202eevil\u202c',
  '\u200f\u05e9\u05dc\u05d5\u05dd',
  'a\u200db\u200cc',
  '\ufeffbom',
  '\ud800',
  '\udfff',
  'x\ud83d',
  '🏁'.repeat(500),
  'é'.normalize('NFD').repeat(300),
  'x'.repeat(100_000),
  '../../etc/passwd',
  '<script>alert(1)</script>',
  "' OR 1=1 --",
  '%00',
  '\r\nX-Injected: 1',
  '2026-13-45T25:61:61Z',
  '9999-12-31T23:59:59Z',
  '0000-00-00',
  '-0',
  'null',
  'true',
  '[]',
  '{}',
  '__proto__',
  'constructor',
];

export const HOSTILE_NUMBERS = [
  0,
  -0,
  1,
  -1,
  0.5,
  -0.5,
  1e308,
  -1e308,
  5e-324,
  Number.MAX_SAFE_INTEGER,
  Number.MAX_SAFE_INTEGER + 2,
  -Number.MAX_SAFE_INTEGER - 2,
  2 ** 63,
  2 ** 64,
  1e21,
  0.1 + 0.2,
  3,
  24,
  36,
  65_536,
  2_147_483_648,
];

/** Any value of a wrong (or, sometimes, right) type for a JSON field. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...HOSTILE_STRINGS) },
  { weight: 3, arbitrary: fc.constantFrom(...HOSTILE_NUMBERS) },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [null], [[]], { '': '' }) },
  { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', minLength: 200, maxLength: 2000 }) },
  { weight: 1, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.integer() },
  { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: fc.array(fc.oneof(fc.double(), fc.string(), fc.constant(null)), { maxLength: 40 }) },
);

/** Raw JSON number tokens JSON.stringify never writes. */
const RAW_NUMBERS = [
  '1e309',
  '-1e309',
  '1e-400',
  '123456789012345678901234567890',
  '-0',
  '0.0000000000000000000000001',
  '1E5',
  '-0.0e-0',
];

/** `depth` nested arrays or objects around `core`. */
export function deepNesting(depth: number, kind: 'array' | 'object', core = '1'): string {
  return kind === 'array'
    ? `${'['.repeat(depth)}${core}${']'.repeat(depth)}`
    : `${'{"a":'.repeat(depth)}${core}${'}'.repeat(depth)}`;
}

const stringify = (value: unknown) => JSON.stringify(value) ?? 'null';

/** Raw body text derived from a valid `template`: duplicate keys, odd number tokens, deep nesting, broken JSON. */
export function hostileText(template: Record<string, unknown>): fc.Arbitrary<string> {
  const keys = Object.keys(template);
  const key = keys.length ? fc.constantFrom(...keys) : fc.constant('a');
  const body = stringify(template).slice(1, -1);
  const join = (...parts: string[]) => `{${parts.filter(Boolean).join(',')}}`;
  return fc.oneof(
    // Duplicate keys: the hostile copy first (the valid one wins) or last (the hostile one wins).
    fc.tuple(key, hostileValue).map(([k, v]) => join(`${stringify(k)}:${stringify(v)}`, body)),
    fc.tuple(key, hostileValue).map(([k, v]) => join(body, `${stringify(k)}:${stringify(v)}`)),
    fc.tuple(key, fc.constantFrom(...RAW_NUMBERS)).map(([k, n]) => join(body, `${stringify(k)}:${n}`)),
    fc
      .tuple(key, fc.constantFrom(2000, 20_000))
      .map(([k, depth]) => join(body, `${stringify(k)}:${deepNesting(depth, 'array')}`)),
    fc.constantFrom(
      deepNesting(2000, 'array'),
      deepNesting(2000, 'object'),
      deepNesting(100_000, 'array'),
      deepNesting(50_000, 'object'),
    ),
    fc
      .tuple(key, fc.constantFrom('\\ud800', '\\udfff', '\\ud83d\\ude00\\ud800', '\\u0000', '\\u202e', '\\u200d'))
      .map(([k, escape]) => join(body, `${stringify(k)}:"${escape}"`)),
    fc.constant(join(body, '"__proto__":{"polluted":true}', '"constructor":{"prototype":{"polluted":true}}')),
    fc.constantFrom(
      '',
      '{',
      '}',
      'nul',
      '\ufeff{}',
      '{"a":1,}',
      "{'a':1}",
      'NaN',
      '[1,]',
      '\u0000',
      '"just a string"',
      '12',
      'null',
      '[]',
      `[${'0,'.repeat(100_000)}0]`,
    ),
  );
}

/** A valid `template` with one field replaced by a hostile value, removed, or wrapped in an array. */
export function mutatedBody(template: Record<string, unknown>): fc.Arbitrary<unknown> {
  const keys = [...Object.keys(template), 'unexpected', 'id', 'teamId'];
  return fc
    .tuple(fc.constantFrom(...keys), fc.constantFrom('set', 'set', 'set', 'delete', 'wrap'), hostileValue)
    .map(([key, op, value]) => {
      const copy: Record<string, unknown> = { ...template };
      if (op === 'delete') delete copy[key];
      else if (op === 'wrap') copy[key] = [copy[key]];
      else copy[key] = value;
      return copy;
    });
}

/** A path segment: a hostile string as well as the real ids the caller passes. */
export function pathSegment(real: string[]): fc.Arbitrary<string> {
  return fc.oneof(
    { weight: 2, arbitrary: fc.constantFrom(...real) },
    {
      weight: 2,
      arbitrary: fc.constantFrom(
        '',
        ' ',
        '..',
        '.',
        '%2e%2e',
        'a'.repeat(5000),
        '\u0000',
        '😀',
        "' OR '1'='1",
        'null',
        'undefined',
        '-1',
        '0',
        '1e309',
        'NaN',
        '__proto__',
        'constructor',
        'index',
        'x.csv',
      ),
    },
    { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 30 }) },
  );
}

/** A query string made of known parameter names (and some unknown ones) with hostile values. */
export function queryString(names: string[]): fc.Arbitrary<string> {
  const value = fc.oneof(
    fc.constantFrom(...HOSTILE_STRINGS.filter((s) => s.length < 1000)),
    fc.constantFrom(...HOSTILE_NUMBERS.map(String)),
    fc.string({ unit: 'binary', maxLength: 20 }),
  );
  return fc
    .array(fc.tuple(fc.constantFrom(...names, 'unknown', 'limit', 'cursor'), value), { maxLength: 4 })
    .map((pairs) =>
      pairs.length ? `?${pairs.map(([k, v]) => `${encodeComponent(k)}=${encodeComponent(v)}`).join('&')}` : '',
    );
}

/** encodeURIComponent, which throws on a lone surrogate: such a string goes as its well-formed version. */
export function encodeComponent(value: string): string {
  try {
    return encodeURIComponent(value);
  } catch {
    return encodeURIComponent(value.toWellFormed());
  }
}

/** Content types a client might send with a JSON body: mostly JSON, so that most requests reach the parsing. */
export const contentType = fc.oneof(
  {
    weight: 8,
    arbitrary: fc.constantFrom(
      'application/json',
      'application/json; charset=utf-8',
      'APPLICATION/JSON',
      'application/json; charset=utf-16',
    ),
  },
  {
    weight: 2,
    arbitrary: fc.constantFrom(
      'text/plain',
      'text/csv',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=x',
      '',
    ),
  },
);

/** Idempotency-Key values (what fetch lets through: tab, visible ASCII and U+0080–U+00FF; no control characters). */
export const idempotencyKey = fc
  .oneof(
    fc.uuid(),
    fc.constantFrom(
      '',
      ' ',
      'a'.repeat(201),
      'a'.repeat(200),
      'key with spaces',
      'ключ'.normalize(),
      '\u00ff\u00a0',
      '"quoted"',
    ),
    fc.string({ unit: 'binary-ascii', maxLength: 30 }),
  )
  .map((key) => key.replace(/[^\t\x20-\x7e\x80-\xff]/g, ''));

/**
 * Hostile values for the route fuzz tests (fast-check): extreme numbers, numbers JSON cannot
 * carry (sent as raw `1e999` text or as strings), wrong types, unicode, long strings, deep nesting
 * and long arrays within the limits, and mutations of a valid request body — a field replaced,
 * removed or added — so most requests are schema-shaped yet hostile and reach past the schema.
 */
import fc from 'fast-check';

/** Placeholder strings replaced by raw JSON number text that parses to ±Infinity (JSON.parse('1e999')). */
export const RAW_INFINITY = '\u0000fuzz:+1e999\u0000';
export const RAW_NEGATIVE_INFINITY = '\u0000fuzz:-1e999\u0000';

/** Placeholder for the stored scenario's latest revision, filled in when the request is sent (saves name their base revision). */
export const LATEST_REVISION = '\u0000fuzz:latest\u0000';

/** JSON text of a value, with the raw-infinity placeholders written as `1e999` / `-1e999` (and the latest revision, when known). */
export function hostileJsonText(value: unknown, latestRevision?: number): string {
  return JSON.stringify(value)
    .split(JSON.stringify(LATEST_REVISION)).join(latestRevision === undefined ? JSON.stringify(LATEST_REVISION) : String(latestRevision))
    .split(JSON.stringify(RAW_INFINITY)).join('1e999')
    .split(JSON.stringify(RAW_NEGATIVE_INFINITY)).join('-1e999');
}

/** Numbers at and beyond the edges: ±1e308, subnormals, zero, negatives, 2^53, tiny and huge. */
export const extremeNumber: fc.Arbitrary<number> = fc.constantFrom(
  1e308, -1e308, Number.MAX_VALUE, -Number.MAX_VALUE, 1e-320, -1e-320, Number.MIN_VALUE, 0, -0, -1, 1, 0.5,
  -1e-9, 1e-9, 2 ** 53, -(2 ** 53), 2 ** 31, -(2 ** 31) - 1, 1e16, -1e16, 3.2e9, 20_001, -20_001, 1e-13, 1e-14, 1.0000001,
);

/** Any hostile number: an extreme one, a raw infinity, or any finite double. */
export const hostileNumber: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: extremeNumber },
  { weight: 1, arbitrary: fc.constantFrom(RAW_INFINITY, RAW_NEGATIVE_INFINITY) },
  { weight: 2, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  { weight: 1, arbitrary: fc.integer() },
);

/** Strings a number field should never take, and other awkward text. */
export const hostileString: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e999', '-0', '0x10', '', ' ', '__proto__', 'constructor', '../../etc/passwd', '%00', '\u0000', '\u202e', '💧', 'Ω'.repeat(300), 'a'.repeat(5000)),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
);

/** A value nested `depth` deep in arrays or objects (the service refuses more than 64 levels). */
export const deepValue: fc.Arbitrary<unknown> = fc
  .tuple(fc.integer({ min: 1, max: 80 }), fc.boolean())
  .map(([depth, asArray]) => {
    let v: unknown = 1;
    for (let i = 0; i < depth; i++) v = asArray ? [v] : { a: v };
    return v;
  });

/** Any hostile JSON value: numbers, strings, wrong types, long arrays, deep nesting. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: hostileNumber },
  { weight: 3, arbitrary: hostileString },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [[]], JSON.parse('{"__proto__":{"polluted":1}}') as unknown, { constructor: { prototype: { polluted: 1 } } }) },
  { weight: 1, arbitrary: deepValue },
  { weight: 1, arbitrary: fc.array(hostileNumber, { maxLength: 5 }) },
  { weight: 1, arbitrary: fc.tuple(hostileNumber, fc.integer({ min: 2, max: 5000 })).map(([v, n]) => Array.from({ length: n }, () => v)) },
  { weight: 1, arbitrary: fc.dictionary(hostileString, hostileNumber, { maxKeys: 3 }) },
);

type Path = Array<string | number>;

/** Every path into a JSON value (the root excluded), and which of them hold numbers. */
function pathsOf(value: unknown, prefix: Path = [], out: { all: Path[]; numbers: Path[] } = { all: [], numbers: [] }) {
  if (Array.isArray(value)) value.forEach((v, i) => { out.all.push([...prefix, i]); if (typeof v === 'number') out.numbers.push([...prefix, i]); pathsOf(v, [...prefix, i], out); });
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) { out.all.push([...prefix, k]); if (typeof v === 'number') out.numbers.push([...prefix, k]); pathsOf(v, [...prefix, k], out); }
  return out;
}

/** One change to a body: at a path (index into its paths), replace, remove, or add a field/element beside it. */
interface Mutation {
  pick: number;
  numeric: boolean;
  op: 'replace' | 'scale' | 'remove' | 'add' | 'repeat';
  value: unknown;
  /** For 'scale': the factor a number is multiplied by (keeps most values in range, but far from usual). */
  factor: number;
  key: string;
}

const mutation: fc.Arbitrary<Mutation> = fc.record({
  pick: fc.nat(),
  numeric: fc.boolean(),
  op: fc.constantFrom('replace', 'replace', 'replace', 'scale', 'scale', 'scale', 'remove', 'add', 'repeat'),
  value: hostileValue,
  factor: fc.constantFrom(0, -1, 1e-9, 1e-6, 1e-3, 0.1, 0.5, 0.999999, 1.000001, 2, 10, 1e3, 1e6, 1e9),
  key: fc.oneof(fc.constantFrom('__proto__', 'constructor', 'extra', 'rate_m3_s', 'time_s', 'designOptions'), hostileString),
});

function applyMutation(body: unknown, mutation: Mutation): unknown {
  // A copy: generated values are shared between runs and a later change may land inside this one.
  const m = { ...mutation, value: structuredClone(mutation.value) };
  const { all, numbers } = pathsOf(body);
  const pool = (m.numeric || m.op === 'scale') && numbers.length > 0 ? numbers : all;
  if (pool.length === 0) return m.value;
  const path = pool[m.pick % pool.length]!;
  const parent = path.slice(0, -1).reduce<unknown>((node, k) => (node as Record<string | number, unknown>)[k], body) as Record<string | number, unknown> | unknown[];
  const last = path[path.length - 1]!;
  const current = (parent as Record<string | number, unknown>)[last];
  if (m.op === 'scale' && typeof current === 'number') (parent as Record<string | number, unknown>)[last] = current * m.factor;
  else if (m.op === 'scale' || m.op === 'replace' || (m.op === 'repeat' && !Array.isArray(parent))) (parent as Record<string | number, unknown>)[last] = m.value;
  else if (m.op === 'remove') {
    if (Array.isArray(parent)) parent.splice(Number(last), 1);
    else delete (parent as Record<string, unknown>)[last as string];
  } else if (m.op === 'repeat') {
    const list = parent as unknown[];
    list.push(...Array.from({ length: 50 }, () => structuredClone(list[Number(last)])));
  } else if (Array.isArray(parent)) parent.push(m.value);
  else Object.defineProperty(parent, m.key, { value: m.value, enumerable: true, writable: true, configurable: true });
  return body;
}

/** A valid body with one to four hostile changes (or none, or a wholly hostile value instead). */
export function mutatedBody(valid: () => unknown): fc.Arbitrary<unknown> {
  return fc.oneof(
    { weight: 8, arbitrary: mutation.map((m) => applyMutation(valid(), m)) },
    { weight: 3, arbitrary: fc.array(mutation, { minLength: 2, maxLength: 4 }).map((ms) => ms.reduce((b, m) => applyMutation(b, m), valid())) },
    { weight: 3, arbitrary: fc.constant(null).map(() => valid()) },
    { weight: 1, arbitrary: hostileValue },
  );
}

/** A hostile path segment: a value that fits, a wrong-shaped one, or encoded oddities. */
export function hostileSegment(fitting: readonly string[]): fc.Arbitrary<string> {
  return fc.oneof(
    { weight: 5, arbitrary: fc.constantFrom(...fitting) },
    { weight: 2, arbitrary: hostileString.map((s) => encodeURIComponent(s)) },
    { weight: 1, arbitrary: fc.constantFrom('%', '%zz', '%ff', '..', '.', '%2e%2e', 'a'.repeat(3000), '%00', '0', '-1', '1e3', '999999999', '1000000000', 'null') },
    { weight: 1, arbitrary: fc.stringMatching(/^[A-Za-z0-9_-]{1,50}$/) },
  );
}

/** A hostile query string (including none). */
export const hostileQuery: fc.Arbitrary<string> = fc.oneof(
  { weight: 2, arbitrary: fc.constant('') },
  { weight: 3, arbitrary: fc.dictionary(fc.constantFrom('limit', 'cursor', 'revision', 'format', 'x'), hostileSegment(['1', '50', '200', '201', '0', 'abc', 'WyIyMDI2IiwieCJd']), { maxKeys: 3 }).map((q) => `?${Object.entries(q).map(([k, v]) => `${k}=${v}`).join('&')}`) },
  { weight: 1, arbitrary: fc.constantFrom('?limit=1&limit=2', '?cursor=', '?revision=1&revision=2', '?%', '?a[b]=1', '?__proto__[x]=1') },
);

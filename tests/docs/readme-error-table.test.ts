/**
 * The README's error table and the one error table in code say the same thing: every code with
 * its HTTP status, and no code in the README that the code does not know.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ERROR_TABLE } from '../../shared/schema';

const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
const rows = [...readme.matchAll(/^\| `(DRYDIG_ERR_[A-Z_]+)` \| (\d{3}) \|/gm)].map((m) => ({ code: m[1]!, status: Number(m[2]) }));

describe('README error table', () => {
  it('lists every code of ERROR_TABLE with its status', () => {
    const documented = new Map(rows.map((r) => [r.code, r.status]));
    for (const [code, entry] of Object.entries(ERROR_TABLE)) expect([code, documented.get(code)]).toEqual([code, entry.status]);
  });
  it('lists no code that ERROR_TABLE does not have, and each once', () => {
    expect(rows.filter((r) => !(r.code in ERROR_TABLE))).toEqual([]);
    expect(new Set(rows.map((r) => r.code)).size).toBe(rows.length);
  });
  it('every DRYDIG_ERR_ code mentioned anywhere in the docs exists', () => {
    const docs = readme + readFileSync(new URL('../../docs/cli-and-api.md', import.meta.url), 'utf8');
    const mentioned = new Set([...docs.matchAll(/DRYDIG_ERR_[A-Z_]+/g)].map((m) => m[0]));
    expect([...mentioned].filter((c) => !(c in ERROR_TABLE))).toEqual([]);
  });
});

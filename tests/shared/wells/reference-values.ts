import { readFileSync } from 'node:fs';

/** One row of the committed mpmath reference (values parsed from 25-digit decimal strings). */
export interface ReferencePoint {
  readonly x: number;
  readonly value: number;
}

/** A Hantush reference row. `inBox` marks the tested box 1e−8 ≤ u ≤ 20, 1e−4 ≤ r/B ≤ 10. */
export interface HantushReferencePoint {
  readonly u: number;
  readonly rOverB: number;
  readonly value: number;
  readonly inBox: boolean;
}

interface ReferenceFile {
  versions: Record<string, string>;
  date_utc: string;
  e1: Array<[string, string]>;
  k0: Array<[string, string]>;
  hantush: Array<{ u: string; rOverB: string; W: string; inBox: boolean }>;
}

/**
 * Reads fixtures/reference/well-functions.json, written by scripts/reference/well-functions.py
 * (mpmath at 32 digits; versions and date inside the file, see fixtures/reference/README.md).
 */
export function loadWellFunctionReference(): {
  e1: ReferencePoint[];
  k0: ReferencePoint[];
  hantush: HantushReferencePoint[];
  versions: Record<string, string>;
} {
  const url = new URL('../../../fixtures/reference/well-functions.json', import.meta.url);
  const doc = JSON.parse(readFileSync(url, 'utf8')) as ReferenceFile;
  const pair = ([x, v]: [string, string]): ReferencePoint => ({ x: Number(x), value: Number(v) });
  return {
    e1: doc.e1.map(pair),
    k0: doc.k0.map(pair),
    hantush: doc.hantush.map((h) => ({
      u: Number(h.u),
      rOverB: Number(h.rOverB),
      value: Number(h.W),
      inBox: h.inBox,
    })),
    versions: doc.versions,
  };
}

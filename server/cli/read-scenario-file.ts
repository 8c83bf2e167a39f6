/**
 * Loading a scenario file for a command: read, parse JSON, validate against format v1. Each
 * failure is a DrydigError whose one-line message names the file and the place in it.
 */
import { readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { DrydigError, parseScenario, type Scenario } from '../../shared/schema';

/** Largest scenario file read, bytes (well above any real site; guards against reading a disk image by mistake). */
export const MAX_SCENARIO_FILE_BYTES = 64 * 1024 * 1024;

/** Reads a text file, turning every failure into DRYDIG_ERR_FILE naming it. */
export function readTextFile(file: string, cwd: string, what: string, maxBytes = MAX_SCENARIO_FILE_BYTES): string {
  const full = path.resolve(cwd, file);
  try {
    const stat = statSync(full);
    if (stat.isDirectory()) throw new DrydigError('DRYDIG_ERR_FILE', `${what} ${file} is a folder, not a file`);
    if (stat.size > maxBytes) throw new DrydigError('DRYDIG_ERR_FILE', `${what} ${file} is ${stat.size} bytes, more than the ${maxBytes}-byte limit`);
    return readFileSync(full, 'utf8');
  } catch (error) {
    if (error instanceof DrydigError) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'does not exist' : code === 'EACCES' ? 'cannot be read (permission denied)' : `cannot be read (${code ?? 'unknown error'})`;
    throw new DrydigError('DRYDIG_ERR_FILE', `${what} ${file} ${reason}`);
  }
}

/** "at position 123" in a JSON.parse message → "line 4, column 7". */
function locateJsonError(text: string, message: string): string {
  const lineCol = /line (\d+) column (\d+)/.exec(message);
  if (lineCol) return `line ${lineCol[1]}, column ${lineCol[2]}`;
  const position = /position (\d+)/.exec(message);
  if (!position) return text.trim() === '' ? 'the file is empty' : 'unexpected end of the document';
  const offset = Number(position[1]);
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  const column = offset - before.lastIndexOf('\n');
  return `line ${line}, column ${column}`;
}

/** Parses JSON text, or throws DRYDIG_ERR_MALFORMED_JSON naming the file, line and column. */
export function parseJsonText(text: string, label: string): unknown {
  try {
    return JSON.parse(text.replace(/^\uFEFF/, '')) as unknown;
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    throw new DrydigError('DRYDIG_ERR_MALFORMED_JSON', `${label} is not well-formed JSON (${locateJsonError(text, message)})`);
  }
}

/** Reads and validates a scenario file (format drydig.scenario v1). */
export function readScenarioFile(file: string, cwd: string): Scenario {
  const text = readTextFile(file, cwd, 'scenario file');
  const value = parseJsonText(text, file);
  return parseScenario(value);
}

/** Scenario warnings on stderr, one line each (`warning: /wells/3/x: …`), for outputs that cannot carry them (CSV). */
import type { ScenarioWarning } from '../../shared/schema';
import type { CliIo } from './cli-io';

export function writeWarnings(warnings: readonly ScenarioWarning[], io: CliIo): void {
  for (const w of warnings) io.stderr(`warning: ${w.path || '/'}: ${w.message}\n`);
}

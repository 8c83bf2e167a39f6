/**
 * The design result shown in the report and the site view. Wired to the design solver once its
 * public entry exists; until then nothing is attached and the report says so.
 */
import type { Scenario } from '../../shared/schema';
import type { DesignResult } from '../../shared/design/design-result';

/** Design result for a revision (by checksum), or null when none is available. */
export function designFor(_sha256: string, _scenario: Scenario): DesignResult | null {
  return null;
}

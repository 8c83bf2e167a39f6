/** Cautions that travel with every set of computed results (design.md section 7). */
export const RESULT_CAUTIONS: readonly string[] = [
  'Estimates from idealised models: a homogeneous, isotropic aquifer of uniform thickness, infinite except for the stated boundaries.',
  'A result with flags lies outside the comfortable validity of its method; read the flags before relying on the number.',
  'Confirm against site investigation and pumping-test data, local codes and a licensed engineer before using these numbers for a design, a bid or construction.',
];

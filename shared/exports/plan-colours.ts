/** The palette of the plan symbols: Okabe–Ito colours (safe for the common colour-vision deficiencies) and an ink. */
export const PLAN_COLOURS = {
  /** Lines, labels and deep wells. */
  ink: '#1d2730',
  /** Okabe–Ito orange: piezometer rings. */
  piezometer: '#e69f00',
  /** Okabe–Ito vermilion: water above target. */
  shortfall: '#d55e00',
  /** Okabe–Ito bluish green: target met. */
  met: '#009e73',
  /** Okabe–Ito blue: constant-head boundaries. */
  constantHead: '#0072b2',
  /** Brown: no-flow boundaries. */
  noFlow: '#6b5b45',
  /** Okabe–Ito sky blue: injection wells. */
  injection: '#56b4e9',
  /** Inactive wells. */
  inactive: '#d0d0d0',
  /** Purple: receptors (neighbours) not yet checked by a design. */
  receptor: '#7b3294',
} as const;

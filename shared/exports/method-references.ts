/** The published source of each method the engine reports in `ModelInfo.method`, for reports. */
import type { ModelInfo } from '../field/types';

/** Method → name and published reference. */
export const METHOD_REFERENCES: Readonly<Record<ModelInfo['method'], { name: string; reference: string }>> = {
  theis: { name: 'Theis (confined, transient)', reference: 'Theis, C.V. (1935) Trans. AGU 16; W(u) = E1(u), Abramowitz & Stegun (1964) ch. 5' },
  thiem: { name: 'Thiem (confined, steady)', reference: 'Thiem, G. (1906) Hydrologische Methoden' },
  'theis-unconfined': {
    name: 'Theis on the discharge potential with Jacob’s correction (unconfined, transient)',
    reference: 'Theis (1935); Jacob, C.E. (1944) correction; Kruseman & de Ridder (1994) ch. 3',
  },
  'dupuit-thiem': { name: 'Dupuit–Thiem (unconfined, steady)', reference: 'Dupuit, J. (1863); Thiem (1906)' },
  'hantush-jacob': { name: 'Hantush–Jacob (leaky, transient)', reference: 'Hantush, M.S. & Jacob, C.E. (1955) Trans. AGU 36' },
  'de-glee': { name: 'de Glee (leaky, steady)', reference: 'de Glee, G.J. (1930); K0 from Abramowitz & Stegun ch. 9' },
};

/** Further methods a design may rest on, for the assumptions list. */
export const SUPPORTING_REFERENCES: readonly string[] = [
  'Superposition in space and time; image wells for straight boundaries: Ferris, Knowles, Brown & Stallman (1962) USGS Water-Supply Paper 1536-E',
  'Radius of influence R = 3000·s·√K and well capacity q = 2π·r_w·h_w·√K/15: Sichardt (1928), as given in Powers et al. (2007) and Preene et al. (2016) CIRIA C750',
  'Groundwater lowered 0.5–1.0 m below formation; suction-lift well points to about 5–6 m below the header: trade practice, no single source',
];

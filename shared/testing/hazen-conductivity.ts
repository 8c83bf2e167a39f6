/**
 * Hazen's grain-size estimate of hydraulic conductivity (Hazen 1892, 1911, as reproduced in soil
 * mechanics and hydrogeology texts, e.g. Powers et al. 2007): k = C·d10², k in cm/s and d10 (the
 * grain size 10 % of the sample is finer than) in cm, C ≈ 100 (reported range about 40–150,
 * from memory of those texts). In SI with d10 in mm: K [m/s] = C·(d10 [mm])² × 1e-4.
 * Valid for clean, fairly uniform sands: 0.1 mm ≤ d10 ≤ 3 mm and uniformity coefficient
 * d60/d10 < 5; outside that it is flagged, not clamped.
 */

export interface HazenOptions {
  /** d10, mm. */
  d10_mm: number;
  /** Uniformity coefficient d60/d10 (−), when known. */
  uniformityCoefficient?: number;
  /** Hazen's C, (cm·s)⁻¹. Default 100. */
  coefficient?: number;
}

export interface HazenEstimate {
  conductivity_m_s: number;
  coefficient: number;
  /** True when d10 and Cu lie in the method's range. */
  valid: boolean;
  notes: string[];
}

/** K from d10 by Hazen's rule, with its validity. */
export function hazenConductivity({ d10_mm, uniformityCoefficient, coefficient = 100 }: HazenOptions): HazenEstimate {
  if (!(d10_mm > 0 && d10_mm <= 100)) throw new RangeError(`d10_mm must be > 0 and at most 100 mm, got ${d10_mm}`);
  if (!(coefficient >= 1 && coefficient <= 1000)) throw new RangeError(`coefficient must be within 1–1000, got ${coefficient}`);
  const notes: string[] = [];
  if (d10_mm < 0.1 || d10_mm > 3) notes.push(`d10 = ${d10_mm} mm is outside Hazen's range 0.1–3 mm: the estimate is not reliable.`);
  if (uniformityCoefficient !== undefined && uniformityCoefficient >= 5)
    notes.push(`Uniformity coefficient ${uniformityCoefficient} ≥ 5: Hazen's rule is for fairly uniform sands; the estimate is not reliable.`);
  notes.push('A grain-size estimate is an order-of-magnitude check beside a pumping test, not a replacement for it.');
  return { conductivity_m_s: coefficient * d10_mm * d10_mm * 1e-4, coefficient, valid: notes.length === 1, notes };
}

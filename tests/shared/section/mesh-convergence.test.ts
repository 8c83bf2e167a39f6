/**
 * Mesh convergence of the section solver on Harr's sheet pile (d/T = 0.5, q/(kH) = 1/2 exactly:
 * K(k′) = K(k) at k = sin(π/4); Harr 1962 ch. 5): nested meshes (every cell split 1, 2, 4 times
 * per side), observed order p = log₂((f₁ − f₂)/(f₂ − f₄)) and Richardson's extrapolation
 * f₄ + (f₄ − f₂)/(2ᵖ − 1) for the total flow and for the largest exit gradient.
 */
import { describe, expect, it } from 'vitest';
import { solveSectionDocument } from '../../../shared/section';
import { sheetPileSection } from './sheet-pile-section';

const observedOrder = (f: readonly number[]) => Math.log((f[0]! - f[1]!) / (f[1]! - f[2]!)) / Math.LN2;
const richardson = (f: readonly number[], p: number) => f[2]! + (f[2]! - f[1]!) / (2 ** p - 1);

describe('section mesh convergence (Richardson)', () => {
  const runs = [1, 2, 4].map((subdivide) =>
    solveSectionDocument(sheetPileSection({ thickness_m: 10, depth_m: 5, head_m: 1, halfWidth_m: 50, mesh: { maxSize_m: 1, minSize_m: 0.1, growth: 1.25, subdivide } }), { flowNet: false }));
  const flow = runs.map((r) => r.flow_m3_s_per_m! / 1e-4);
  const exit = runs.map((r) => r.exitGradient.max);

  it('converges monotonically in total flow at an observed order between 0.8 and 2.2 towards Harr’s 1/2', () => {
    const p = observedOrder(flow);
    expect(p).toBeGreaterThan(0.8);
    expect(p).toBeLessThan(2.2);
    const extrapolated = richardson(flow, p);
    expect(Math.abs(extrapolated - 0.5)).toBeLessThan(1e-3);
    expect(Math.abs(extrapolated - 0.5)).toBeLessThan(Math.abs(flow[2]! - 0.5));
  });

  it('converges monotonically in the exit gradient at an observed order between 0.8 and 2.2', () => {
    expect(exit[1]! > exit[0]! && exit[2]! > exit[1]!).toBe(true);
    const p = observedOrder(exit);
    expect(p).toBeGreaterThan(0.8);
    expect(p).toBeLessThan(2.2);
    // Extrapolated change beyond the finest mesh is small: the finest value is within 0.5 % of the limit.
    expect(Math.abs(richardson(exit, p) / exit[2]! - 1)).toBeLessThan(5e-3);
  });
});

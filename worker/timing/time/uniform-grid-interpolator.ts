/**
 * Lagrange interpolation of a smooth vector function of time on a uniform grid
 * of MJD nodes, computing each node lazily (once) the first time it is needed.
 *
 * Used where a slow routine (ERFA's TDB−TT series, the IAU 2006/2000A
 * precession–nutation matrix) varies smoothly over days: the routine runs at
 * the nodes only, and each instant costs one weighted sum.
 *
 * Notes:
 * 1. Nodes sit at MJD k·stepDays (k integer; stepDays a power of two so node
 *    times are exact binary numbers). An instant between nodes k and k+1 uses
 *    the `pointCount` nodes k − pointCount/2 + 1 … k + pointCount/2 (centred).
 * 2. The interpolation variable is formed from the integer day and the fraction
 *    separately, so it keeps ~1e-16 of a step.
 * Accuracy: depends on the function and the grid; each use states and tests it
 * (tests/engine/time/tdb-minus-tt.test.ts, tests/engine/geometry/observatory-gcrs.test.ts).
 * References: Abramowitz & Stegun 1964, 25.2.2 (Lagrange interpolation formula).
 */
import type { Mjd } from './epoch';

export type NodeFunction = (nodeMjd: number, out: Float64Array) => void;

export class UniformGridInterpolator {
  private readonly nodes = new Map<number, Float64Array>();
  private readonly weights: Float64Array;
  /** Inverse of ∏_{j≠i}(i − j) for the offsets i of a centred stencil (A&S 25.2.2 denominators). */
  private readonly denominators: Float64Array;

  /**
   * @param stepDays        node spacing in days (a power of two, e.g. 0.5, 1)
   * @param pointCount      number of nodes per interpolation, even (4 = cubic)
   * @param componentCount  length of the vector the node function writes
   * @param nodeFunction    evaluates the function at a node MJD
   */
  constructor(
    readonly stepDays: number,
    readonly pointCount: number,
    readonly componentCount: number,
    private readonly nodeFunction: NodeFunction,
  ) {
    if (pointCount < 2 || pointCount % 2 !== 0) throw new RangeError(`pointCount ${pointCount} must be even and ≥ 2`);
    this.weights = new Float64Array(pointCount);
    this.denominators = new Float64Array(pointCount);
    for (let i = 0; i < pointCount; i++) {
      let product = 1;
      for (let j = 0; j < pointCount; j++) if (j !== i) product *= i - j;
      this.denominators[i] = 1 / product;
    }
  }

  /** Number of nodes evaluated so far (for cost reports). */
  get evaluatedNodeCount(): number {
    return this.nodes.size;
  }

  private node(k: number): Float64Array {
    let value = this.nodes.get(k);
    if (value === undefined) {
      value = new Float64Array(this.componentCount);
      this.nodeFunction(k * this.stepDays, value);
      this.nodes.set(k, value);
    }
    return value;
  }

  /** Interpolated value at `t` written to out[0 … componentCount−1]. */
  evaluate(t: Mjd, out: Float64Array): void {
    const dayNodes = t.day / this.stepDays; // exact for power-of-two steps
    const baseNode = Math.floor(dayNodes);
    const x = dayNodes - baseNode + (t.frac[1] + t.frac[0]) / this.stepDays; // Note 2
    const shift = Math.floor(x);
    const first = baseNode + shift - this.pointCount / 2 + 1;
    const u = x - shift + this.pointCount / 2 - 1; // position within the stencil, in node units
    this.lagrangeWeights(u);
    out.fill(0, 0, this.componentCount);
    for (let i = 0; i < this.pointCount; i++) {
      const value = this.node(first + i);
      const w = this.weights[i];
      for (let c = 0; c < this.componentCount; c++) out[c] += w * value[c];
    }
  }

  /** Lagrange basis weights ℓᵢ(u) = ∏_{j≠i}(u − j)/(i − j) (A&S 25.2.2). */
  private lagrangeWeights(u: number): void {
    const n = this.pointCount;
    for (let i = 0; i < n; i++) {
      let product = this.denominators[i];
      for (let j = 0; j < n; j++) if (j !== i) product *= u - j;
      this.weights[i] = product;
    }
  }
}

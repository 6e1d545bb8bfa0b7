/**
 * Linear constraints x_i ⊕ x_j = c over GF(2), solved by union–find with parity. Used when bridgehead couplings
 * (perceive/bridges.ts) restrict the configurations, so that Burnside counting and the completion tests count
 * only configurations that can exist, and by the coupling search itself to keep its constraints consistent.
 */
export class ParityUnion {
  private parent: Int32Array;
  private rel: Uint8Array;
  /** false once a contradictory constraint was added. */
  consistent = true;
  /** Number of independent classes (each has two assignments). */
  classes: number;

  constructor(n: number) {
    this.parent = Int32Array.from({ length: n }, (_v, i) => i);
    this.rel = new Uint8Array(n);
    this.classes = n;
  }

  /** Root of x and the parity x ⊕ root. */
  private find(x: number): [number, number] {
    let p = 0;
    let r = x;
    while (this.parent[r] !== r) {
      p ^= this.rel[r];
      r = this.parent[r];
    }
    // path compression
    let y = x;
    let q = p;
    while (this.parent[y] !== y) {
      const next = this.parent[y];
      const step = this.rel[y];
      this.parent[y] = r;
      this.rel[y] = q;
      q ^= step;
      y = next;
    }
    return [r, p];
  }

  /** Adds x ⊕ y = c. */
  add(x: number, y: number, c: number): void {
    const [rx, px] = this.find(x);
    const [ry, py] = this.find(y);
    if (rx === ry) {
      if ((px ^ py) !== c) this.consistent = false;
      return;
    }
    this.parent[rx] = ry;
    this.rel[rx] = px ^ py ^ c;
    this.classes--;
  }
}

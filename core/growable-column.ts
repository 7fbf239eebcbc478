/** Small on purpose: a file may have a hundred thousand columns of three rows; doubling makes long columns cheap anyway. */
const INITIAL_CAPACITY = 16;

/** A Float64Array that grows by doubling as values are appended, trimmed when taken. */
export class GrowableColumn {
  private values = new Float64Array(INITIAL_CAPACITY);
  private count = 0;

  /** Values appended and not yet taken. */
  get length(): number {
    return this.count;
  }

  push(value: number): void {
    if (this.count === this.values.length) {
      const larger = new Float64Array(this.values.length * 2);
      larger.set(this.values);
      this.values = larger;
    }
    this.values[this.count++] = value;
  }

  /** The values appended so far, in an array of exactly that length. */
  toFloat64Array(): Float64Array {
    return this.values.slice(0, this.count);
  }

  /** Removes the first `count` values and returns them; the rest stay, first in line (streaming readers hand out whole rows this way). */
  take(count: number): Float64Array {
    if (count < 0 || count > this.count) throw new RangeError(`cannot take ${count} of ${this.count} values`);
    const taken = this.values.slice(0, count);
    this.values.copyWithin(0, count, this.count);
    this.count -= count;
    return taken;
  }
}

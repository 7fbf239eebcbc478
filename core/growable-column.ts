/** Small on purpose: a file may have a hundred thousand columns of three rows; doubling makes long columns cheap anyway. */
const INITIAL_CAPACITY = 16;

/** A Float64Array that grows by doubling as values are appended, trimmed when taken. */
export class GrowableColumn {
  private values = new Float64Array(INITIAL_CAPACITY);
  private count = 0;

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
}

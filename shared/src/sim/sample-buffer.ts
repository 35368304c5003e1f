/** Growable Float64Array for recorded waveforms. */
export class SampleBuffer {
  private data = new Float64Array(1024);
  length = 0;
  push(v: number): void {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }
  toArray(): Float64Array {
    return this.data.slice(0, this.length);
  }
}

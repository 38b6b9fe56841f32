// Type declarations for fft.js 4.0.4 (the package ships none): the parts this folder uses.
declare module 'fft.js' {
  export default class FFT {
    constructor(size: number);
    readonly size: number;
    createComplexArray(): number[];
    /** Forward transform X_k = Σ x_n e^{−2πikn/N}; arrays hold interleaved re, im. */
    transform(out: ArrayLike<number> & { [i: number]: number }, data: ArrayLike<number>): void;
    inverseTransform(out: ArrayLike<number> & { [i: number]: number }, data: ArrayLike<number>): void;
    realTransform(out: ArrayLike<number> & { [i: number]: number }, data: ArrayLike<number>): void;
    completeSpectrum(spectrum: ArrayLike<number> & { [i: number]: number }): void;
  }
}

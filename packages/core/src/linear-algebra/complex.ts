/** A complex number as a plain object, e.g. a pole `{ re: -1, im: 2 }`. */
export interface Complex {
  re: number;
  im: number;
}

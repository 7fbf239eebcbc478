/**
 * How the samples of one curve are written:
 * - `shortest`: the shortest text that reads back as exactly the same double (`String(x)`), the
 *   right choice for curves read from a file, whose values then come back unchanged;
 * - `decimals`: a fixed number of decimals (`toFixed`);
 * - `significant`: that many significant digits, trailing zeros dropped (for computed curves).
 * Very large or very small magnitudes may come out with an exponent (`1e-7`), which the reader accepts.
 */
export type LasNumberFormat =
  | { readonly kind: "shortest" }
  | { readonly kind: "decimals"; readonly decimals: number }
  | { readonly kind: "significant"; readonly digits: number };

export const SHORTEST: LasNumberFormat = { kind: "shortest" };

/** `value` as text in `format`; the caller writes the null value for non-finite samples. */
export const formatLasNumber = (value: number, format: LasNumberFormat): string => {
  switch (format.kind) {
    case "shortest":
      return String(value);
    case "decimals":
      return value.toFixed(format.decimals);
    case "significant":
      return String(Number(value.toPrecision(format.digits)));
  }
};

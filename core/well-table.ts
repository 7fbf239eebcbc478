/** A curve (column) of a well file, as its header describes it. */
export interface CurveInfo {
  /** Mnemonic as written, made unique within the file (a repeated `DT` becomes `DT`, `DT:2`, …). */
  mnemonic: string;
  /** Unit exactly as written in the file (`US/F`, `G/C3`, `` for none). */
  unit: string;
  description: string;
}

/**
 * A well's samples as columns, whatever file they came from.
 * Values are kept as read: a LAS null value (e.g. −999.25) stays in the column; an empty CSV cell is NaN.
 */
export interface WellTable {
  curves: CurveInfo[];
  /** One column per curve, all of the same length, in file order. */
  columns: Float64Array[];
  /** Value that marks an absent sample in this file, when the file declares one. */
  nullValue: number | undefined;
}

/** The null value of a file that declares none: the usual LAS ~Well NULL (common practice). */
export const USUAL_NULL_VALUE = -999.25;

/**
 * A column with its absent values (equal to `nullValue`, as input screening reads them) as NaN, so that an input
 * column (the depth too) is echoed and zoned like any absent value; the column itself when it holds none.
 */
export const absentAsNaN = (column: Float64Array, nullValue: number): Float64Array => {
  const first = column.indexOf(nullValue);
  if (first === -1) return column;
  const copy = column.slice();
  for (let i = first; i < copy.length; i++) if (copy[i] === nullValue) copy[i] = NaN;
  return copy;
};

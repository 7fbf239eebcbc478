import type { CalibrationRange } from "./calibration-range.js";
import type { Citation, Correlation, CorrelationKind, CorrelationOption, InputQuantity, Lithology } from "./correlation.js";
import type { OutputUnit, PublishedInputUnit, PublishedOutputUnit } from "./published-units.js";

/** A bound of a published range; null where the range is open on that side. */
export interface DescribedRange {
  min: number | null;
  max: number | null;
}

/** A catalogue entry as plain JSON data: no function, null where a value is absent. */
export interface CorrelationDescription {
  id: string;
  kind: CorrelationKind;
  lithology: Lithology;
  formula: string;
  inputs: { quantity: InputQuantity; symbol: string; unit: PublishedInputUnit; range: DescribedRange | null }[];
  options: CorrelationOption[];
  publishedOutputUnit: PublishedOutputUnit;
  outputUnit: OutputUnit;
  outputRange: DescribedRange | null;
  citation: Citation;
  compiledIn: Citation | null;
  caveats: string;
  empirical: true;
}

const finiteOrNull = (bound: number): number | null => (Number.isFinite(bound) ? bound : null);

const describeRange = (range: CalibrationRange | undefined): DescribedRange | null =>
  range === undefined ? null : { min: finiteOrNull(range.min), max: finiteOrNull(range.max) };

/** Describes an entry for the HTTP catalogue; JSON.stringify of the result loses nothing. */
export const describeCorrelation = (c: Correlation): CorrelationDescription => ({
  id: c.id,
  kind: c.kind,
  lithology: c.lithology,
  formula: c.formula,
  inputs: c.inputs.map((input) => ({
    quantity: input.quantity,
    symbol: input.symbol,
    unit: input.unit,
    range: describeRange(input.range),
  })),
  options: c.options.map((option) => ({ ...option })),
  publishedOutputUnit: c.publishedOutputUnit,
  outputUnit: c.outputUnit,
  outputRange: describeRange(c.outputRange),
  citation: { ...c.citation },
  compiledIn: c.compiledIn === undefined ? null : { ...c.compiledIn },
  caveats: c.caveats,
  empirical: c.empirical,
});

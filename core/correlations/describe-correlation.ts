import type { CalibrationRange } from "./calibration-range.js";
import type { Citation, Correlation, CorrelationKind, InputQuantity, Lithology } from "./correlation.js";
import { acceptsText, type OptionRange } from "./option-range.js";
import type { OutputUnit, PublishedInputUnit, PublishedOutputUnit } from "./published-units.js";

/** A bound of a published range; null where the range is open on that side. */
export interface DescribedRange {
  min: number | null;
  max: number | null;
}

/** An option's accepted range; null where a side is open (the value must still be finite). */
export interface DescribedOptionRange {
  min: number | null;
  minIncluded: boolean;
  max: number | null;
  maxIncluded: boolean;
}

export interface DescribedOption {
  name: string;
  unit: string;
  defaultValue: number;
  description: string;
  range: DescribedOptionRange;
  /** The option this one must stay below, for the lower bound of a pair; null otherwise. */
  below: string | null;
  /** The range and any pairing, in words, as the refusals say them. */
  accepts: string;
}

/** A catalogue entry as plain JSON data: no function, null where a value is absent. */
export interface CorrelationDescription {
  id: string;
  kind: CorrelationKind;
  lithology: Lithology;
  formula: string;
  inputs: { quantity: InputQuantity; symbol: string; unit: PublishedInputUnit; range: DescribedRange | null }[];
  options: DescribedOption[];
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

const describeOptionRange = (range: OptionRange): DescribedOptionRange => ({
  min: finiteOrNull(range.min),
  minIncluded: range.minIncluded,
  max: finiteOrNull(range.max),
  maxIncluded: range.maxIncluded,
});

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
  options: c.options.map((option) => ({
    name: option.name,
    unit: option.unit,
    defaultValue: option.defaultValue,
    description: option.description,
    range: describeOptionRange(option.accepted),
    below: option.below ?? null,
    accepts: acceptsText(option, c.options),
  })),
  publishedOutputUnit: c.publishedOutputUnit,
  outputUnit: c.outputUnit,
  outputRange: describeRange(c.outputRange),
  citation: { ...c.citation },
  compiledIn: c.compiledIn === undefined ? null : { ...c.compiledIn },
  caveats: c.caveats,
  empirical: c.empirical,
});

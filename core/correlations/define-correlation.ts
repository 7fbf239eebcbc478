import { InputIssues, type InputIssue } from "../input-issues.js";
import { requireEqualLengths } from "../numeric-column.js";
import { isOutsideRange, type CalibrationRange } from "./calibration-range.js";
import type { Correlation, CorrelationInputs, CorrelationOption, CorrelationOptions, CorrelationResult } from "./correlation.js";
import { isInOptionRange, optionRangeText, spanIssue } from "./option-range.js";
import { FROM_FIXED_UNIT, PUBLISHED_OUTPUT_UNITS } from "./published-units.js";

/** Resolved option values: every declared option, set by the request or defaulted. */
export type ResolvedOptions = Readonly<Record<string, number>>;

export interface CorrelationSpec
  extends Omit<Correlation, "evaluate" | "outputUnit" | "empirical" | "options" | "outputRange" | "compiledIn"> {
  readonly options?: readonly CorrelationOption[];
  readonly outputRange?: CalibrationRange;
  readonly compiledIn?: Correlation["compiledIn"];
  /** The published formula: `x[k]` is input k already in its published unit; returns publishedOutputUnit. */
  compute(x: Float64Array, options: ResolvedOptions): number;
  /** Calibration ranges that depend on the options, in input order; by default each input's `range`. */
  rangesFor?(options: ResolvedOptions): readonly (CalibrationRange | undefined)[];
}

const resolveOptions = (id: string, declared: readonly CorrelationOption[], given: CorrelationOptions): ResolvedOptions => {
  const resolved: Record<string, number> = {};
  for (const option of declared) resolved[option.name] = option.defaultValue;
  const issues: InputIssue[] = [];
  for (const [name, value] of Object.entries(given)) {
    if (value === undefined) continue;
    const option = declared.find((candidate) => candidate.name === name);
    if (option === undefined) {
      const known = declared.map((o) => o.name).join(", ");
      issues.push({ field: name, message: known === "" ? `${id} takes no options` : `is not an option of ${id} (options: ${known})` });
    } else if (!isInOptionRange(value, option.accepted)) {
      issues.push({ field: name, message: `must be ${optionRangeText(option.accepted, option.unit)}; got ${value}` });
    } else resolved[name] = value;
  }
  if (issues.length === 0) {
    for (const option of declared) {
      if (option.below === undefined) continue;
      const upper = declared.find((other) => other.name === option.below) as CorrelationOption;
      const bound = ({ name, unit, defaultValue }: CorrelationOption) => ({ name, unit, defaultValue, value: resolved[name], given: given[name] !== undefined });
      const issue = spanIssue(bound(option), bound(upper));
      if (issue !== undefined) issues.push(issue);
    }
  }
  if (issues.length > 0) throw new InputIssues(issues);
  return resolved;
};

/** A declaration the catalogue could not honour is a fault of the entry, found when the module loads. */
const checkDeclaredOptions = (id: string, declared: readonly CorrelationOption[]): void => {
  for (const option of declared) {
    const fault = !isInOptionRange(option.defaultValue, option.accepted)
      ? "its default lies outside its accepted range"
      : option.below !== undefined && !declared.some((other) => other.name === option.below)
        ? `it names an unknown option ${option.below}`
        : undefined;
    if (fault !== undefined) throw new Error(`${id}: option ${option.name} is declared wrongly: ${fault}`);
  }
  // The defaults themselves must satisfy every span.
  resolveOptions(id, declared, {});
};

const requireColumns = (spec: CorrelationSpec, inputs: CorrelationInputs): Float64Array[] => {
  const missing = spec.inputs.filter((input) => inputs[input.quantity] === undefined);
  if (missing.length > 0) {
    throw new InputIssues(missing.map((input) => ({ field: input.quantity, message: `is required by ${spec.id}` })));
  }
  const columns = spec.inputs.map((input) => inputs[input.quantity] as Float64Array);
  requireEqualLengths(Object.fromEntries(spec.inputs.map((input, k) => [input.quantity, columns[k]])));
  return columns;
};

/**
 * Builds a catalogue entry from its data and published formula. The entry's evaluate converts each input
 * from our fixed unit to the unit the source uses, applies the formula, converts the result to the reported
 * unit, and flags samples whose inputs or prediction fall outside the source's calibration ranges.
 */
export const defineCorrelation = (spec: CorrelationSpec): Correlation => {
  const { compute, rangesFor, ...data } = spec;
  const declaredOptions = spec.options ?? [];
  checkDeclaredOptions(spec.id, declaredOptions);
  const output = PUBLISHED_OUTPUT_UNITS[spec.publishedOutputUnit];
  const converters = spec.inputs.map((input) => FROM_FIXED_UNIT[input.unit]);
  return {
    ...data,
    options: declaredOptions,
    outputUnit: output.reportedAs,
    outputRange: spec.outputRange,
    compiledIn: spec.compiledIn,
    empirical: true,
    evaluate(inputs: CorrelationInputs, options: CorrelationOptions = {}): CorrelationResult {
      const resolved = resolveOptions(spec.id, declaredOptions, options);
      const columns = requireColumns(spec, inputs);
      const ranges = rangesFor?.(resolved) ?? spec.inputs.map((input) => input.range);
      const length = columns[0].length;
      const values = new Float64Array(length);
      const outsideCalibration = new Uint8Array(length);
      const x = new Float64Array(columns.length);
      for (let i = 0; i < length; i++) {
        let absent = false;
        let outside = false;
        for (let k = 0; k < columns.length; k++) {
          const value = converters[k](columns[k][i]);
          if (Number.isNaN(value)) absent = true;
          else if (isOutsideRange(value, ranges[k])) outside = true;
          x[k] = value;
        }
        if (absent) {
          values[i] = NaN;
          continue;
        }
        const predicted = compute(x, resolved) * output.factor;
        values[i] = predicted;
        if (outside || isOutsideRange(predicted, spec.outputRange)) outsideCalibration[i] = 1;
      }
      return { values, outsideCalibration };
    },
  };
};

import type { Correlation, CorrelationInputs, CorrelationOptions } from "./correlations/correlation.js";
import type { ElasticColumnsForCorrelations } from "./elastic-log.js";
import { InputIssues } from "./input-issues.js";
import { flagBit } from "./qc-flags.js";

/** A list of correlations and the samples it applies to (a whole request, or one zone). */
export interface CorrelationScope {
  /** 1 for the samples in scope; undefined for every sample. */
  members: Uint8Array | undefined;
  correlations: readonly Correlation[];
}

/** A correlation's predictions, row-aligned with the log; NaN outside its scopes or where an input is absent. */
export interface DerivedColumn {
  correlation: Correlation;
  values: Float64Array;
  outsideCalibration: Uint8Array;
}

const OUTSIDE_CALIBRATION = flagBit("outside_calibration");
const GIGAPASCAL = 1e9;

const needsStaticModulus = (correlation: Correlation) =>
  correlation.inputs.some((input) => input.quantity === "staticYoungsModulusPascals");

/** Evaluates one correlation; an issue with its options is named `correlation_options.<id>.<option>`. */
const evaluate = (correlation: Correlation, inputs: CorrelationInputs, options: Readonly<Record<string, CorrelationOptions>>) => {
  try {
    return correlation.evaluate(inputs, options[correlation.id]);
  } catch (error) {
    if (!(error instanceof InputIssues)) throw error;
    throw new InputIssues(error.issues.map((issue) => ({ ...issue, field: `correlation_options.${correlation.id}.${issue.field}` })));
  }
};

/**
 * Applies each scope's correlations to the log's SI columns. Within a scope, correlations that take a static
 * Young's modulus (UCS from E, brittleness) use the scope's first `static_e` correlation, so a zone can pair
 * its own static-modulus and strength correlations. Where scopes overlap, the later scope's values win on the
 * shared samples. Samples whose inputs lie outside a correlation's calibration range get `outside_calibration`.
 */
export const applyCorrelations = (
  scopes: readonly CorrelationScope[],
  inputs: ElasticColumnsForCorrelations,
  options: Readonly<Record<string, CorrelationOptions>>,
  flags: Uint32Array,
): Map<string, DerivedColumn> => {
  const length = flags.length;
  const derived = new Map<string, DerivedColumn>();
  scopes.forEach((scope, s) => {
    const staticSource = scope.correlations.find((correlation) => correlation.kind === "static_e");
    const missing = scope.correlations.filter((correlation) => needsStaticModulus(correlation) && staticSource === undefined);
    if (missing.length > 0) {
      throw new InputIssues(
        missing.map((correlation) => ({
          field: s === 0 ? "correlations" : `zones[${s - 1}].correlations`,
          message: `${correlation.id} takes a static Young's modulus: add a static_e correlation to the same list`,
        })),
      );
    }
    const staticModulus =
      staticSource && evaluate(staticSource, inputs, options).values.map((gigapascals) => gigapascals * GIGAPASCAL);
    for (const correlation of scope.correlations) {
      const result = evaluate(correlation, { ...inputs, staticYoungsModulusPascals: staticModulus }, options);
      let column = derived.get(correlation.id);
      if (column === undefined) {
        column = { correlation, values: new Float64Array(length).fill(NaN), outsideCalibration: new Uint8Array(length) };
        derived.set(correlation.id, column);
      }
      for (let i = 0; i < length; i++) {
        if (scope.members !== undefined && scope.members[i] === 0) continue;
        column.values[i] = result.values[i];
        column.outsideCalibration[i] = result.outsideCalibration[i];
      }
    }
  });
  for (const column of derived.values()) {
    for (let i = 0; i < length; i++) if (column.outsideCalibration[i] === 1) flags[i] |= OUTSIDE_CALIBRATION;
  }
  return derived;
};

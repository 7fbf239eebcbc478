import type { Correlation, CorrelationInputs, CorrelationOptions } from "./correlations/correlation.js";
import type { ElasticColumnsForCorrelations } from "./elastic-log.js";
import { isPhysical } from "./correlations/physical-domain.js";
import { InputIssues, type InputIssue } from "./input-issues.js";
import { flagBit } from "./qc-flags.js";

/** A list of correlations and the samples it applies to (a whole request, or one zone). */
export interface CorrelationScope {
  /** 1 for the samples in scope; undefined for every sample. */
  members: Uint8Array | undefined;
  correlations: readonly Correlation[];
  /** Where the list was given, for messages (`zones[2].correlations`); by default from the scope's position, zones after the request-wide list. */
  field?: string;
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

/**
 * Evaluates one correlation; an issue with its options is named `correlation_options.<id>.<option>`. A prediction
 * no rock can have (`PHYSICAL_DOMAIN`: a static modulus or strength at or below zero…) is no value: NaN, flagged
 * outside the correlation's calibration, so that nothing downstream (UCS from a static E) takes it as one.
 */
const evaluate = (correlation: Correlation, inputs: CorrelationInputs, options: Readonly<Record<string, CorrelationOptions>>) => {
  let result;
  try {
    result = correlation.evaluate(inputs, options[correlation.id]);
  } catch (error) {
    if (!(error instanceof InputIssues)) throw error;
    throw new InputIssues(error.issues.map((issue) => ({ ...issue, field: `correlation_options.${correlation.id}.${issue.field}` })));
  }
  const { values, outsideCalibration } = result;
  for (let i = 0; i < values.length; i++) {
    if (isPhysical(correlation.kind, values[i])) continue;
    values[i] = NaN;
    outsideCalibration[i] = 1;
  }
  return result;
};

const scopeField = (scopes: readonly CorrelationScope[], s: number): string =>
  scopes[s].field ?? (s === 0 ? "correlations" : `zones[${s - 1}].correlations`);

/** The zone a scope's list belongs to, as a message names it (`zones[2]`). */
const zoneName = (scopes: readonly CorrelationScope[], s: number): string => scopeField(scopes, s).replace(/\.correlations$/, "");

/** The one static_e correlation a scope's static-modulus consumers take (none without consumers), or the issue. */
const staticSourceOf = (scope: CorrelationScope, s: number, scopes: readonly CorrelationScope[]): { source: Correlation | undefined; issues: InputIssue[] } => {
  const consumers = scope.correlations.filter(needsStaticModulus);
  const sources = scope.correlations.filter((correlation) => correlation.kind === "static_e");
  if (consumers.length === 0) return { source: undefined, issues: [] };
  if (sources.length === 1) return { source: sources[0], issues: [] };
  if (sources.length === 0) {
    return {
      source: undefined,
      issues: consumers.map(({ id }) => ({ field: scopeField(scopes, s), message: `${id} takes a static Young's modulus: add a static_e correlation to the same list` })),
    };
  }
  const ids = (list: readonly Correlation[]) => list.map(({ id }) => id).join(", ");
  const message = `${ids(consumers)} ${consumers.length === 1 ? "takes" : "take"} a static Young's modulus, and this list names ${sources.length} static_e correlations (${ids(sources)}): keep one of them in this list, so that which one is used is not a guess`;
  return { source: undefined, issues: [{ field: scopeField(scopes, s), message }] };
};

/** Zones that share samples and would give one sample two values of a static-modulus consumer, from different static_e. */
const overlapIssues = (scopes: readonly CorrelationScope[], sources: readonly (Correlation | undefined)[]): InputIssue[] => {
  const issues: InputIssue[] = [];
  for (let s = 1; s < scopes.length; s++) {
    for (let t = 1; t < s; t++) {
      const [earlier, later] = [scopes[t], scopes[s]];
      if (sources[t] === undefined || sources[s] === undefined || sources[t] === sources[s]) continue;
      const shared = later.correlations.filter((correlation) => needsStaticModulus(correlation) && earlier.correlations.some(({ id }) => id === correlation.id));
      const overlap = earlier.members !== undefined && later.members !== undefined && earlier.members.some((member, i) => member === 1 && later.members?.[i] === 1);
      if (shared.length === 0 || !overlap) continue;
      issues.push({
        field: scopeField(scopes, s),
        message: `${zoneName(scopes, t)} and ${zoneName(scopes, s)} share samples, and both apply ${shared.map((correlation) => correlation.id).join(", ")} from different static_e correlations (${sources[t]?.id}, ${sources[s]?.id}): make the zones not overlap, or give them the same static_e`,
      });
    }
  }
  return issues;
};

/**
 * Applies each scope's correlations to the log's SI columns. Within a scope, correlations that take a static
 * Young's modulus (UCS from E, brittleness) use the scope's `static_e` correlation, which must be the only one
 * of its list, so a zone can pair its own static-modulus and strength correlations. Where scopes overlap, the
 * later scope's values win on the shared samples (a zone's over the request-wide list's); two zones that share
 * samples may not feed one consumer from different static_e. Samples whose inputs lie outside a correlation's
 * calibration range, or whose prediction no rock can have, get `outside_calibration`.
 */
export const applyCorrelations = (
  scopes: readonly CorrelationScope[],
  inputs: ElasticColumnsForCorrelations,
  options: Readonly<Record<string, CorrelationOptions>>,
  flags: Uint32Array,
): Map<string, DerivedColumn> => {
  const length = flags.length;
  const derived = new Map<string, DerivedColumn>();
  const checked = scopes.map(staticSourceOf);
  const issues = [...checked.flatMap(({ issues }) => issues)];
  const sources = checked.map(({ source }) => source);
  if (issues.length === 0) issues.push(...overlapIssues(scopes, sources));
  if (issues.length > 0) throw new InputIssues(issues);
  scopes.forEach((scope, s) => {
    const staticSource = sources[s];
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

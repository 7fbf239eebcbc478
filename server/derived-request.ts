import {
  applyCorrelations,
  findCorrelation,
  InputIssues,
  zoneMembership,
  type CorrelationScope,
  type DerivedColumn,
  type ElasticLog,
  type Zone,
} from "../core/index.js";
import { correlationsById } from "./derived-answer.js";
import { invalidFields, ProblemError } from "./problems.js";

export interface CorrelationRequest {
  /** Applied to every sample. */
  correlations?: readonly string[];
  /** Options per correlation id. */
  options?: Readonly<Record<string, Readonly<Record<string, number>>>>;
  /** Zones whose own lists apply to their samples only. */
  zones?: readonly (Zone & { correlations?: readonly string[] })[];
  depth?: Float64Array;
  /** Ids named by vs_from and rho_from: gap filling evaluates them without options. */
  gapFillIds?: readonly (string | undefined)[];
}

/**
 * Options for a correlation the request does not apply would be ignored without a word, and the caller would
 * believe the bounds they set were used: a 400 naming each such entry and the correlations that are applied.
 */
const refuseUnappliedOptions = (
  options: Readonly<Record<string, unknown>>,
  applied: readonly string[],
  gapFillIds: readonly (string | undefined)[],
  field: string,
): void => {
  const appliedText = applied.length === 0 ? "this request applies no correlation" : `this request applies ${applied.join(", ")}`;
  const reason = (id: string): string => {
    if (findCorrelation(id) === undefined) return `no correlation "${id}" in the catalogue (GET /v1/correlations lists them); ${appliedText}`;
    if (gapFillIds.includes(id)) return `vs_from and rho_from use ${id} as published, without options; remove its options (${appliedText})`;
    return `${id} is not applied, so its options would be ignored; ${appliedText}: add ${id} to correlations (or a zone's correlations), or remove its options`;
  };
  const errors = Object.keys(options)
    .filter((id) => !applied.includes(id))
    .map((id) => ({ field: `${field}.${id}`, message: reason(id) }));
  if (errors.length > 0) throw invalidFields(errors);
};

/**
 * The correlations a request asked for, evaluated on a computed log; undefined when none was asked.
 * `prefix` names where the request said it (`query`, `body`) for error messages.
 */
export const deriveProperties = (log: ElasticLog, request: CorrelationRequest, prefix: string): Map<string, DerivedColumn> | undefined => {
  const { depth, zones = [] } = request;
  const zonesWithLists = zones.map((zone, z) => ({ zone, z })).filter(({ zone }) => (zone.correlations?.length ?? 0) > 0);
  const scopes: CorrelationScope[] = [{ members: undefined, correlations: correlationsById(request.correlations ?? [], `${prefix}.correlations`) }];
  if (zonesWithLists.length > 0 && depth !== undefined) {
    const members = zoneMembership(depth, zones);
    for (const { zone, z } of zonesWithLists) {
      scopes.push({ members: members[z], correlations: correlationsById(zone.correlations ?? [], `${prefix}.zones[${z}].correlations`), field: `zones[${z}].correlations` });
    }
  }
  const applied = [...new Set(scopes.flatMap((scope) => scope.correlations.map((correlation) => correlation.id)))];
  refuseUnappliedOptions(request.options ?? {}, applied, request.gapFillIds ?? [], `${prefix}.correlation_options`);
  if ((request.correlations?.length ?? 0) === 0 && zonesWithLists.length === 0) return undefined;
  try {
    return applyCorrelations(scopes, log.si, request.options ?? {}, log.flags);
  } catch (error) {
    if (!(error instanceof InputIssues)) throw error;
    throw new ProblemError(
      "invalid-request",
      `The correlations cannot be applied as asked: ${error.message}.`,
      error.issues.map((issue) => ({ field: `${prefix}.${issue.field}`, message: issue.message })),
    );
  }
};

import {
  applyCorrelations,
  InputIssues,
  zoneMembership,
  type CorrelationScope,
  type DerivedColumn,
  type ElasticLog,
  type Zone,
} from "../core/index.js";
import { correlationsById } from "./derived-answer.js";
import { ProblemError } from "./problems.js";

export interface CorrelationRequest {
  /** Applied to every sample. */
  correlations?: readonly string[];
  /** Options per correlation id. */
  options?: Readonly<Record<string, Readonly<Record<string, number>>>>;
  /** Zones whose own lists apply to their samples only. */
  zones?: readonly (Zone & { correlations?: readonly string[] })[];
  depth?: Float64Array;
}

/**
 * The correlations a request asked for, evaluated on a computed log; undefined when none was asked.
 * `prefix` names where the request said it (`query`, `body`) for error messages.
 */
export const deriveProperties = (log: ElasticLog, request: CorrelationRequest, prefix: string): Map<string, DerivedColumn> | undefined => {
  const zonesWithLists = (request.zones ?? []).map((zone, z) => ({ zone, z })).filter(({ zone }) => (zone.correlations?.length ?? 0) > 0);
  if ((request.correlations?.length ?? 0) === 0 && zonesWithLists.length === 0) return undefined;
  const scopes: CorrelationScope[] = [{ members: undefined, correlations: correlationsById(request.correlations ?? [], `${prefix}.correlations`) }];
  if (zonesWithLists.length > 0 && request.depth !== undefined) {
    const members = zoneMembership(request.depth, request.zones ?? []);
    for (const { zone, z } of zonesWithLists) {
      scopes.push({ members: members[z], correlations: correlationsById(zone.correlations ?? [], `${prefix}.zones[${z}].correlations`) });
    }
  }
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

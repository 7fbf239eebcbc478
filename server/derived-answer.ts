import {
  describeCorrelation,
  findCorrelation,
  CORRELATIONS,
  type Citation,
  type Correlation,
  type DerivedColumn,
  type GapFill,
} from "../core/index.js";
import { ProblemError } from "./problems.js";
import { INPUT_QUANTITY_NAMES } from "./schemas/correlations.js";

/** Shown with every answer that carries static or strength estimates, and in the README and /docs. */
export const CAUTION =
  "Empirical estimates: each correlation was fitted to one basin and lithology and is valid only within its data; calibrate against core tests for the field at hand before use in fracture design, wellbore stability or sanding studies. Engineering decisions rest with licensed professionals under local regulations.";

export const citationText = (citation: Citation): string =>
  `${citation.authors} (${citation.year}). ${citation.title}. ${citation.source}.${citation.doi ? ` doi:${citation.doi}` : ""}`;

/** Correlations named by id, or a 400 problem naming the unknown ones and where to find the known ones. */
export const correlationsById = (ids: readonly string[], field: string): Correlation[] => {
  const unknown = ids.filter((id) => findCorrelation(id) === undefined);
  if (unknown.length > 0) {
    throw new ProblemError(
      "invalid-request",
      `Unknown correlation id${unknown.length > 1 ? "s" : ""} ${unknown.join(", ")}; GET /v1/correlations lists the catalogue.`,
      unknown.map((id) => ({ field, message: `no correlation "${id}"; known: ${CORRELATIONS.map((c) => c.id).join(", ")}` })),
    );
  }
  return [...new Set(ids)].map((id) => findCorrelation(id) as Correlation);
};

/** The gap filling a request asked for (vs_from, rho_from, fill), checked against the catalogue. */
export const gapFills = (
  request: { vs_from?: string; rho_from?: string; fill?: "nulls" | "all" },
  prefix: string,
): { fillShear?: GapFill; fillDensity?: GapFill } => {
  const one = (id: string | undefined, kind: "vs" | "density", field: string): GapFill | undefined => {
    if (id === undefined) return undefined;
    const [correlation] = correlationsById([id], `${prefix}.${field}`);
    if (correlation.kind !== kind) {
      throw new ProblemError("invalid-request", `${field} takes a ${kind} correlation; ${id} predicts ${correlation.kind}.`, [
        { field: `${prefix}.${field}`, message: `choose one of ${CORRELATIONS.filter((c) => c.kind === kind).map((c) => c.id).join(", ")}` },
      ]);
    }
    return { correlation, mode: request.fill ?? "nulls" };
  };
  if (request.fill !== undefined && request.vs_from === undefined && request.rho_from === undefined) {
    throw new ProblemError("invalid-request", `fill says which samples vs_from or rho_from fill, and neither is given: nothing would be filled.`, [
      { field: `${prefix}.fill`, message: "give vs_from or rho_from with it, or leave fill out" },
    ]);
  }
  return { fillShear: one(request.vs_from, "vs", "vs_from"), fillDensity: one(request.rho_from, "density", "rho_from") };
};

const base = (correlation: Correlation) => ({
  kind: correlation.kind,
  lithology: correlation.lithology,
  unit: correlation.outputUnit,
  empirical: true as const,
  formula: correlation.formula,
  source: citationText(correlation.citation),
});

/**
 * The parts of a JSON answer that rest on empirical correlations: the gap-fill correlations (`gapFillAnswer`), the
 * derived estimates, and the caution whenever either is there.
 */
export const empiricalParts = <Derived>(fills: ReturnType<typeof gapFillAnswer>, derived: Derived | undefined) => ({
  ...(fills && { fill_correlations: fills }),
  ...(derived !== undefined && { derived }),
  ...((fills !== undefined || derived !== undefined) && { caution: CAUTION }),
});

/**
 * `fill_correlations`: the empirical correlations that predict Vs (vs_from) or density (rho_from), labelled as
 * derived estimates are, with which samples they fill; undefined when the request fills nothing.
 */
export const gapFillAnswer = (request: { fillShear?: GapFill; fillDensity?: GapFill }) => {
  const entry = (fill: GapFill) => ({ id: fill.correlation.id, ...base(fill.correlation), fill: fill.mode });
  if (request.fillShear === undefined && request.fillDensity === undefined) return undefined;
  return {
    ...(request.fillShear && { vs: entry(request.fillShear) }),
    ...(request.fillDensity && { rho: entry(request.fillDensity) }),
  };
};

const nullable = (value: number): number | null => (Number.isNaN(value) ? null : value);

/** `derived` of a single-sample answer. */
export const derivedPointAnswer = (derived: Map<string, DerivedColumn>) =>
  Object.fromEntries(
    [...derived].map(([id, column]) => [
      id,
      { ...base(column.correlation), value: nullable(column.values[0]), outside_calibration: column.outsideCalibration[0] === 1 },
    ]),
  );

/** `derived` of a columns answer. */
export const derivedColumnsAnswer = (derived: Map<string, DerivedColumn>) =>
  Object.fromEntries(
    [...derived].map(([id, column]) => {
      const outside: number[] = [];
      column.outsideCalibration.forEach((flag, i) => flag === 1 && outside.push(i));
      return [id, { ...base(column.correlation), values: column.values, outside_calibration: outside }];
    }),
  );

/** A catalogue entry as the HTTP API writes it (snake_case). */
export const correlationEntry = (correlation: Correlation) => {
  const d = describeCorrelation(correlation);
  return {
    id: d.id,
    kind: d.kind,
    lithology: d.lithology,
    formula: d.formula,
    inputs: d.inputs.map((input) => ({ quantity: INPUT_QUANTITY_NAMES[input.quantity], symbol: input.symbol, unit: input.unit, calibration_range: input.range })),
    options: d.options.map((option) => ({
      name: option.name,
      unit: option.unit,
      default_value: option.defaultValue,
      description: option.description,
      range: { min: option.range.min, min_included: option.range.minIncluded, max: option.range.max, max_included: option.range.maxIncluded },
      below: option.below,
      accepts: option.accepts,
    })),
    published_output_unit: d.publishedOutputUnit,
    output_unit: d.outputUnit,
    output_range: d.outputRange,
    citation: d.citation,
    compiled_in: d.compiledIn,
    caveats: d.caveats,
    empirical: d.empirical,
  };
};

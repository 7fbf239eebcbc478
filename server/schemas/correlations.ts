import { z } from "zod";
import { CORRELATION_KINDS, LITHOLOGIES, MIN_RELATIVE_SPAN } from "../../core/index.js";

export const correlationKind = z.enum(CORRELATION_KINDS).meta({
  id: "CorrelationKind",
  description: "static_e: static Young's modulus (GPa); ucs: unconfined compressive strength (MPa); friction_angle (degrees); vs: shear velocity (m/s); density: bulk density (g/cm3); brittleness (%).",
});
export const lithology = z.enum(LITHOLOGIES).meta({ id: "Lithology", description: "Rock the correlation was fitted to." });

const range = z.object({ min: z.number().nullable(), max: z.number().nullable() }).nullable();
const citation = z
  .object({ authors: z.string(), year: z.int(), title: z.string(), source: z.string(), doi: z.string().optional() })
  .meta({ id: "Citation" });

export const correlationDescription = z
  .object({
    id: z.string().meta({ examples: ["ucs.mcnally1987"] }),
    kind: correlationKind,
    lithology,
    formula: z.string().meta({ description: "As published, in the source's units." }),
    inputs: z.array(
      z.object({
        quantity: z.string().meta({ description: "What the service passes: vp (from the sonic), density, dynamic or static Young's modulus, Poisson's ratio." }),
        symbol: z.string(),
        unit: z.string().meta({ description: "Unit of the symbol in the published formula; the service converts to it." }),
        calibration_range: range.meta({ description: "Range of the source's data for this input, in `unit`; null where none is published." }),
      }),
    ),
    options: z.array(
      z.object({
        name: z.string(),
        unit: z.string(),
        default_value: z.number(),
        description: z.string(),
        range: z
          .object({ min: z.number().nullable(), min_included: z.boolean(), max: z.number().nullable(), max_included: z.boolean() })
          .meta({ description: "Values a request may give, in `unit`; a null side is open (the value must still be finite). Anything else is a 400." }),
        below: z.string().nullable().meta({ description: `For the lower bound of a pair: the option it must stay below once defaults fill what the request leaves out, by at least ${MIN_RELATIVE_SPAN * 100} % of the largest in size of the two bounds and their defaults.` }),
        accepts: z.string().meta({ description: "The range and any pairing, in words." }),
      }),
    ),
    published_output_unit: z.string(),
    output_unit: z.string().meta({ description: "Unit of the values the service returns." }),
    output_range: range,
    citation,
    compiled_in: citation.nullable().meta({ description: "The compilation the formula was taken from, where it was." }),
    caveats: z.string(),
    empirical: z.literal(true),
  })
  .meta({ id: "Correlation", description: "A published empirical correlation. Every value it yields is an estimate, to be calibrated against core tests." });

export const correlationList = z
  .object({ count: z.int(), correlations: z.array(correlationDescription), caution: z.string() })
  .meta({ id: "CorrelationCatalogue" });

/** An enum query value in any case (`UCS`, `Shale`), read as the lower-case value the schema documents. */
const anyCase = <T extends z.ZodType>(schema: T) => z.preprocess((value) => (typeof value === "string" ? value.toLowerCase() : value), schema);

export const correlationFilter = z.strictObject({ kind: anyCase(correlationKind).optional(), lithology: anyCase(lithology).optional() });

/** GET /v1/correlations/{id} takes no query parameters: any is refused as unknown, as the list refuses its own. */
export const correlationQuery = z.strictObject({});

/** The first id given twice, if any. */
const repeatedId = (ids: readonly string[]): string | undefined => ids.find((id, i) => ids.indexOf(id) !== i);

export const correlationIds = z
  .array(z.string().min(1).max(80))
  .max(64)
  .superRefine((ids, context) => {
    const twice = repeatedId(ids);
    if (twice !== undefined) context.addIssue({ code: "custom", message: `names ${twice} twice: give each id once` });
  })
  .meta({ description: "Ids of catalogue correlations to apply (GET /v1/correlations lists them), e.g. [\"static_e.lacy1997_sandstone\", \"ucs.mcnally1987\"]." });

export const correlationOptions = z
  .record(z.string(), z.record(z.string(), z.number()))
  .meta({
    description:
      "Options per correlation id, e.g. {\"brittleness.rickman2008\": {\"e_min_mpsi\": 1, \"e_max_mpsi\": 8}}. Each id must be one the request applies (in correlations or a zone's correlations), each option one that correlation has, and each value within the option's range, with a lower bound below its upper bound (GET /v1/correlations/{id} lists the options and their ranges); anything else is a 400.",
  });

export const fillMode = z
  .enum(["nulls", "all"])
  .meta({ description: "With vs_from or rho_from: fill only the samples where the input is absent or unusable (nulls, default), or replace the whole curve (all)." });

const derivedBase = {
  kind: correlationKind,
  lithology,
  unit: z.string(),
  empirical: z.literal(true),
  formula: z.string(),
  source: z.string().meta({ description: "Full citation of the correlation." }),
};

const fillEntry = z.object({
  id: z.string(),
  ...derivedBase,
  fill: fillMode,
});

export const fillCorrelations = z
  .object({ vs: fillEntry.optional(), rho: fillEntry.optional() })
  .meta({
    id: "FillCorrelations",
    description: "The empirical correlations that predicted Vs (vs_from) and bulk density (rho_from); the samples they filled are flagged estimated_vs and estimated_rho.",
  });

export const derivedPoint = z
  .record(z.string(), z.object({ ...derivedBase, value: z.number().nullable(), outside_calibration: z.boolean() }))
  .meta({ id: "DerivedPoint", description: "Empirical estimates keyed by correlation id." });

export const derivedColumns = z
  .record(
    z.string(),
    z.object({
      ...derivedBase,
      values: z.array(z.number().nullable()).meta({ description: "One value per input row; null where an input is absent or the sample is outside every scope that lists this correlation." }),
      outside_calibration: z.array(z.int()).meta({ description: "Rows whose inputs or prediction lie outside the source's calibration range (values kept, flagged), and rows whose prediction no rock can have (a static modulus or strength at or below zero, a friction angle outside 0–90°: value null)." }),
    }),
  )
  .meta({ id: "DerivedColumns", description: "Empirical estimates keyed by correlation id, row-aligned with the input." });

/** The ids of a comma-separated list as written (`correlations=a, b`), each trimmed; the schema below refuses empty ones. */
export const correlationIdsOf = (text: string): string[] => text.split(",").map((id) => id.trim());

/**
 * A comma-separated list of correlation ids in a query string. An empty value, an empty entry (`a,,b`) or an id
 * given twice is refused rather than read as fewer ids, so that what was asked is what is answered.
 */
export const correlationIdText = () =>
  z
    .string()
    .max(2000)
    .superRefine((text, context) => {
      const ids = correlationIdsOf(text);
      const twice = repeatedId(ids);
      if (text.trim() === "") context.addIssue({ code: "custom", message: "is empty: give correlation ids separated by commas (GET /v1/correlations lists them), or leave the parameter out" });
      else if (ids.includes("")) context.addIssue({ code: "custom", message: `has an empty entry in ${JSON.stringify(text)}: separate the ids by single commas` });
      else if (twice !== undefined) context.addIssue({ code: "custom", message: `names ${twice} twice: give each id once` });
    });

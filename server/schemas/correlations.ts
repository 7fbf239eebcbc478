import { z } from "zod";
import { CORRELATION_KINDS, LITHOLOGIES, MIN_RELATIVE_SPAN, type InputQuantity } from "../../core/index.js";

export const correlationKind = z.enum(CORRELATION_KINDS).meta({
  id: "CorrelationKind",
  description: "static_e: static Young's modulus (GPa); ucs: unconfined compressive strength (MPa); friction_angle (degrees); vs: shear velocity (m/s); density: bulk density (g/cm3); brittleness (%).",
});
export const lithology = z.enum(LITHOLOGIES).meta({ id: "Lithology", description: "Rock the correlation was fitted to." });

const range = z.object({ min: z.number().nullable(), max: z.number().nullable() }).nullable();

/** The catalogue's name of each quantity core passes to a correlation (core's names carry our fixed SI units, not the source's). */
export const INPUT_QUANTITY_NAMES = {
  vpMetresPerSecond: "vp",
  densityKilogramsPerCubicMetre: "bulk_density",
  dynamicYoungsModulusPascals: "dynamic_youngs_modulus",
  staticYoungsModulusPascals: "static_youngs_modulus",
  poissonsRatio: "poissons_ratio",
} as const satisfies Readonly<Record<InputQuantity, string>>;

/** What a correlation's input is, by a unit-free name of the API's own; the unit is the input's `unit`. */
export const inputQuantity = z.enum(Object.values(INPUT_QUANTITY_NAMES)).meta({
  description:
    "What the service passes: vp (compressional velocity from the sonic; a source written in slowness Δt gets 1/Vp, so its unit may be a slowness), bulk_density (from the density log, or predicted by rho_from), dynamic_youngs_modulus (from the sonic and density logs), static_youngs_modulus (predicted by the static_e correlation of the same list), poissons_ratio (dynamic, from the sonic logs). The unit is in `unit`.",
});
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
        quantity: inputQuantity,
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

/** How `lithology=` matches, as the query parameter's description says it (core/correlations/lithology-match.ts). */
export const LITHOLOGY_FILTER_DESCRIPTION =
  "The rock to list correlations for, in any case: every correlation that applies to it. A rock (sandstone, shale, limestone, dolomite) gets the correlations fitted to it, to its group (sandstone and shale are clastic; limestone and dolomite are carbonate) and to any rock. A group (clastic, carbonate) gets those fitted to the group and to any rock, not those fitted to one of its members alone (a limestone correlation is not shown to hold for a dolomite): name the rock to see those too. any gets those fitted to any rock. The stiffness classes hard_rock and soft_rock (rocks of every type, split by their dynamic Young's modulus) are listed with every rock, group and any, since they apply whatever the type (a sample's calibration range tells which of the two holds); hard_rock or soft_rock gets its own and those fitted to any rock.";

export const correlationFilter = z.strictObject({
  kind: anyCase(correlationKind).optional(),
  // Inline rather than the Lithology component: the generated document drops a description beside a $ref.
  lithology: anyCase(z.enum(LITHOLOGIES)).optional().meta({ description: LITHOLOGY_FILTER_DESCRIPTION }),
});

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

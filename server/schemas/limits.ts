import { z } from "zod";
import { decimalNumber, queryNumber } from "./query-number.js";
import { DEFAULT_PLAUSIBILITY_LIMITS, withDefaultLimits, type PlausibilityLimits } from "../../core/index.js";
import { invalidFields, type ProblemFieldError } from "../problems.js";

const d = DEFAULT_PLAUSIBILITY_LIMITS;

const DESCRIPTIONS = {
  vp_min_m_s: ["Vp below this (m/s) is flagged vp_out_of_range.", d.vpMinMetresPerSecond],
  vp_max_m_s: ["Vp above this (m/s) is flagged vp_out_of_range.", d.vpMaxMetresPerSecond],
  vs_min_m_s: ["Vs below this (m/s) is flagged vs_out_of_range.", d.vsMinMetresPerSecond],
  vs_max_m_s: ["Vs above this (m/s) is flagged vs_out_of_range.", d.vsMaxMetresPerSecond],
  rho_min_g_cm3: ["Bulk density below this (g/cm3) is flagged density_out_of_range.", d.rhoMinGramsPerCubicCentimetre],
  rho_max_g_cm3: ["Bulk density above this (g/cm3) is flagged density_out_of_range.", d.rhoMaxGramsPerCubicCentimetre],
  vp_vs_max: ["Vp/Vs above this is flagged vp_vs_high.", d.vpVsMax],
} as const satisfies Record<string, readonly [string, number]>;


/**
 * Overrides of the plausibility ranges behind the `suspect` range flags. The same names serve as
 * query parameters (GET, and options of file and Arrow bodies) and as the `limits` object of a JSON body.
 */
const limitSchemas = <S extends z.ZodType>(number: () => S) =>
  Object.fromEntries(
    Object.entries(DESCRIPTIONS).map(([name, [description, fallback]]) => [name, number().optional().meta({ description: `${description} Default ${fallback}.` })]),
  ) as Record<keyof typeof DESCRIPTIONS, z.ZodOptional<S>>;

/** As query parameters: decimal text, an empty value is absent. */
export const limitFields = limitSchemas(() => queryNumber(decimalNumber().positive()));
/** Inside a JSON body: JSON numbers. */
export const bodyLimitFields = limitSchemas(() => z.number().positive());

export type LimitFields = { [K in keyof typeof limitFields]?: number };

export const limitsUsed = z
  .object({
    vp_min_m_s: z.number(),
    vp_max_m_s: z.number(),
    vs_min_m_s: z.number(),
    vs_max_m_s: z.number(),
    rho_min_g_cm3: z.number(),
    rho_max_g_cm3: z.number(),
    vp_vs_max: z.number(),
  })
  .meta({ id: "LimitsUsed", description: "The plausibility ranges applied to this request (defaults are common practice; see README)." });

export const toPlausibilityLimits = (fields: LimitFields): Partial<PlausibilityLimits> => ({
  vpMinMetresPerSecond: fields.vp_min_m_s,
  vpMaxMetresPerSecond: fields.vp_max_m_s,
  vsMinMetresPerSecond: fields.vs_min_m_s,
  vsMaxMetresPerSecond: fields.vs_max_m_s,
  rhoMinGramsPerCubicCentimetre: fields.rho_min_g_cm3,
  rhoMaxGramsPerCubicCentimetre: fields.rho_max_g_cm3,
  vpVsMax: fields.vp_vs_max,
});

export const fromPlausibilityLimits = (limits: PlausibilityLimits): z.infer<typeof limitsUsed> => ({
  vp_min_m_s: limits.vpMinMetresPerSecond,
  vp_max_m_s: limits.vpMaxMetresPerSecond,
  vs_min_m_s: limits.vsMinMetresPerSecond,
  vs_max_m_s: limits.vsMaxMetresPerSecond,
  rho_min_g_cm3: limits.rhoMinGramsPerCubicCentimetre,
  rho_max_g_cm3: limits.rhoMaxGramsPerCubicCentimetre,
  vp_vs_max: limits.vpVsMax,
});

/** Each range's lower and upper bound, by field name. */
const RANGES = [
  ["vp_min_m_s", "vp_max_m_s"],
  ["vs_min_m_s", "vs_max_m_s"],
  ["rho_min_g_cm3", "rho_max_g_cm3"],
] as const;

/**
 * The limits a request asked for, over the defaults, refusing (400) a range whose lower bound is not below its
 * upper bound after the merge (vp_min_m_s=8000 alone is above the default maximum of 7500): such a range would
 * flag every sample and describe itself as "8000–1000 m/s". `where` prefixes field names: `query` or `body.limits`.
 */
export const limitsFrom = (fields: LimitFields | undefined, where: string): PlausibilityLimits => {
  const limits = withDefaultLimits(toPlausibilityLimits(fields ?? {}));
  const used = fromPlausibilityLimits(limits);
  const errors: ProblemFieldError[] = [];
  for (const [min, max] of RANGES) {
    if (used[min] < used[max]) continue;
    const given = fields?.[min] === undefined ? max : min;
    errors.push({
      field: `${where}.${given}`,
      message: `${min} (${used[min]}${fields?.[min] === undefined ? ", the default" : ""}) must be below ${max} (${used[max]}${fields?.[max] === undefined ? ", the default" : ""})`,
    });
  }
  if (errors.length > 0) throw invalidFields(errors);
  return limits;
};

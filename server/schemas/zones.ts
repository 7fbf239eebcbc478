import { z } from "zod";
import { queryNumber } from "./query-number.js";

export const zoneSchema = z
  .strictObject({
    name: z.string().min(1).max(200).meta({ examples: ["Linnet Sand"] }),
    top: z.number().meta({ description: "Shallower bound, in the depth unit of the request or file." }),
    base: z.number().meta({ description: "Deeper bound; must be greater than top." }),
    correlations: z
      .array(z.string().min(1).max(80))
      .max(64)
      .optional()
      .meta({ description: "Correlations applied to this zone's samples only (lithology changes by formation); a static_e listed here feeds this zone's UCS and brittleness." }),
  })
  .meta({ id: "Zone", description: "A formation interval to summarise. A sample belongs to it when top <= depth < base, and at depth = base too unless another zone of the request starts there (contiguous zones share no sample; a lone zone keeps its base sample)." });

export const zoneList = z.array(zoneSchema).max(1000);

const statistic = z.number().nullable();

export const zoneSummarySchema = z
  .object({
    name: z.string(),
    top: z.number(),
    base: z.number(),
    count: z.int().meta({ description: "Samples whose depth lies in the zone." }),
    valid: z.int().meta({ description: "Samples in the zone with no invalidating flag." }),
    flagged_fraction: z.number().nullable().meta({ description: "Fraction of the zone's samples carrying any flag; null when the zone has no sample." }),
    properties: z
      .record(
        z.string(),
        z.object({
          count: z.int(),
          valid: z.int().meta({ description: "Samples of the zone with a value for this property." }),
          mean: statistic,
          min: statistic,
          p10: statistic,
          p50: statistic,
          p90: statistic,
          max: statistic,
        }),
      )
      .meta({ description: "Per property: statistics over the zone's valid samples (no invalidating flag; the echoed inputs vp, vs and rho too, so a sample flagged invalid counts in no statistic), percentiles by linear interpolation (Hyndman & Fan 1996 definition 7; p10 is the 10th percentile, the low value, not the high estimate of the reserves convention); null when there is none." }),
  })
  .meta({ id: "ZoneSummary" });

const depthNumber = queryNumber();

/** A zone's top or base as a decimal number (no hex, binary or octal, no blank), or why it is not one. */
const readDepth = (text: string): { value: number } | { error: string } => {
  if (text.trim() === "") return { error: "is empty" };
  const parsed = depthNumber.safeParse(text);
  return parsed.success ? { value: parsed.data } : { error: parsed.error.issues[0]?.message ?? "is not a decimal number" };
};

/**
 * Zones written compactly for a query string: `name:top:base` separated by `;`
 * (e.g. `Linnet_Sand:1522.4:1561.8;Sorrel_Shale:1561.8:1640.3`). Top and base are decimal numbers as any query
 * number is. An empty entry (`a:1:2;;b:3:4`) is refused rather than skipped; one trailing `;` ends the list.
 */
export const parseZonesText = (text: string): { zones: z.infer<typeof zoneList> } | { error: string } => {
  const zones: z.infer<typeof zoneList> = [];
  const entries = text.split(";");
  if (entries.length > 1 && entries[entries.length - 1].trim() === "") entries.pop();
  for (const [i, entry] of entries.entries()) {
    if (entry.trim() === "") return { error: `zone ${i + 1} is empty: separate the zones by single ; (one ; at the end is allowed)` };
    const parts = entry.split(":");
    const name = parts.slice(0, -2).join(":").trim();
    if (parts.length < 3 || name === "") return { error: `zone ${i + 1} ("${entry}") is not name:top:base` };
    const [top, base] = parts.slice(-2).map(readDepth);
    if ("error" in top) return { error: `zone ${i + 1} ("${entry}"): top ${top.error}` };
    if ("error" in base) return { error: `zone ${i + 1} ("${entry}"): base ${base.error}` };
    zones.push({ name, top: top.value, base: base.value });
  }
  return { zones };
};

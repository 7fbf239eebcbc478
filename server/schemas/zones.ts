import { z } from "zod";

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
  .meta({ id: "Zone", description: "A formation interval to summarise. A sample belongs to it when top <= depth < base (the deepest zone's base is inclusive when no other zone starts there)." });

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
      .meta({ description: "Per property: statistics over the zone's valid values (percentiles by linear interpolation, Hyndman & Fan 1996 definition 7); null when there is none." }),
  })
  .meta({ id: "ZoneSummary" });

/**
 * Zones written compactly for a query string: `name:top:base` separated by `;`
 * (e.g. `Linnet_Sand:1522.4:1561.8;Sorrel_Shale:1561.8:1640.3`).
 */
export const parseZonesText = (text: string): { zones: z.infer<typeof zoneList> } | { error: string } => {
  const zones: z.infer<typeof zoneList> = [];
  for (const [i, entry] of text.split(";").entries()) {
    if (entry.trim() === "") continue;
    const parts = entry.split(":");
    const [top, base] = parts.slice(-2).map((part) => (part.trim() === "" ? NaN : Number(part)));
    const name = parts.slice(0, -2).join(":").trim();
    if (parts.length < 3 || name === "" || !Number.isFinite(top) || !Number.isFinite(base)) {
      return { error: `zone ${i + 1} ("${entry}") is not name:top:base with numeric top and base` };
    }
    zones.push({ name, top, base });
  }
  return { zones };
};

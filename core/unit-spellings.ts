import type { DensityUnit, DepthUnit, SlownessUnit, VelocityUnit } from "./units.js";

/** A unit recognised from the way a file spells it, with the kind of quantity it measures. */
export type NormalisedUnit =
  | { kind: "velocity"; unit: VelocityUnit }
  | { kind: "slowness"; unit: SlownessUnit }
  | { kind: "density"; unit: DensityUnit }
  | { kind: "depth"; unit: DepthUnit };

export type UnitKind = NormalisedUnit["kind"];

/**
 * Spellings of each unit met in LAS and CSV files (common practice; the LAS standard leaves
 * unit mnemonics free). Matching ignores case, spaces, and µ (micro sign or Greek mu) versus u.
 */
const SPELLINGS: { [K in UnitKind]: Record<Extract<NormalisedUnit, { kind: K }>["unit"], readonly string[]> } = {
  velocity: {
    "m/s": ["m/s", "m/sec"],
    "km/s": ["km/s", "km/sec"],
    "ft/s": ["ft/s", "f/s", "ft/sec", "fps"],
  },
  slowness: {
    "us/ft": ["us/ft", "us/f", "usec/ft", "usec/f", "µs/ft", "µsec/ft"],
    "us/m": ["us/m", "usec/m", "µs/m", "µsec/m"],
  },
  density: {
    "g/cm3": ["g/cm3", "g/cc", "g/c3", "gm/cc", "gm/cm3", "gr/cc", "g/cm³"],
    "kg/m3": ["kg/m3", "k/m3", "kg/m³"],
  },
  depth: {
    m: ["m", "metre", "metres", "meter", "meters"],
    ft: ["ft", "f", "feet", "foot"],
  },
};

const key = (spelling: string): string => spelling.toLowerCase().replace(/[µμ]/g, "u").replace(/\s+/g, "");

const LOOKUP = new Map<string, NormalisedUnit>(
  (Object.keys(SPELLINGS) as UnitKind[]).flatMap((kind) =>
    Object.entries(SPELLINGS[kind]).flatMap(([unit, spellings]) =>
      spellings.map((spelling): [string, NormalisedUnit] => [key(spelling), { kind, unit } as NormalisedUnit]),
    ),
  ),
);

/** The unit a spelling such as `US/F`, `G/C3` or `FT` stands for; `undefined` when it is not one we know. */
export const normaliseUnit = (spelling: string): NormalisedUnit | undefined => LOOKUP.get(key(spelling));

/** Every spelling accepted for a kind of quantity, for error messages. */
export const acceptedSpellings = (kind: UnitKind): string[] => Object.values<readonly string[]>(SPELLINGS[kind]).flat();

import { rickman2008 } from "./brittleness.js";
import type { Correlation, CorrelationKind, Lithology } from "./correlation.js";
import { gardner1974 } from "./density.js";
import { appliesToLithology } from "./lithology-match.js";
import { lal1999 as lalFrictionAngle } from "./friction-angle.js";
import { castagna1985, greenberg1992Dolomite, greenberg1992Limestone, greenberg1992Sandstone, greenberg1992Shale, han1986 } from "./shear-velocity.js";
import * as staticYoungsModulus from "./static-youngs-modulus.js";
import { chang2006Dolomite, chang2006Limestone, golubev1976, militzer1973 } from "./ucs-carbonate.js";
import { bradford1998, mcnally1987 } from "./ucs-sandstone.js";
import { horsrud2001 as horsrudUcs, horsrud2001Modulus, lal1999 as lalUcs } from "./ucs-shale.js";

/** Every published correlation the service offers, grouped by kind. */
export const CORRELATIONS: readonly Correlation[] = Object.freeze([
  staticYoungsModulus.lacy1997,
  staticYoungsModulus.lacy1997Sandstone,
  staticYoungsModulus.lacy1997Shale,
  staticYoungsModulus.ohen2003,
  staticYoungsModulus.eissa1988,
  staticYoungsModulus.eissa1988Density,
  staticYoungsModulus.wang2000Hard,
  staticYoungsModulus.wang2000Soft,
  staticYoungsModulus.horsrud2001,
  mcnally1987,
  bradford1998,
  horsrudUcs,
  horsrud2001Modulus,
  lalUcs,
  militzer1973,
  golubev1976,
  chang2006Limestone,
  chang2006Dolomite,
  lalFrictionAngle,
  castagna1985,
  greenberg1992Sandstone,
  greenberg1992Limestone,
  greenberg1992Dolomite,
  greenberg1992Shale,
  han1986,
  gardner1974,
  rickman2008,
]);

const BY_ID = new Map(CORRELATIONS.map((correlation) => [correlation.id, correlation]));

export const findCorrelation = (id: string): Correlation | undefined => BY_ID.get(id);

/**
 * Entries of the given kind that apply to the given lithology (its own, its group's, `any`'s, and the stiffness
 * classes': see LITHOLOGIES_THAT_APPLY; either left out matches all), in catalogue order.
 */
export const filterCorrelations = (filter: { kind?: CorrelationKind; lithology?: Lithology } = {}): Correlation[] =>
  CORRELATIONS.filter(
    (correlation) =>
      (filter.kind === undefined || correlation.kind === filter.kind) &&
      (filter.lithology === undefined || appliesToLithology(correlation.lithology, filter.lithology)),
  );

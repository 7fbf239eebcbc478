export type CurveRole = "vp" | "vs" | "rho" | "depth";

/**
 * Mnemonics commonly given to each curve in LAS and CSV files (common practice), best-known
 * first: when several curves of a file fit one role, the earliest mnemonic here wins.
 */
export const CURVE_MNEMONICS: Readonly<Record<CurveRole, readonly string[]>> = {
  vp: ["DTC", "DTCO", "DT", "DTP", "DT4P", "AC", "VP", "PVEL"],
  vs: ["DTS", "DTSM", "DTSH", "DT4S", "VS", "SVEL"],
  rho: ["RHOB", "RHOZ", "DEN", "ZDEN", "RHO"],
  depth: ["DEPT", "DEPTH", "MD", "TDEP", "INDEX"],
};

/** The mnemonics above that name a velocity; the other sonic ones name a slowness. */
export const VELOCITY_MNEMONICS: ReadonlySet<string> = new Set(["VP", "PVEL", "VS", "SVEL"]);

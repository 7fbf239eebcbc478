import { FLAG_CODES, type FlagCode } from "./qc-flags.js";

export interface FlagSummary {
  count: number;
  /** Samples whose moduli were computed (no invalidating flag). */
  valid: number;
  /** Samples carrying each flag code; codes never raised are absent. */
  flags: Partial<Record<FlagCode, number>>;
}

/** Counts samples, valid samples and samples per flag code in one pass. */
export const summariseFlags = (flags: Uint32Array, invalidMask: number): FlagSummary => {
  const perBit = new Float64Array(FLAG_CODES.length);
  let valid = 0;
  for (let i = 0; i < flags.length; i++) {
    const mask = flags[i];
    if ((mask & invalidMask) === 0) valid++;
    for (let rest = mask, bit = 0; rest !== 0; rest >>>= 1, bit++) if (rest & 1) perBit[bit]++;
  }
  const counts: Partial<Record<FlagCode, number>> = {};
  FLAG_CODES.forEach((code, bit) => {
    if (perBit[bit] > 0) counts[code] = perBit[bit];
  });
  return { count: flags.length, valid, flags: counts };
};

export type Severity = "invalid" | "suspect";

export interface FlagDefinition {
  readonly code: FlagCode;
  /** Bit of this flag in a sample's flag mask. */
  readonly bit: number;
  /** Severity unless a request option changes it (see `vp_vs_below_sqrt2`). */
  readonly severity: Severity;
  /** What the flag means and what to check, in the words a log analyst uses. */
  readonly meaning: string;
}

export const FLAG_CODES = [
  "missing",
  "not_finite",
  "non_positive",
  "vs_not_below_vp",
  "negative_bulk_modulus",
  "vp_vs_below_sqrt2",
  "density_out_of_range",
  "vp_out_of_range",
  "vs_out_of_range",
  "vp_vs_high",
  "estimated_vs",
  "estimated_rho",
  "outside_calibration",
  "density_impossible",
] as const;
export type FlagCode = (typeof FLAG_CODES)[number];

const MEANINGS: Record<FlagCode, [Severity, string]> = {
  missing: ["invalid", "An input is absent, null, NaN or equal to the null value; nothing can be computed for this sample."],
  not_finite: [
    "invalid",
    "An input is infinite (for example a number too large for a 64-bit float, such as 1e309), or so large or so small (a velocity of 1e160 m/s, a slowness of 1e-320) that a velocity or a computed property is beyond a 64-bit float.",
  ],
  non_positive: [
    "invalid",
    "A velocity, slowness or density is zero or negative (a number too small for a 64-bit float, such as 1e-400, reads as zero), or a gap-filling correlation predicted one: no rock or fluid has that.",
  ],
  vs_not_below_vp: [
    "invalid",
    "Vs is not below Vp. A shear wave is always slower than a compressional wave in a solid: the shear pick is wrong or the curves are swapped.",
  ],
  negative_bulk_modulus: [
    "invalid",
    "Vp/Vs <= sqrt(4/3), so the bulk modulus K = rho*(Vp^2 - 4/3*Vs^2) <= 0: impossible for a stable solid; the shear arrival is almost certainly mispicked.",
  ],
  vp_vs_below_sqrt2: [
    "invalid",
    "Vp/Vs < sqrt(2), so Poisson's ratio is negative: implausible for rock and almost always a mispicked shear arrival. Invalid unless keep_negative_poisson is true, then suspect.",
  ],
  density_out_of_range: [
    "suspect",
    "Bulk density outside the range of common rocks and borehole fluids: check pad contact, washouts, barite mud or heavy minerals.",
  ],
  vp_out_of_range: [
    "suspect",
    "Vp outside the range of common rocks and borehole fluids: check for cycle skipping, noise or a wrong unit.",
  ],
  vs_out_of_range: [
    "suspect",
    "Vs outside the range of common rocks: check the shear pick and the unit.",
  ],
  vp_vs_high: [
    "suspect",
    "Vp/Vs above the configured maximum: unconsolidated sediment, or a shear arrival picked too late (Poisson's ratio near 0.5).",
  ],
  estimated_vs: [
    "suspect",
    "Vs was not measured here: it was predicted from Vp by the empirical correlation named in vs_from, and every value of this sample rests on that estimate.",
  ],
  estimated_rho: [
    "suspect",
    "Bulk density was not measured here: it was predicted from Vp by the empirical correlation named in rho_from, and every value of this sample rests on that estimate.",
  ],
  density_impossible: [
    "invalid",
    "Bulk density above 22.6 g/cm3 or below 0.1 g/cm3: no rock has it (osmium, the densest element, is about 22.6 g/cm3; the lightest rocks, such as pumice, are above 0.2 g/cm3). Almost always a unit mistake: a log in kg/m3 read as g/cm3, or the reverse; give the density unit.",
  ],
  outside_calibration: [
    "suspect",
    "An input (or the prediction) of an applied empirical correlation lies outside the range of the data the correlation was fitted on; its value is kept but is an extrapolation. Where the prediction is one no rock can have (a static modulus or strength at or below zero, a friction angle outside 0–90°), the value is null.",
  ],
};

export const FLAGS: readonly FlagDefinition[] = FLAG_CODES.map((code, bit) => ({
  code,
  bit,
  severity: MEANINGS[code][0],
  meaning: MEANINGS[code][1],
}));

export const flagBit = (code: FlagCode): number => 1 << FLAG_CODES.indexOf(code);

/** Flag codes whose bits are set in `mask`, in catalogue order. */
export const flagCodesOf = (mask: number): FlagCode[] =>
  FLAG_CODES.filter((_, bit) => (mask & (1 << bit)) !== 0);

/** Bits that make a sample invalid (moduli null) under the given options. */
export const invalidatingMask = (keepNegativePoisson: boolean): number =>
  FLAGS.reduce(
    (mask, flag) =>
      flag.severity === "invalid" && !(keepNegativePoisson && flag.code === "vp_vs_below_sqrt2")
        ? mask | (1 << flag.bit)
        : mask,
    0,
  );

export const severityOf = (code: FlagCode, invalidMask: number): Severity =>
  (invalidMask & flagBit(code)) !== 0 ? "invalid" : "suspect";

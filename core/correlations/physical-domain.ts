import type { CorrelationKind } from "./correlation.js";

/**
 * Values a rock can have, per kind of prediction, in the kind's reported unit (bounds excluded): a static
 * Young's modulus, a strength, a velocity or a density above zero, a friction angle between 0° and 90°.
 * A linear or power fit taken far from its data can predict outside them (a negative UCS for a very slow
 * rock); such a prediction is not a value but a sign that the correlation does not apply. Brittleness
 * indices are scaled percentages that a source may let run past 0–100 %, so they have no bound here.
 */
export const PHYSICAL_DOMAIN: Readonly<Record<CorrelationKind, { min: number; max: number } | undefined>> = {
  static_e: { min: 0, max: Infinity },
  ucs: { min: 0, max: Infinity },
  friction_angle: { min: 0, max: 90 },
  vs: { min: 0, max: Infinity },
  density: { min: 0, max: Infinity },
  brittleness: undefined,
};

/** True when a prediction of this kind is a value a rock can have; NaN (no prediction) counts as inside. */
export const isPhysical = (kind: CorrelationKind, value: number): boolean => {
  const domain = PHYSICAL_DOMAIN[kind];
  return domain === undefined || Number.isNaN(value) || (value > domain.min && value < domain.max);
};

import type { Lithology } from "./correlation.js";

/**
 * For each lithology a catalogue query may name, the lithology labels of the correlations that apply to it:
 * - a rock (sandstone, shale, limestone, dolomite): its own label, the group it belongs to (sandstones and shales
 *   are clastic rocks, limestones and dolomites carbonates: common practice), and `any`;
 * - a group (clastic, carbonate): the group and `any`, not its members: a correlation fitted to limestones alone is
 *   not shown to hold for dolomites, so it is not offered for a carbonate of unknown type (ask for the rock to see it);
 * - `any` (a rock of unknown type): `any` only.
 * The stiffness classes `hard_rock` and `soft_rock` split rocks of every type by stiffness (a dynamic modulus), not
 * by type: they are offered with every rock, group and `any` (which of the two holds for a sample is told by its
 * calibration range), and a query for one of them lists it and `any`.
 */
export const LITHOLOGIES_THAT_APPLY: Readonly<Record<Lithology, readonly Lithology[]>> = {
  any: ["any", "hard_rock", "soft_rock"],
  clastic: ["clastic", "any", "hard_rock", "soft_rock"],
  sandstone: ["sandstone", "clastic", "any", "hard_rock", "soft_rock"],
  shale: ["shale", "clastic", "any", "hard_rock", "soft_rock"],
  carbonate: ["carbonate", "any", "hard_rock", "soft_rock"],
  limestone: ["limestone", "carbonate", "any", "hard_rock", "soft_rock"],
  dolomite: ["dolomite", "carbonate", "any", "hard_rock", "soft_rock"],
  hard_rock: ["hard_rock", "any"],
  soft_rock: ["soft_rock", "any"],
};

/** Whether a correlation fitted to `fittedTo` applies to the rock a query names (see LITHOLOGIES_THAT_APPLY). */
export const appliesToLithology = (fittedTo: Lithology, rock: Lithology): boolean => LITHOLOGIES_THAT_APPLY[rock].includes(fittedTo);

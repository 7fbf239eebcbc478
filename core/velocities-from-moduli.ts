/**
 * Vp and Vs (m/s) of an isotropic solid from Young's modulus E (Pa), Poisson's ratio ν and
 * density ρ (kg/m3) (Mavko, Mukerji & Dvorkin, The Rock Physics Handbook, table 2.2.1):
 *   M = E(1 − ν) / ((1 + ν)(1 − 2ν)),  G = E / (2(1 + ν)),  Vp = √(M/ρ),  Vs = √(G/ρ).
 */
export const velocitiesFromModuli = (
  youngsModulusPascals: number,
  poissonsRatio: number,
  densityKilogramsPerCubicMetre: number,
): { vpMetresPerSecond: number; vsMetresPerSecond: number } => {
  const e = youngsModulusPascals;
  const nu = poissonsRatio;
  const pWave = (e * (1 - nu)) / ((1 + nu) * (1 - 2 * nu));
  const shear = e / (2 * (1 + nu));
  return {
    vpMetresPerSecond: Math.sqrt(pWave / densityKilogramsPerCubicMetre),
    vsMetresPerSecond: Math.sqrt(shear / densityKilogramsPerCubicMetre),
  };
};

/** Vp and Vs (m/s) from bulk modulus K (Pa), shear modulus G (Pa) and density (kg/m3): Vp = √((K + 4G/3)/ρ), Vs = √(G/ρ). */
export const velocitiesFromBulkAndShear = (
  bulkModulusPascals: number,
  shearModulusPascals: number,
  densityKilogramsPerCubicMetre: number,
): { vpMetresPerSecond: number; vsMetresPerSecond: number } => ({
  vpMetresPerSecond: Math.sqrt((bulkModulusPascals + (4 / 3) * shearModulusPascals) / densityKilogramsPerCubicMetre),
  vsMetresPerSecond: Math.sqrt(shearModulusPascals / densityKilogramsPerCubicMetre),
});

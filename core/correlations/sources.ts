import type { Citation } from "./correlation.js";

/** Publications cited by more than one entry, or by an entry and its caveats, each written once. */

export const LACY_1997: Citation = {
  authors: "Lacy, L. L.",
  year: 1997,
  title: "Dynamic rock mechanics testing for optimized fracture designs",
  source: "SPE Annual Technical Conference and Exhibition, San Antonio, paper SPE 38716",
  doi: "10.2118/38716-MS",
};

export const HORSRUD_2001: Citation = {
  authors: "Horsrud, P.",
  year: 2001,
  title: "Estimating mechanical properties of shale from empirical correlations",
  source: "SPE Drilling & Completion 16(2), 68–73",
  doi: "10.2118/56017-PA",
};

export const LAL_1999: Citation = {
  authors: "Lal, M.",
  year: 1999,
  title: "Shale stability: drilling fluid interaction and shale strength",
  source: "SPE Asia Pacific Oil and Gas Conference and Exhibition, Jakarta, paper SPE 54356",
  doi: "10.2118/54356-MS",
};

export const CHANG_2006: Citation = {
  authors: "Chang, C.; Zoback, M. D.; Khaksar, A.",
  year: 2006,
  title: "Empirical relations between rock strength and physical properties in sedimentary rocks",
  source: "Journal of Petroleum Science and Engineering 51(3–4), 223–237",
  doi: "10.1016/j.petrol.2006.01.003",
};

export const GREENBERG_CASTAGNA_1992: Citation = {
  authors: "Greenberg, M. L.; Castagna, J. P.",
  year: 1992,
  title: "Shear-wave velocity estimation in porous rocks: theoretical formulation, preliminary verification and applications",
  source: "Geophysical Prospecting 40(2), 195–209",
  doi: "10.1111/j.1365-2478.1992.tb00371.x",
};

/** A handbook that reproduces the Lacy, Ohen, Horsrud and McNally formulas; named in caveats as a check. */
export const ZHANG_2019_HANDBOOK = "Zhang, J. J. (2019), Applied Petroleum Geomechanics, Gulf Professional Publishing";
/** A handbook that reproduces the Chang et al. tables for shales and carbonates; named in caveats as a check. */
export const MAVKO_2009_HANDBOOK = "Mavko, G., Mukerji, T. & Dvorkin, J. (2009), The Rock Physics Handbook, 2nd ed., §7.14";

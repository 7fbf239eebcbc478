#!/usr/bin/env python3
"""Dynamic elastic moduli of a well from a CSV log, written the way a log analyst scripts it with numpy.

Usage: python3 bench/reference_numpy.py in.csv out.csv [significant_digits]

The input has a header row of NAME[unit] cells, the depth first, e.g.
DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]; an empty cell or -999.25 is a sample not logged.
The output has the depth and E, nu, G, K, lambda, M (GPa) and Vp/Vs, to 17 significant digits
(every double exactly) unless fewer are asked for (the benchmark asks for 8, as elastilog writes by default),
nan where a sample is missing or impossible (Vs >= Vp, or Vp/Vs < sqrt(2), a negative Poisson's ratio).

elastilog's benchmark (bench/run.ts) times this script beside the service on the same file.
"""
import sys

import numpy as np

NULL_VALUE = -999.25
# velocity [m/s] = 304800 / slowness [us/ft], since 1 ft = 0.3048 m exactly
US_PER_FT_TO_M_PER_S = 304800.0
G_CM3_TO_KG_M3 = 1000.0
PA_PER_GPA = 1e9


def read_log(path):
    """The header cells and the columns keyed by mnemonic (the cell without its [unit]), nulls as nan."""
    with open(path, encoding="utf-8") as f:
        header = f.readline().strip().split(",")
    mnemonics = [cell.split("[")[0].strip().upper() for cell in header]
    data = np.loadtxt(
        path,
        delimiter=",",
        skiprows=1,
        ndmin=2,
        encoding="utf-8",
        converters=lambda cell: float(cell) if cell.strip() else np.nan,
    )
    data[data == NULL_VALUE] = np.nan
    return header, {name: data[:, i] for i, name in enumerate(mnemonics)}


def elastic_moduli(dtc, dts, rhob):
    """Isotropic moduli in GPa (Mavko, Mukerji & Dvorkin, The Rock Physics Handbook, isotropic relations)."""
    with np.errstate(divide="ignore", invalid="ignore"):
        vp = US_PER_FT_TO_M_PER_S / dtc
        vs = US_PER_FT_TO_M_PER_S / dts
        rho = rhob * G_CM3_TO_KG_M3
        vp_vs = vp / vs
        usable = (
            np.isfinite(dtc) & np.isfinite(dts) & np.isfinite(rhob)
            & (dtc > 0) & (dts > 0) & (rhob > 0)
            & (vp_vs >= np.sqrt(2.0))
        )
        vp2 = vp * vp
        vs2 = vs * vs
        g = rho * vs2
        m = rho * vp2
        moduli = {
            "E": g * (3 * vp2 - 4 * vs2) / (vp2 - vs2) / PA_PER_GPA,
            "NU": (vp2 - 2 * vs2) / (2 * (vp2 - vs2)),
            "G": g / PA_PER_GPA,
            "K": (m - 4.0 / 3.0 * g) / PA_PER_GPA,
            "LAMBDA": (m - 2 * g) / PA_PER_GPA,
            "M": m / PA_PER_GPA,
            "VPVS": vp_vs,
        }
    for values in moduli.values():
        values[~usable] = np.nan
    return moduli


UNITS = {"E": "GPa", "NU": "", "G": "GPa", "K": "GPa", "LAMBDA": "GPa", "M": "GPa", "VPVS": ""}


def main(source, target, digits=17):
    header, log = read_log(source)
    depth = next(iter(log.values()))
    moduli = elastic_moduli(log["DTC"], log["DTS"], log["RHOB"])
    names = [header[0]] + [f"{name}[{unit}]" if unit else name for name, unit in UNITS.items()]
    table = np.column_stack([depth] + [moduli[name] for name in UNITS])
    np.savetxt(target, table, delimiter=",", fmt=f"%.{digits}g", header=",".join(names), comments="")


if __name__ == "__main__":
    if len(sys.argv) not in (3, 4):
        sys.exit("usage: python3 bench/reference_numpy.py in.csv out.csv [significant_digits]")
    main(sys.argv[1], sys.argv[2], int(sys.argv[3]) if len(sys.argv) == 4 else 17)

#!/usr/bin/python3
"""Reference values for the covariate statistics of OmicsScreen, from scipy.

Run with Debian 12's python3 (apt-get install python3-scipy):
    /usr/bin/python3 make_covariate_reference.py
Writes covariate_reference.json next to this script. Deterministic: the inputs are drawn
from numpy.random.default_rng with fixed seeds and stored in the JSON, so the tests never
need Python. See README.md.
"""
import json
import os
import platform

import numpy as np
import scipy
import scipy.stats as st

HERE = os.path.dirname(os.path.abspath(__file__))


def kruskal_block(name, values, levels):
    groups = [values[levels == l] for l in sorted(set(levels.tolist()))]
    h, p = st.kruskal(*groups)
    n = len(values)
    return dict(name=name, values=values.tolist(), levels=levels.tolist(), level_count=int(levels.max() + 1),
                h=float(h), p=float(p),
                # Tomczak & Tomczak (2014): epsilon-squared = H / ((n^2 - 1) / (n + 1)).
                epsilon_squared=float(h / ((n * n - 1) / (n + 1))))


def spearman_block(name, x, y):
    r = st.spearmanr(x, y)
    return dict(name=name, x=x.tolist(), y=y.tolist(), rho=float(r.correlation), p=float(r.pvalue))


def main():
    rng = np.random.default_rng(20261205)
    blocks = []
    # Three levels, shifted, continuous (no ties).
    levels = rng.integers(0, 3, 60)
    values = rng.normal(0, 1, 60) + 0.6 * levels
    blocks.append(kruskal_block("three_levels_shifted", np.round(values, 6), levels))
    # Four levels, integer values with many ties, one small level.
    levels = np.concatenate([np.zeros(15, int), np.ones(20, int), np.full(12, 2), np.full(4, 3)])
    values = rng.integers(0, 6, len(levels)).astype(float) + (levels == 1)
    blocks.append(kruskal_block("four_levels_tied", values, levels))
    # Two levels, no shift.
    levels = rng.integers(0, 2, 40)
    values = rng.normal(5, 2, 40)
    blocks.append(kruskal_block("two_levels_null", np.round(values, 6), levels))

    spearman = []
    x = rng.normal(60, 10, 50)
    spearman.append(spearman_block("age_proxy", np.round(x, 4), np.round(0.7 * (x - 60) / 10 + rng.normal(0, 0.7, 50), 6)))
    x = rng.integers(20, 40, 35).astype(float)
    spearman.append(spearman_block("tied_weak", x, rng.integers(0, 5, 35).astype(float)))

    out = dict(
        versions=dict(python=platform.python_version(), numpy=np.__version__, scipy=scipy.__version__),
        kruskal_wallis=blocks,
        spearman=spearman,
    )
    with open(os.path.join(HERE, "covariate_reference.json"), "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()

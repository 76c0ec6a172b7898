#!/usr/bin/python3
"""How often the decoy null's tail extrapolation gives a null panel a non-empty list.

A diagnostic for the calibration suite (README, "How well the error control holds"), not a
reference value for a test. It repeats the rule of src/OmicsScreen.Screening/Importance/DecoyNull.cs
on simulated statistics: 1,000 features and D decoys whose statistics all follow one law (so the
features are null and exchangeable with the decoys, as the screen assumes); p = (1 + #decoys >= x) /
(1 + D), replaced where fewer than 10 decoys reach x by a generalized Pareto tail fitted to the top
min(250, D/4) decoys by probability-weighted moments with the shape kept at 0 or above (Knijnenburg
et al. 2009; Hosking & Wallis 1987); then Benjamini-Hochberg at 0.10. Under a global null with
exact p-values a non-empty list has probability about 0.10 (Benjamini & Hochberg 1995). A list
needs p <= 1e-4 at 1,000 features, ten times past the decoys' resolution, so the answer rests on
the extrapolation.

Two rules are compared: the fitted tail's point value (the rule before 2026-12-05) and its one-sided
80% upper bound, the fitted log tail probability plus 0.8416 jackknife standard errors from the fits
that leave out one exceedance (Efron & Stein 1981; GeneralizedParetoTailBound.cs), the rule since.

Usage: /usr/bin/python3 decoy_tail_simulation.py [panels]   (prints one line per law and D)
"""
import sys

import numpy as np

FEATURES = 1000
MINIMUM_EXCEEDANCES = 10
MAXIMUM_TAIL = 250
LEVEL = 0.10


def fit_tail(exceedances):
    """PWM fit as GeneralizedParetoTail.Fit: (scale, shape), shape clamped to [0, 0.9]."""
    n = len(exceedances)
    s = np.sort(exceedances)
    a0 = s.mean()
    a1 = np.mean(s * (n - 1 - np.arange(n)) / (n - 1))
    denominator = a0 - 2 * a1
    shape = 2 - a0 / denominator if denominator > 0 else np.inf
    if not shape > 0 or np.isinf(shape) or a0 <= 0:
        return a0, 0.0
    shape = min(shape, 0.9)
    return a0 * (1 - shape), shape


def survival(y, scale, shape):
    y = np.maximum(y, 0)
    return np.exp(-y / scale) if shape == 0 else (1 + shape * y / scale) ** (-1 / shape)


ONE_SIDED_Z = 0.8416212335729143


def log_survival(y, scale, shape):
    y = np.maximum(y, 0)
    return -y / scale if shape == 0 else -np.log1p(shape * y / scale) / shape


def upper_survival(exceedances, y):
    """The fit's log tail probability plus z jackknife standard errors, exponentiated."""
    n = len(exceedances)
    full = log_survival(y, *fit_tail(exceedances))
    leave_one_out = np.array([log_survival(y, *fit_tail(np.delete(exceedances, i))) for i in range(n)])
    se = np.sqrt((n - 1) / n * np.sum((leave_one_out - leave_one_out.mean(axis=0)) ** 2, axis=0))
    return np.minimum(1.0, np.exp(full + ONE_SIDED_Z * se))


def p_values(decoys, scored, bound=False):
    d = len(decoys)
    ascending = np.sort(decoys)
    tail_count = min(MAXIMUM_TAIL, d // 4)
    threshold = 0.5 * (ascending[d - tail_count] + ascending[d - tail_count - 1])
    exceedances = ascending[d - tail_count:] - threshold
    scale, shape = fit_tail(exceedances)
    at_or_above = d - np.searchsorted(ascending, scored, side="left")
    monte_carlo = (1 + at_or_above) / (1 + d)
    use_tail = (at_or_above < MINIMUM_EXCEEDANCES) & (scored > threshold)
    if bound:
        tail = np.ones_like(monte_carlo)
        if use_tail.any():
            tail[use_tail] = tail_count / (1 + d) * upper_survival(exceedances, scored[use_tail] - threshold)
        return np.where(use_tail, np.minimum(monte_carlo, tail), monte_carlo)
    tail = tail_count / (1 + d) * survival(scored - threshold, scale, shape)
    return np.where(use_tail, np.minimum(monte_carlo, tail), monte_carlo)


def bh_non_empty(p):
    m = len(p)
    return bool(np.any(np.sort(p) <= LEVEL * np.arange(1, m + 1) / m))


LAWS = {
    # -ln of a uniform p-value: what the combined evidence's surprise is when it is exact.
    "exponential": lambda rng, k: rng.exponential(size=k),
    # A lighter tail than exponential.
    "gamma(3)": lambda rng, k: rng.gamma(3, size=k),
    # Heavier than exponential at these sample sizes, though in the Gumbel domain in the limit.
    "log-normal(0, 0.5)": lambda rng, k: rng.lognormal(0, 0.5, size=k),
    # A Pareto tail with shape 1/8.
    "Pareto(8)": lambda rng, k: rng.pareto(8, size=k),
}


def main():
    panels = int(sys.argv[1]) if len(sys.argv) > 1 else 2000
    rng = np.random.default_rng(20261205)
    print("law\tdecoys\tpanels\tnon-empty share (fit)\tnon-empty share (80% bound)\tshare of p <= 1e-4 (fit, bound)")
    for name, draw in LAWS.items():
        for decoys in (1000, 5000):
            non_empty, small = [0, 0], [0, 0]
            for _ in range(panels):
                decoy_values, features = draw(rng, decoys), draw(rng, FEATURES)
                for k, bound in enumerate((False, True)):
                    p = p_values(decoy_values, features, bound)
                    non_empty[k] += bh_non_empty(p)
                    small[k] += int(np.sum(p <= 1e-4))
            print(f"{name}\t{decoys}\t{panels}\t{non_empty[0] / panels:.3f}\t{non_empty[1] / panels:.3f}\t"
                  f"{small[0] / panels / FEATURES:.6f}, {small[1] / panels / FEATURES:.6f}")


if __name__ == "__main__":
    main()

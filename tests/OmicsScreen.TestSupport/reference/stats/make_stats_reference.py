#!/usr/bin/python3
"""Reference values for the OmicsScreen statistics toolkit, from scipy and statsmodels.

Run with Debian 12's python3 (apt-get install python3-scipy python3-statsmodels):
    /usr/bin/python3 make_stats_reference.py
Writes stats_reference.json next to this script. Deterministic: every input is
either written out below or drawn from numpy.random.default_rng with a fixed seed,
and the drawn inputs are stored in the JSON, so the tests never need Python.
See README.md for what each block means.
"""
import json
from scipy.stats import chi2_contingency
import os
import platform

import numpy as np
import scipy
import scipy.special as sp
import scipy.stats as st
import statsmodels
from statsmodels.stats.meta_analysis import combine_effects
from statsmodels.stats.multitest import multipletests

HERE = os.path.dirname(os.path.abspath(__file__))


def meta_block(name, source, yi, vi):
    r = combine_effects(np.asarray(yi, float), np.asarray(vi, float), method_re="dl")
    df = len(yi) - 1
    if r.tau2 < 0:
        # statsmodels 0.13.5 reports the untruncated moment estimate (and I2 below 0) when
        # Q < df; DerSimonian & Laird (1986) truncate tau2 at 0, which makes the random-effects
        # fit equal to the fixed-effect fit, and Higgins & Thompson (2002) truncate I2 at 0.
        return dict(
            name=name, source=source,
            estimates=list(map(float, yi)), variances=list(map(float, vi)),
            fixed_estimate=float(r.mean_effect_fe), fixed_se=float(np.sqrt(r.var_eff_w_fe)),
            q=float(r.q), df=int(df), q_p=float(st.chi2.sf(r.q, df)),
            tau2=0.0, i2=0.0, h2=float(r.h2), statsmodels_tau2_untruncated=float(r.tau2),
            random_estimate=float(r.mean_effect_fe), random_se=float(np.sqrt(r.var_eff_w_fe)),
            random_ci_lower=float(r.mean_effect_fe - st.norm.ppf(0.975) * np.sqrt(r.var_eff_w_fe)),
            random_ci_upper=float(r.mean_effect_fe + st.norm.ppf(0.975) * np.sqrt(r.var_eff_w_fe)),
        )
    return dict(
        name=name, source=source,
        estimates=list(map(float, yi)), variances=list(map(float, vi)),
        fixed_estimate=float(r.mean_effect_fe), fixed_se=float(np.sqrt(r.var_eff_w_fe)),
        q=float(r.q), df=int(df), q_p=float(st.chi2.sf(r.q, df)),
        tau2=float(r.tau2), i2=float(r.i2), h2=float(r.h2),
        random_estimate=float(r.mean_effect_re), random_se=float(np.sqrt(r.var_eff_w_re)),
        random_ci_lower=float(r.summary_frame().loc["random effect", "ci_low"]),
        random_ci_upper=float(r.summary_frame().loc["random effect", "ci_upp"]),
    )


def bcg():
    """BCG vaccine trials (Colditz et al. 1994, JAMA 271:698), as tabulated in many
    meta-analysis texts: vaccinated TB+, vaccinated TB-, control TB+, control TB-.
    Counts typed from memory; the effect is the log risk ratio."""
    counts = [
        (4, 119, 11, 128), (6, 300, 29, 274), (3, 228, 11, 209), (62, 13536, 248, 12619),
        (33, 5036, 47, 5761), (180, 1361, 372, 1079), (8, 2537, 10, 619), (505, 87886, 499, 87892),
        (29, 7470, 45, 7232), (17, 1699, 65, 1600), (186, 50448, 141, 27197), (5, 2493, 3, 2338),
        (27, 16886, 29, 17825),
    ]
    yi, vi = [], []
    for a, b, c, d in counts:
        yi.append(np.log((a / (a + b)) / (c / (c + d))))
        vi.append(1 / a - 1 / (a + b) + 1 / c - 1 / (c + d))
    return yi, vi


def delong_by_pairs(x1, x0):
    """DeLong et al. (1988) structural components straight from psi, in numpy."""
    diff = x1[:, None] - x0[None, :]
    psi = (diff > 0) + 0.5 * (diff == 0)
    v10, v01 = psi.mean(axis=1), psi.mean(axis=0)
    return float(psi.mean()), float(v10.var(ddof=1) / len(x1) + v01.var(ddof=1) / len(x0))


def main():
    rng = np.random.default_rng(20260101)
    out = dict(versions=dict(python=platform.python_version(), numpy=np.__version__,
                             scipy=scipy.__version__, statsmodels=statsmodels.__version__))

    # Meta-analysis: DerSimonian-Laird via statsmodels combine_effects(method_re="dl").
    yi, vi = bcg()
    metas = [meta_block("bcg_log_risk_ratio", "Colditz et al. 1994 BCG trials (counts from memory)", yi, vi)]
    metas.append(meta_block("invented_heterogeneous", "invented",
                            [0.10, 0.30, 0.50, -0.10, 0.80], [0.010, 0.020, 0.050, 0.030, 0.040]))
    metas.append(meta_block("invented_homogeneous", "invented (Q below df, tau2 truncated at 0)",
                            [0.20, 0.21, 0.19, 0.205], [0.04, 0.05, 0.03, 0.06]))
    out["meta_analysis"] = metas

    # DeLong variance on tied integer data, computed independently in numpy.
    delong = []
    for n1, n0, levels in [(37, 52, 6), (12, 9, 3), (150, 90, 20)]:
        x1 = rng.integers(0, levels, n1).astype(float) + 0.7 * rng.integers(0, 2, n1)
        x0 = rng.integers(0, levels, n0).astype(float)
        auc, var = delong_by_pairs(x1, x0)
        delong.append(dict(positive=x1.tolist(), negative=x0.tolist(), auc=auc, variance=var))
    out["delong"] = delong

    # Far tails. Two-sided normal p = erfc(|z|/sqrt 2); Student t two-sided p = 2 t.sf(|t|, df).
    out["normal_two_sided"] = [dict(z=z, p=float(sp.erfc(z / np.sqrt(2)))) for z in [0.5, 1.96, 5, 10, 20, 30, 37]]
    out["student_t_two_sided"] = [dict(t=t, df=df, p=float(2 * st.t.sf(abs(t), df)))
                                  for t, df in [(2.0, 5.0), (-3.5, 17.3), (25.3, 300.0), (40.0, 1000.0), (12.0, 2.5)]]

    # Mann-Whitney with p far in the tail: perfectly separated samples, one set with ties.
    mw = []
    for label, x1, x0 in [
        ("separated_800", np.arange(800.0) + 1000, np.arange(800.0)),
        ("separated_ties_700", np.floor(np.arange(700.0) / 3) + 1000, np.floor(np.arange(650.0) / 4)),
        ("overlapping_ties", rng.integers(0, 8, 60).astype(float), rng.integers(1, 9, 45).astype(float)),
    ]:
        r = st.mannwhitneyu(x1, x0, alternative="two-sided", method="asymptotic")
        mw.append(dict(name=label, positive=x1.tolist(), negative=x0.tolist(),
                       u=float(r.statistic), p=float(r.pvalue)))
    out["mann_whitney"] = mw

    # Heterogeneity flags: Cochran's Q p-value per marker (statsmodels combine_effects, chi-square
    # tail from scipy), then Benjamini-Hochberg across markers (statsmodels multipletests fdr_bh).
    markers = []
    for m in range(12):
        cohorts = 3
        spread = 0.0 if m < 6 else 0.04 * (m - 5)
        aucs = np.clip(0.7 + spread * np.array([-1.0, 0.2, 1.0]) + rng.normal(0, 0.01, cohorts), 0.05, 0.95)
        variances = rng.uniform(0.0006, 0.0025, cohorts)
        r = combine_effects(aucs, variances, method_re="dl")
        markers.append(dict(aucs=aucs.tolist(), variances=variances.tolist(), q=float(r.q),
                            q_p=float(st.chi2.sf(r.q, cohorts - 1))))
    adjusted = multipletests([mk["q_p"] for mk in markers], alpha=0.1, method="fdr_bh")[1]
    for mk, q in zip(markers, adjusted):
        mk["bh_q"] = float(q)
    out["heterogeneity_bh"] = markers

    # Cauchy combination of two p-values with equal weights (Liu & Xie 2020):
    # T = 0.5 tan((0.5 - p1) pi) + 0.5 tan((0.5 - p2) pi), p = P(Cauchy >= T) = scipy cauchy.sf(T).
    cauchy = []
    for p1, p2 in [(0.5, 0.5), (0.01, 0.5), (0.03, 0.04), (1e-6, 0.9), (0.2, 0.99), (1e-12, 1e-9), (0.7, 0.95)]:
        t = 0.5 * np.tan((0.5 - p1) * np.pi) + 0.5 * np.tan((0.5 - p2) * np.pi)
        cauchy.append(dict(p1=p1, p2=p2, p=float(st.cauchy.sf(t))))
    out["cauchy_combination"] = cauchy

    # Generalized Pareto survival, scipy genpareto(c=shape, scale=scale).sf(y).
    out["generalized_pareto"] = [dict(shape=c, scale=s_, y=y, survival=float(st.genpareto.sf(y, c, scale=s_)))
                                 for c, s_, y in [(0.0, 1.0, 2.0), (0.3, 0.5, 1.7), (0.8, 2.0, 40.0), (0.1, 0.05, 0.9)]]

    # Cauchy combination of three p-values with equal weights 1/3 (Liu & Xie 2020), scipy cauchy.sf.
    out["cauchy_combination_three"] = [
        dict(p=list(ps), combined=float(st.cauchy.sf(np.mean([np.tan((0.5 - p) * np.pi) for p in ps]))))
        for ps in [(0.5, 0.5, 0.5), (1e-8, 0.6, 0.4), (0.02, 0.03, 0.9), (0.3, 0.99, 1e-4)]]

    # Weighted Cauchy combination: T = sum w_i tan((0.5 - p_i) pi) with weights summing to 1.
    weights = [0.4, 0.4, 0.2]
    out["cauchy_combination_weighted"] = [
        dict(p=list(ps), weights=weights,
             combined=float(st.cauchy.sf(sum(w * np.tan((0.5 - p) * np.pi) for w, p in zip(weights, ps)))))
        for ps in [(0.5, 0.5, 0.5), (1e-8, 0.6, 0.4), (0.02, 0.03, 0.9), (0.3, 0.99, 1e-4), (0.7, 0.8, 1e-12)]]

    # Pearson chi-square of contingency tables without continuity correction:
    # scipy chi2_contingency(table, correction=False)[0].
    tables = [[[30, 10], [12, 28]], [[5, 0], [3, 7]], [[40, 2], [3, 35]], [[9, 11], [14, 6], [3, 17]]]
    out["chi_square_tables"] = [dict(table=t, chi_square=float(chi2_contingency(np.array(t), correction=False)[0]))
                                for t in tables]

    # The pairwise interaction scan, written independently: for every ordered pair (a, b), samples
    # where both are measured are put on the same side of both medians (strictly above the median
    # = high) or on opposite sides; chi2_contingency of side x class; each column keeps its largest
    # chi-square over partners and the first partner reaching it. Data: an interacting pair
    # (class = same side, 10% flipped), a marginal marker, noise, a column with missing values
    # (NaN), and a three-class outcome on the same columns.
    scans = []
    for label, classes_count in [("two_classes", 2), ("three_classes", 3)]:
        n = 90
        x = rng.normal(size=(n, 7))
        same = (x[:, 0] > 0) == (x[:, 1] > 0)
        y = np.where(rng.random(n) < 0.1, ~same, same).astype(int)
        if classes_count == 3:
            y = np.where(y == 1, 1 + (rng.random(n) < 0.5), 0)
        x[:, 2] += 0.8 * (y > 0)
        x[rng.random(n) < 0.15, 5] = np.nan
        stats_, partners = [], []
        for a in range(x.shape[1]):
            best, partner = 0.0, -1
            for b in range(x.shape[1]):
                if b == a:
                    continue
                keep = ~np.isnan(x[:, a]) & ~np.isnan(x[:, b])
                ha = x[keep, a] > np.median(x[~np.isnan(x[:, a]), a])
                hb = x[keep, b] > np.median(x[~np.isnan(x[:, b]), b])
                side = (ha == hb).astype(int)
                table = np.array([[np.sum((side == sd) & (y[keep] == k)) for sd in (1, 0)] for k in range(classes_count)])
                table = table[table.sum(axis=1) > 0]
                chi = 0.0 if (table.sum(axis=0) == 0).any() else float(chi2_contingency(table, correction=False)[0])
                if chi > best:
                    best, partner = chi, b
            stats_.append(best)
            partners.append(partner)
        scans.append(dict(name=label, classes=y.tolist(), columns=[[None if np.isnan(v) else float(v) for v in x[:, c]]
                                                                    for c in range(x.shape[1])],
                          statistics=stats_, partners=partners))
    out["interaction_scan"] = scans

    # Spearman's rho as a test (scipy.stats.spearmanr: rho and its t-approximation p-value) and
    # the Fisher-z interval with the Bonett & Wright (2000) variance (1 + rho^2/2)/(n - 3), written
    # out in numpy. A fresh generator so the blocks above keep their draws.
    sp_rng = np.random.default_rng(20261204)
    spearman = []
    for label, n, slope, tie_step in (("strong_positive", 60, 1.0, None), ("weak_negative", 150, -0.2, None),
                                      ("null_with_ties", 40, 0.0, 0.5), ("small", 8, 0.7, None)):
        xs = sp_rng.normal(size=n)
        ys = slope * xs + sp_rng.normal(size=n)
        if tie_step is not None:
            xs = np.round(xs / tie_step) * tie_step
        rho, p = st.spearmanr(xs, ys)
        z, se = np.arctanh(rho), np.sqrt((1 + rho ** 2 / 2) / (n - 3))
        crit = st.norm.ppf(0.975)
        spearman.append(dict(name=label, x=xs.tolist(), y=ys.tolist(), rho=float(rho), p=float(p),
                             lower=float(np.tanh(z - crit * se)), upper=float(np.tanh(z + crit * se))))
    out["spearman_test"] = spearman

    with open(os.path.join(HERE, "stats_reference.json"), "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()

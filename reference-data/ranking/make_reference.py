#!/usr/bin/python3
"""Reference values for backend/src/analysis/ranking (Veracast).

Run with Debian's Python (it has numpy, scipy, statsmodels, pandas):

    /usr/bin/python3 reference-data/ranking/make_reference.py

Writes reference.json next to this file. Every case records the exact library
call that produced it; the TypeScript test `reference.test.ts` reads the file and
checks every case. Inputs are either literal or drawn from numpy's seeded
default_rng, and the drawn inputs are stored in the JSON, so the tests never run
Python.
"""
import itertools
import warnings
import json
import platform
import sys
from pathlib import Path

import numpy as np
import pandas as pd
import scipy
import statsmodels
import statsmodels.api as sm
import statsmodels.formula.api as smf
from scipy import stats
from statsmodels.stats.meta_analysis import combine_effects

OUT = Path(__file__).with_name("reference.json")


def f(x):
    """Plain float for JSON (None stays None)."""
    return None if x is None else float(x)


# ---------------------------------------------------------------- average ranks
def average_ranks_cases():
    rng = np.random.default_rng(101)
    inputs = [
        [3.2, 1.0, 3.2, 0.4],
        [5.0, 5.0, 5.0],
        [-1.5, 2.0, -1.5, 0.0, 2.0, 2.0, 7.25],
        [0.1],
        list(np.round(rng.normal(0, 2, 25), 1)),  # one decimal: ties likely
    ]
    return [
        {"values": [float(v) for v in x],
         "ranks": [float(r) for r in stats.rankdata(x, method="average")]}
        for x in inputs
    ]


# ---------------------------------------------------------------- percentiles
def percentile_cases():
    rng = np.random.default_rng(202)
    arrays = [
        list(range(1, 41)),
        list(range(1, 1001)),
        list(range(1, 101)),
        [1.0, 1.5, 1.5, 2.0, 3.0, 3.0, 3.0, 4.5],
        list(np.round(rng.normal(0, 1, 37), 4)),
    ]
    ps = [0.0, 0.025, 0.07, 0.5, 0.975, 1.0]
    out = []
    for x in arrays:
        a = np.array(x, dtype=float)
        out.append({
            "values": [float(v) for v in a],
            "p": ps,
            "linear": [float(np.quantile(a, p, method="linear")) for p in ps],
            "inverted_cdf": [float(np.quantile(a, p, method="inverted_cdf")) for p in ps],
        })
    return out


# ---------------------------------------------------------------- exact enumeration (METHODS §7)
def exact_enumeration():
    groups = {"A": [1.0, 2.0, 4.0], "B": [2.0, 2.5, 3.0], "C": [0.5, 3.5, 5.0]}
    names = list(groups)
    # All 27 ordered resamples of each firm's 3 values; means compared exactly.
    resamples = {k: [sum(r) / 3 for r in itertools.product(v, repeat=3)] for k, v in groups.items()}
    total = 0
    sole = dict.fromkeys(names, 0)
    frac = dict.fromkeys(names, 0.0)
    rank_sum = dict.fromkeys(names, 0.0)
    rank_counts = {k: {} for k in names}
    for means in itertools.product(*(resamples[k] for k in names)):
        total += 1
        ranks = stats.rankdata(means, method="average")
        best = min(means)
        tied = sum(1 for m in means if m == best)
        for k, m, r in zip(names, means, ranks):
            rank_sum[k] += r
            rank_counts[k][float(r)] = rank_counts[k].get(float(r), 0) + 1
            if m == best:
                frac[k] += 1 / tied
            if r == 1:
                sole[k] += 1
    return {
        "call": "itertools.product over 27^3 ordered resamples; scipy.stats.rankdata(method='average')",
        "groups": groups,
        "resamples": total,
        "pSoleFirst": {k: sole[k] / total for k in names},
        "pRankFirst": {k: frac[k] / total for k in names},
        "meanRank": {k: rank_sum[k] / total for k in names},
        "rankDistribution": {k: {str(r): c / total for r, c in sorted(rank_counts[k].items())} for k in names},
    }


# ---------------------------------------------------------------- CR1 clustered mean (METHODS §6)
def clustered_cases():
    rng = np.random.default_rng(303)
    cases = [(
        [2.0, 3.1, 1.4, -0.5, 0.4, 1.8, 2.6, 2.2, 1.1, -1.0, 0.3, 0.9],
        ["c1", "c1", "c1", "c2", "c2", "c3", "c3", "c3", "c3", "c4", "c4", "c5"],
    )]
    for G in (3, 8):
        sizes = rng.integers(1, 5, G)
        y, g = [], []
        for c, s in enumerate(sizes):
            shared = rng.normal(0, 2)
            for _ in range(s):
                y.append(float(np.round(shared + rng.normal(0, 1), 2)))
                g.append(f"k{c}")
        cases.append((y, g))
    # one value per cluster: must equal the ordinary one-sample t test
    cases.append(([1.0, -1.0, 2.0, 0.0], ["a", "b", "c", "d"]))
    out = []
    for y, g in cases:
        codes = pd.factorize(pd.Series(g))[0]
        res = sm.OLS(np.array(y), np.ones(len(y))).fit(
            cov_type="cluster", cov_kwds={"groups": codes}, use_t=True)
        lo, hi = res.conf_int(alpha=0.05)[0]
        out.append({
            "values": y, "clusters": g,
            "mean": float(res.params[0]), "se": float(res.bse[0]),
            "t": float(res.tvalues[0]), "p": float(res.pvalues[0]),
            "df": int(len(set(g)) - 1), "lo": float(lo), "hi": float(hi),
        })
    return {
        "call": "statsmodels OLS(y, ones).fit(cov_type='cluster', cov_kwds={'groups': codes}, use_t=True); conf_int(alpha=0.05)",
        "cases": out,
    }


# ---------------------------------------------------------------- DerSimonian–Laird
def dl_cases():
    rng = np.random.default_rng(404)
    cases = [
        ([2.1, -0.5, 3.4, 1.2, 0.8], [1.0, 1.5, 0.8, 2.0, 1.2]),      # METHODS §6
        ([0.1, 0.2, 0.15], [1.0, 1.0, 2.0]),                          # Q < k − 1: τ² = 0
        ([float(v) for v in np.round(rng.normal(0, 2, 7), 3)],
         [float(v) for v in np.round(rng.uniform(0.2, 1.5, 7), 3)]),
    ]
    out = []
    for y, v in cases:
        r = combine_effects(np.array(y), np.array(v), method_re="dl")
        case = {
            "y": y, "v": v, "tau2": f(r.tau2), "Q": f(r.q), "I2": f(r.i2),
            "pQ": f(stats.chi2.sf(r.q, len(y) - 1)),
            "muFE": f(r.mean_effect_fe), "seFE": f(r.sd_eff_w_fe),
            "muRE": f(r.mean_effect_re), "seRE": f(r.sd_eff_w_re),
        }
        if r.tau2 < 0:
            # statsmodels 0.13.5 returns the untruncated moment estimate (and a
            # negative I²). DerSimonian–Laird truncate at 0; with τ² = 0 the
            # random-effects mean and SE are the fixed-effect ones.
            case.update({"tau2Untruncated": case["tau2"], "I2Untruncated": case["I2"],
                         "tau2": 0.0, "I2": 0.0, "muRE": case["muFE"], "seRE": case["seFE"]})
        out.append(case)
    return {
        "call": ("statsmodels.stats.meta_analysis.combine_effects(y, v, method_re='dl'): tau2, q, i2, "
                 "mean_effect_fe/re, sd_eff_w_fe/re; pQ = scipy.stats.chi2.sf(q, k-1); "
                 "a negative tau2 is truncated to 0 as DerSimonian-Laird define it (see the case's *Untruncated fields)"),
        "cases": out,
    }


# ---------------------------------------------------------------- shrinkage
def shrinkage_cases():
    # Normal–normal posterior by precision weighting — a different formulation
    # from B = (σ²/n)/(σ²/n + τ²) used in the code.
    cases = [(2.5, 3, 4.0, 1.0, 0.0), (-1.2, 10, 9.0, 0.5, 0.3), (0.8, 1, 2.0, 4.0, -0.5),
             (3.0, 25, 6.25, 0.04, 1.0)]
    out = []
    for ybar, n, s2, t2, mu in cases:
        prec_data, prec_prior = n / s2, 1 / t2
        post_mean = (prec_data * ybar + prec_prior * mu) / (prec_data + prec_prior)
        post_var = 1 / (prec_data + prec_prior)
        out.append({"mean": ybar, "n": n, "sigma2": s2, "tau2": t2, "mu": mu,
                    "B": prec_prior / (prec_data + prec_prior),
                    "shrunk": post_mean, "posteriorSd": float(np.sqrt(post_var))})
    return {"call": "numpy: posterior mean (n/σ²·ȳ + μ/τ²)/(n/σ² + 1/τ²), variance 1/(n/σ² + 1/τ²), B = (1/τ²)/(n/σ² + 1/τ²)",
            "cases": out}


# ---------------------------------------------------------------- pooled within variance
def pooled_cases():
    groups = [[1.0, 3.0], [2.0, 2.0, 5.0], [4.5], [-1.0, 0.5, 0.25, 2.0]]
    df = pd.DataFrame([(i, x) for i, g in enumerate(groups) for x in g], columns=["g", "y"])
    res = smf.ols("y ~ C(g)", data=df).fit()
    return {"call": "statsmodels smf.ols('y ~ C(g)').fit(): mse_resid, df_resid, ssr",
            "groups": groups, "sigma2": f(res.mse_resid), "df": int(res.df_resid), "ss": f(res.ssr)}


# ---------------------------------------------------------------- sampling funnel and t intervals
def funnel_cases():
    ns = [100, 400, 600, 1000, 2500, 733.5]
    z = stats.norm.ppf(0.975)
    pts = []
    for n in ns:
        se = 100 / np.sqrt(n)
        pts.append({"n": n, "marginSe": f(se),
                    "expectedAbsMarginError": f(stats.halfnorm.mean(scale=se)),
                    "marginMoe95": f(z * se)})
    deff = 1.5625
    se = 100 / np.sqrt(1000 / deff)
    return {"call": "scipy.stats.halfnorm.mean(scale=100/sqrt(n/deff)); scipy.stats.norm.ppf(0.975)*SE",
            "points": pts,
            "deff": {"n": 1000, "deff": deff, "expectedAbsMarginError": f(stats.halfnorm.mean(scale=se))}}


def t_interval_cases():
    rng = np.random.default_rng(505)
    arrays = [[1.0, -3.0], [0.5, 1.5, -0.2, 2.4, 1.1],
              [float(v) for v in np.round(rng.normal(1, 3, 30), 2)]]
    out = []
    for x in arrays:
        a = np.array(x)
        lo, hi = stats.t.interval(0.95, len(a) - 1, loc=a.mean(), scale=stats.sem(a))
        out.append({"values": x, "mean": f(a.mean()), "lo": f(lo), "hi": f(hi)})
    return {"call": "scipy.stats.t.interval(0.95, n-1, loc=mean, scale=scipy.stats.sem(x))", "cases": out}


# ---------------------------------------------------------------- a whole audit
def audit_case():
    """A synthetic audit: 6 firms, 2 elections, 12 contests. Every deterministic
    scorecard figure is computed independently with pandas/statsmodels/scipy."""
    rng = np.random.default_rng(20260101)
    house = {1: -1.2, 2: 0.0, 3: 1.5, 4: 2.5, 5: -0.4, 6: 0.8}
    skill = {1: 0.6, 2: 1.0, 3: 1.4, 4: 2.6, 5: 1.0, 6: 1.2}
    rows = []
    for c in range(12):
        election = "e1" if c < 7 else "e2"
        shared = rng.normal(0, 2)
        firms = [fi for fi in range(1, 6) if rng.random() < 0.75]
        if c in (2, 9):
            firms.append(6)
        if c == 11:
            firms = [5]  # a contest only one firm polled: its poll has no d
        for fi in firms:
            reps = 2 if (fi == 2 and c == 4) else 1  # two polls of one firm in one contest
            for _ in range(reps):
                e = float(np.round(shared + house[fi] + rng.normal(0, skill[fi]), 1))
                rows.append({
                    "pollKey": f"p{len(rows) + 1:03d}", "pollster": fi, "pollsterName": f"Firm {fi}",
                    "contestKey": f"c{c + 1:02d}", "electionKey": election,
                    "signedError": e, "absMarginError": abs(e),
                    "winnerCalled": None if rng.random() < 0.1 else bool(rng.random() < 0.8),
                    "marginCovered": None if rng.random() < 0.1 else bool(rng.random() < 0.7),
                    "shareCovered": None if rng.random() < 0.2 else bool(rng.random() < 0.6),
                    "disclosure": None if rng.random() < 0.2 else float(np.round(rng.uniform(0.3, 1.0), 2)),
                })
    df = pd.DataFrame(rows)
    min_polls = 4

    # contest-adjusted excess: other firms' polls in the same contest
    d = []
    for _, r in df.iterrows():
        others = df[(df.contestKey == r.contestKey) & (df.pollster != r.pollster)]
        d.append(r.absMarginError - others.absMarginError.mean() if len(others) else np.nan)
    df["d"] = d
    dd = df.dropna(subset=["d"])
    firm_d = dd.groupby("pollster")["d"].agg(["mean", "count"])
    ols = smf.ols("d ~ C(pollster)", data=dd).fit()
    sigma2 = float(ols.mse_resid)
    meta = combine_effects(firm_d["mean"].to_numpy(), sigma2 / firm_d["count"].to_numpy(), method_re="dl")
    tau2 = float(meta.tau2)

    firms = []
    for fi, g in df.groupby("pollster"):
        item = {"pollsterId": int(fi), "pollster": f"Firm {fi}", "polls": int(len(g)),
                "contests": int(g.contestKey.nunique()), "elections": int(g.electionKey.nunique()),
                "meanAbsMarginError": f(g.absMarginError.mean()),
                "meanSignedError": f(g.signedError.mean()),
                "rmse": f(np.sqrt((g.signedError ** 2).mean()))}
        if g.contestKey.nunique() >= 2:
            codes = pd.factorize(g.contestKey)[0]
            res = sm.OLS(g.signedError.to_numpy(), np.ones(len(g))).fit(
                cov_type="cluster", cov_kwds={"groups": codes}, use_t=True)
            item["meanSignedErrorInterval"] = [float(v) for v in res.conf_int(alpha=0.05)[0]]
        else:
            item["meanSignedErrorInterval"] = None
        for col, name in (("winnerCalled", "winnerCalledRate"), ("marginCovered", "coverageRate"),
                          ("shareCovered", "shareCoverageRate")):
            known = g[col].dropna()
            item[name] = f(known.astype(float).mean()) if len(known) else None
        item["calls"] = int(g.winnerCalled.notna().sum())
        item["noCalls"] = int(g.winnerCalled.isna().sum())
        disc = g.disclosure.dropna()
        item["disclosure"] = f(disc.mean()) if len(disc) else None
        if fi in firm_d.index:
            m, n = float(firm_d.loc[fi, "mean"]), int(firm_d.loc[fi, "count"])
            prec_data, prec_prior = n / sigma2, 1 / tau2
            item["excessError"] = m
            item["excessErrorN"] = n
            item["excessErrorShrunk"] = prec_data * m / (prec_data + prec_prior)  # μ = 0
        else:
            item["excessError"] = None
            item["excessErrorN"] = 0
            item["excessErrorShrunk"] = None
        item["ranked"] = bool(len(g) >= min_polls and item["excessError"] is not None)
        firms.append(item)
    ranked = [it for it in firms if it["ranked"]]
    for it, r in zip(ranked, stats.rankdata([it["excessErrorShrunk"] for it in ranked], method="average")):
        it["rank"] = float(r)
    for it in firms:
        it.setdefault("rank", None)

    return {
        "call": ("pandas groupby for counts/means; d_j via pandas filter on contest and firm; "
                 "sigma2 = statsmodels smf.ols('d ~ C(pollster)').mse_resid; "
                 "tau2 = statsmodels combine_effects(firm means, sigma2/n, method_re='dl').tau2; "
                 "shrunk = precision-weighted posterior mean toward 0; "
                 "interval = statsmodels OLS cluster (use_t=True) conf_int; "
                 "rank = scipy.stats.rankdata(shrunk of ranked firms, method='average')"),
        "minPolls": min_polls,
        "polls": rows,
        "fieldMeanAbsMarginError": f(df.absMarginError.mean()),
        "excessDroppedPolls": int(df.d.isna().sum()),
        "sigma2": sigma2,
        "tau2": tau2,
        "firms": firms,
        "pollExcess": [None if np.isnan(v) else float(v) for v in df.d],
    }


def main():
    # statsmodels warns on the sqrt of a negative variance in the untruncated
    # τ² case; that value is replaced (see dl_cases).
    warnings.filterwarnings("ignore", category=RuntimeWarning, module="statsmodels")
    ref = {
        "generatedBy": "reference-data/ranking/make_reference.py",
        "versions": {
            "python": platform.python_version(), "numpy": np.__version__, "scipy": scipy.__version__,
            "statsmodels": statsmodels.__version__, "pandas": pd.__version__,
        },
        "averageRanks": {"call": "scipy.stats.rankdata(x, method='average')", "cases": average_ranks_cases()},
        "percentiles": {"call": "numpy.quantile(x, p, method='linear' | 'inverted_cdf')", "cases": percentile_cases()},
        "exactEnumeration": exact_enumeration(),
        "clusteredMean": clustered_cases(),
        "derSimonianLaird": dl_cases(),
        "shrinkage": shrinkage_cases(),
        "pooledWithin": pooled_cases(),
        "samplingFunnel": funnel_cases(),
        "tInterval": t_interval_cases(),
        "audit": audit_case(),
    }
    OUT.write_text(json.dumps(ref, indent=1) + "\n")
    print(f"wrote {OUT}", file=sys.stderr)


if __name__ == "__main__":
    main()

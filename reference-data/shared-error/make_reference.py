#!/usr/bin/python3
"""Reference values for backend/src/analysis/shared-error (Veracast).

Run with Debian's Python (it has scipy, statsmodels, pandas):

    /usr/bin/python3 reference-data/shared-error/make_reference.py

Writes reference.json next to this file. Every case stores its input data, the exact library
call that produced the expected values, and the versions used. Inputs are drawn from numpy's
PCG64 generator with fixed seeds and stored, so the TypeScript tests never regenerate them.
R (Rscript, if present) adds shapiro.test values in double precision.
"""
import itertools
import json
import platform
import shutil
import subprocess
import sys
from pathlib import Path

import numpy as np
import pandas as pd
import scipy
import statsmodels
import statsmodels.api as sm
from scipy import stats
from statsmodels.stats.diagnostic import normal_ad
from statsmodels.stats.meta_analysis import combine_effects

HERE = Path(__file__).resolve().parent


def fl(x):
    """Plain float (full precision) for JSON."""
    return float(x)


def r_version():
    if shutil.which("Rscript") is None:
        return None
    out = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], capture_output=True, text=True, check=True)
    return out.stdout.strip()


def r_shapiro(x):
    """R's shapiro.test on x (double precision), or None without R."""
    if shutil.which("Rscript") is None:
        return None
    code = ("x <- scan(file('stdin'), quiet = TRUE); r <- shapiro.test(x); "
            "cat(sprintf('%.17g %.17g', r$statistic, r$p.value))")
    data = "\n".join(repr(float(v)) for v in x) + "\n"
    out = subprocess.run(["Rscript", "-e", code], input=data, capture_output=True, text=True, check=True)
    w, p = out.stdout.split()
    return {"w": float(w), "p": float(p)}


# ---------------------------------------------------------------- clustered mean (CR1, t on G-1)
def clustered_cases():
    cases = []
    specs = [
        ("methods-example", None),
        ("seed-101-six-clusters", (101, [3, 1, 4, 2, 5, 2])),
        ("seed-202-two-clusters", (202, [4, 3])),
        ("seed-303-twenty-clusters", (303, [1, 2, 3, 4, 5] * 4)),
    ]
    for name, spec in specs:
        if spec is None:
            groups = [[2.0, 3.1, 1.4], [-0.5, 0.4], [1.8, 2.6, 2.2, 1.1], [-1.0, 0.3], [0.9]]
        else:
            seed, sizes = spec
            rng = np.random.default_rng(seed)
            groups = []
            for size in sizes:
                shared = rng.normal(1.0, 2.0)
                groups.append([round(float(v), 3) for v in shared + rng.normal(0.0, 1.5, size)])
        values = [v for g in groups for v in g]
        clusters = [f"c{i + 1}" for i, g in enumerate(groups) for _ in g]
        y = np.array(values)
        codes = np.array([int(c[1:]) for c in clusters])
        fit = sm.OLS(y, np.ones((len(y), 1))).fit(cov_type="cluster", cov_kwds={"groups": codes}, use_t=True)
        normal = sm.OLS(y, np.ones((len(y), 1))).fit(cov_type="cluster", cov_kwds={"groups": codes}, use_t=False)
        ci = fit.conf_int()[0]
        g = len(groups)
        cases.append({
            "name": name,
            "values": values,
            "clusters": clusters,
            "expected": {
                "mean": fl(fit.params[0]),
                "se": fl(fit.bse[0]),
                "t": fl(fit.tvalues[0]),
                "p": fl(fit.pvalues[0]),
                "df": g - 1,
                "ciLow": fl(ci[0]),
                "ciHigh": fl(ci[1]),
            },
            "normalReferenceP": fl(normal.pvalues[0]),
        })
    return {
        "call": "sm.OLS(y, ones).fit(cov_type='cluster', cov_kwds={'groups': g}, use_t=True); "
                "p, conf_int on G-1 df; normalReferenceP from use_t=False (not Veracast's choice)",
        "cases": cases,
    }


# ---------------------------------------------------------------- ICC(1) by ANOVA moments
def icc_cases():
    cases = []
    specs = [
        ("methods-example", None),
        ("seed-11-unbalanced", (11, [2, 5, 3, 1, 4, 6])),
        ("seed-12-weak-shared", (12, [3, 3, 2, 4])),
        ("seed-13-negative-icc", None),
    ]
    for name, spec in specs:
        if name == "methods-example":
            groups = [[3.1, 2.4, 4.0], [-1.2, -0.3, -2.0], [0.5, 1.5, 0.2], [2.2, 1.0, 2.9]]
        elif name == "seed-13-negative-icc":
            # groups with equal means by construction: MSB < MSW, so the moment ICC is negative
            groups = [[-2.0, 0.1, 2.0], [1.5, -1.4, 0.0], [-0.9, 1.0, 0.05]]
        else:
            seed, sizes = spec
            rng = np.random.default_rng(seed)
            sd_b = 2.0 if seed == 11 else 0.3
            groups = [[round(float(v), 3) for v in rng.normal(0, sd_b) + rng.normal(0, 1.0, s)] for s in sizes]
        f, p = stats.f_oneway(*[np.array(g) for g in groups])
        all_v = np.concatenate([np.array(g) for g in groups])
        n, j = len(all_v), len(groups)
        grand = all_v.mean()
        ssb = sum(len(g) * (np.mean(g) - grand) ** 2 for g in groups)
        ssw = sum(((np.array(g) - np.mean(g)) ** 2).sum() for g in groups)
        msb, msw = ssb / (j - 1), ssw / (n - j)
        n0 = (n - sum(len(g) ** 2 for g in groups) / n) / (j - 1)
        s2b = (msb - msw) / n0
        cases.append({
            "name": name,
            "groups": groups,
            "expected": {
                "msb": fl(msb), "msw": fl(msw), "n0": fl(n0), "f": fl(f), "p": fl(p),
                "dfBetween": j - 1, "dfWithin": n - j,
                "sigma2Between": fl(s2b), "icc": fl(s2b / (s2b + msw)),
            },
            "check": {"fFromMoments": fl(msb / msw)},
        })
    return {
        "call": "scipy.stats.f_oneway(*groups) for f and p; MSB, MSW, n0, sigma2Between, icc by numpy "
                "moments (n0 = (N - sum n_c^2 / N)/(J - 1))",
        "cases": cases,
    }


# ---------------------------------------------------------------- DerSimonian-Laird
def own_dl(y, v):
    """DerSimonian-Laird in numpy, tau2 truncated at 0 as in the 1986 paper."""
    w = 1 / v
    mu_fe = (w * y).sum() / w.sum()
    q = (w * (y - mu_fe) ** 2).sum()
    c = w.sum() - (w ** 2).sum() / w.sum()
    df = len(y) - 1
    tau2 = max(0.0, (q - df) / c)
    w_re = 1 / (v + tau2)
    return {
        "q": q, "qP": stats.chi2.sf(q, df), "tau2": tau2,
        "muFE": mu_fe, "seFE": 1 / np.sqrt(w.sum()),
        "muRE": (w_re * y).sum() / w_re.sum(), "seRE": 1 / np.sqrt(w_re.sum()),
        "i2": max(0.0, (q - df) / q) if q > 0 else 0.0,
    }


def dl_cases():
    cases = []
    specs = [
        ("methods-example", [2.1, -0.5, 3.4, 1.2, 0.8], [1.0, 1.5, 0.8, 2.0, 1.2]),
        ("homogeneous-tau2-zero", [1.0, 1.2, 0.9, 1.1], [2.0, 1.0, 1.5, 3.0]),
        ("two-polls", [3.0, -1.0], [1.0, 1.0]),
    ]
    rng = np.random.default_rng(21)
    v = np.round(rng.uniform(4, 16, 12), 3)
    y = np.round(rng.normal(1.5, 2.5, 12) + rng.normal(0, np.sqrt(v)), 3)
    specs.append(("seed-21-twelve-polls", y.tolist(), v.tolist()))
    for name, y, v in specs:
        y, v = np.array(y, dtype=float), np.array(v, dtype=float)
        res = combine_effects(y, v, method_re="dl")
        frame = res.summary_frame()
        own = own_dl(y, v)
        entry = {"name": name, "y": y.tolist(), "v": v.tolist()}
        if res.tau2 >= 0:
            sm_values = {
                "q": res.q, "qP": stats.chi2.sf(res.q, len(y) - 1), "tau2": res.tau2,
                "muFE": frame.loc["fixed effect", "eff"], "seFE": frame.loc["fixed effect", "sd_eff"],
                "muRE": frame.loc["random effect", "eff"], "seRE": frame.loc["random effect", "sd_eff"],
                "i2": res.i2,
            }
            for key, value in sm_values.items():
                assert abs(value - own[key]) < 1e-9, (name, key, value, own[key])
            entry["expected"] = {k: fl(v) for k, v in sm_values.items()}
            entry["source"] = "statsmodels combine_effects, cross-checked with own numpy DL"
        else:
            # statsmodels 0.13.5 does not truncate the DL tau2 at 0 (it reports a negative tau2
            # and I2 here); the expected values come from the truncated numpy DL of the paper.
            assert abs(res.q - own["q"]) < 1e-12
            entry["expected"] = {k: fl(v) for k, v in own.items()}
            entry["source"] = "own numpy DL (tau2 truncated at 0); statsmodels 0.13.5 reports the untruncated value"
            entry["statsmodelsUntruncated"] = {"tau2": fl(res.tau2), "i2": fl(res.i2)}
        cases.append(entry)
    return {
        "call": "statsmodels.stats.meta_analysis.combine_effects(y, v, method_re='dl'); summary_frame() rows "
                "'fixed effect' and 'random effect' (columns eff, sd_eff); q, tau2, i2 attributes; qP = "
                "scipy.stats.chi2.sf(q, k - 1); every value cross-checked with an own numpy DL; where "
                "statsmodels gives tau2 < 0 (it does not truncate) the truncated numpy DL is the reference",
        "cases": cases,
    }


# ---------------------------------------------------------------- correlations
def correlation_cases():
    cases = []
    data = [
        ("methods-example", [1.2, -0.5, 2.3, 0.8, -1.1, 3.0, 0.4, 1.9], [0.9, 0.1, 1.8, 1.2, -0.6, 2.2, -0.3, 1.0]),
        ("ties", [1.0, 2.0, 2.0, 3.0, 4.0, 4.0, 4.0, 5.0], [2.0, 1.0, 3.0, 3.0, 5.0, 4.0, 6.0, 6.0]),
        ("negative-n5", [0.5, 1.5, 2.5, 3.5, 4.0], [2.0, 1.9, 0.7, 0.2, -1.4]),
    ]
    rng = np.random.default_rng(31)
    x = rng.normal(0, 2, 30)
    y = 0.3 * x + rng.normal(0, 2, 30)
    data.append(("seed-31-n30", np.round(x, 3).tolist(), np.round(y, 3).tolist()))
    for name, x, y in data:
        pr = stats.pearsonr(x, y)
        ci = pr.confidence_interval(0.95)
        sp = stats.spearmanr(x, y)
        cases.append({
            "name": name, "x": x, "y": y,
            "expected": {
                "r": fl(pr.statistic), "pearsonP": fl(pr.pvalue), "ciLow": fl(ci.low), "ciHigh": fl(ci.high),
                "rho": fl(sp.statistic), "spearmanP": fl(sp.pvalue),
            },
        })
    return {
        "call": "scipy.stats.pearsonr(x, y) (statistic, pvalue, confidence_interval(0.95): Fisher z); "
                "scipy.stats.spearmanr(x, y) (average ranks; pvalue from the t approximation, not exact)",
        "cases": cases,
    }


# ---------------------------------------------------------------- normality
def normality_cases():
    cases = []
    samples = [("methods-example", [-2.1, -0.8, 0.3, 1.2, 2.5, 0.0, 0.7, -1.5, 3.9, 1.1, -0.4, 5.2])]
    samples.append(("n3", [1.0, 2.0, 4.0]))
    samples.append(("n3-equally-spaced", [0.0, 1.0, 2.0]))
    rng = np.random.default_rng(41)
    for n in (4, 5, 6, 7, 11, 12, 20, 50, 200, 1000):
        samples.append((f"seed-41-normal-n{n}", np.round(rng.normal(0.5, 3.0, n), 4).tolist()))
    samples.append(("seed-42-skewed-n40", np.round(np.random.default_rng(42).exponential(2.0, 40), 4).tolist()))
    samples.append(("seed-43-heavy-n300", np.round(np.random.default_rng(43).standard_t(3, 300), 4).tolist()))
    samples.append(("seed-44-normal-n5000", np.round(np.random.default_rng(44).normal(0, 1, 5000), 5).tolist()))
    for name, x in samples:
        arr = np.array(x)
        sw = stats.shapiro(arr)
        jb = stats.jarque_bera(arr)
        entry = {
            "name": name, "x": x,
            "expected": {
                "shapiroW": fl(sw.statistic), "shapiroP": fl(sw.pvalue),
                "jarqueBera": fl(jb.statistic), "jarqueBeraP": fl(jb.pvalue),
                "skewness": fl(stats.skew(arr, bias=True)), "kurtosis": fl(stats.kurtosis(arr, fisher=False, bias=True)),
            },
        }
        if len(x) >= 3:
            a2, p = normal_ad(arr)
            n = len(x)
            entry["expected"].update({"andersonDarling": fl(a2), "andersonDarlingAdjusted": fl(a2 * (1 + 0.75 / n + 2.25 / n ** 2)),
                                      "andersonDarlingP": fl(p)})
            # The same A2 with both tails on the log scale (norm.logcdf, norm.logsf): statsmodels'
            # log1p(-cdf) loses digits in the upper tail (about 3e-8 in A2 for the n = 300 case).
            w = (np.sort(arr) - arr.mean()) / arr.std(ddof=1)
            i = np.arange(1, n + 1)
            a2_log = -n - np.sum((2 * i - 1) / n * (stats.norm.logcdf(w) + stats.norm.logsf(w[::-1])))
            entry["expected"]["andersonDarlingLogTail"] = fl(a2_log)
        rs = r_shapiro(x)
        if rs is not None:
            entry["rShapiro"] = rs
        cases.append(entry)
    return {
        "call": "scipy.stats.shapiro(x) (single precision: compare W and p to 1e-5); R shapiro.test(x) as rShapiro "
                "(double precision); scipy.stats.jarque_bera(x); scipy.stats.skew(x, bias=True); "
                "scipy.stats.kurtosis(x, fisher=False, bias=True); statsmodels.stats.diagnostic.normal_ad(x) "
                "(returns unadjusted A2 and the p of A2*(1 + 0.75/n + 2.25/n^2)); andersonDarlingLogTail = "
                "-n - sum((2i - 1)/n * (norm.logcdf(w_i) + norm.logsf(w_(n+1-i)))), w standardised with ddof=1",
        "cases": cases,
    }


# ---------------------------------------------------------------- contest bias, house effects, variance split
def crossed_data(seed, contests, firms, p_poll, sd_b, sd_h, sd_e):
    rng = np.random.default_rng(seed)
    b = rng.normal(0, sd_b, contests)
    h = rng.normal(0, sd_h, firms)
    rows = []
    for c in range(contests):
        for f in range(firms):
            if rng.uniform() < p_poll:
                rows.append({"contestKey": f"c{c + 1:02d}", "firm": f"F{f + 1:02d}",
                             "error": round(float(1.0 + b[c] + h[f] + rng.normal(0, sd_e)), 3)})
    return rows


def house_cases():
    methods = [("c1", "F1", 3.0), ("c1", "F2", 1.5), ("c1", "F3", 2.4), ("c2", "F1", 0.5), ("c2", "F2", -1.0),
               ("c2", "F3", 0.2), ("c2", "F4", -0.6), ("c3", "F1", 2.2), ("c3", "F3", 1.9), ("c3", "F4", 0.4),
               ("c4", "F2", -2.5), ("c4", "F3", -1.1), ("c4", "F4", -2.0)]
    datasets = [("methods-example", [{"contestKey": c, "firm": f, "error": e} for c, f, e in methods])]
    datasets.append(("seed-51-crossed", crossed_data(51, 12, 6, 0.6, 2.0, 1.0, 1.2)))
    extra = crossed_data(52, 8, 5, 0.7, 1.5, 0.8, 1.0)
    extra.append(dict(extra[0], error=round(extra[0]["error"] + 0.7, 3)))  # a firm's second poll in a contest
    datasets.append(("seed-52-with-repeat-poll", extra))
    cases = []
    for name, rows in datasets:
        df = pd.DataFrame(rows)
        bias = df.groupby("contestKey")["error"].mean()
        df["plain"] = df["error"] - df["contestKey"].map(bias)
        loo = []
        for _, r in df.iterrows():
            others = df[(df.contestKey == r.contestKey) & (df.firm != r.firm)]["error"]
            loo.append(r.error - others.mean() if len(others) else np.nan)
        df["loo"] = loo
        house = []
        for firm, grp in df.groupby("firm"):
            l = grp["loo"].dropna()
            house.append({"firm": firm, "plain": fl(grp["plain"].mean()),
                          "leaveOneOut": fl(l.mean()) if len(l) else None})
        # variance split by brute force over all pairs (a different formulation from the O(N) code)
        sums = {"sc": [], "sf": [], "nn": []}
        for a, b in itertools.combinations(rows, 2):
            half_sq = 0.5 * (a["error"] - b["error"]) ** 2
            same_c, same_f = a["contestKey"] == b["contestKey"], a["firm"] == b["firm"]
            if same_c and not same_f:
                sums["sc"].append(half_sq)
            elif same_f and not same_c:
                sums["sf"].append(half_sq)
            elif not same_c and not same_f:
                sums["nn"].append(half_sq)
        d1, d2, d3 = (float(np.mean(sums[k])) for k in ("sc", "sf", "nn"))
        comp = {"shared": d3 - d1, "house": d3 - d2, "noise": d1 + d2 - d3}
        kept = {k: max(0.0, v) for k, v in comp.items()}
        tot = sum(kept.values())
        cases.append({
            "name": name, "polls": rows,
            "expected": {
                "contestBias": [{"contestKey": k, "bias": fl(v)} for k, v in bias.items()],
                "houseEffects": house,
                "components": comp,
                "shares": {k: v / tot for k, v in kept.items()},
                "pairs": {"sameContest": len(sums["sc"]), "sameFirm": len(sums["sf"]), "neither": len(sums["nn"])},
            },
        })
    return {
        "call": "pandas groupby means for contest bias and plain/leave-one-out house effects (leave-one-out: "
                "mean over the firm's polls of error minus the mean of other firms' polls in the contest); "
                "variance split by a double loop over all poll pairs: D1 (same contest, other firm), D2 (same "
                "firm, other contest), D3 (neither) = mean of (y_i - y_j)^2 / 2; shared = D3 - D1, house = "
                "D3 - D2, noise = D1 + D2 - D3; shares after truncation at 0",
        "cases": cases,
    }


# ---------------------------------------------------------------- pairwise firm correlations
def pairwise_cases():
    rows = crossed_data(61, 14, 5, 0.75, 2.0, 0.7, 1.0)
    rows.append(dict(rows[3], error=round(rows[3]["error"] - 0.9, 3)))  # repeated poll: averaged
    df = pd.DataFrame(rows).groupby(["contestKey", "firm"], as_index=False)["error"].mean()
    wide = df.pivot(index="contestKey", columns="firm", values="error")
    firms = sorted(wide.columns)
    min_common = 5
    pairs = []
    for a, b in itertools.combinations(firms, 2):
        both = wide[[a, b]].dropna()
        n = len(both)
        entry = {"a": a, "b": b, "n": n}
        if n < min_common:
            entry.update({"insufficient": True})
            pairs.append(entry)
            continue
        pr = stats.pearsonr(both[a], both[b])
        sp = stats.spearmanr(both[a], both[b])
        others = wide.drop(columns=[a, b]).loc[both.index]
        bias = others.mean(axis=1, skipna=True)
        keep = bias.notna()
        adj_a = (both[a] - bias)[keep]
        adj_b = (both[b] - bias)[keep]
        entry.update({"insufficient": False, "pearson": fl(pr.statistic), "pearsonP": fl(pr.pvalue),
                      "spearman": fl(sp.statistic), "spearmanP": fl(sp.pvalue), "nAdjusted": int(keep.sum())})
        if keep.sum() >= min_common:
            pa = stats.pearsonr(adj_a, adj_b)
            entry.update({"pearsonAdjusted": fl(pa.statistic), "pearsonAdjustedP": fl(pa.pvalue)})
        else:
            entry.update({"pearsonAdjusted": None, "pearsonAdjustedP": None})
        pairs.append(entry)
    return {
        "call": "pandas: average a firm's polls per contest, pivot contests x firms; per pair scipy.stats.pearsonr "
                "and spearmanr over contests both polled; adjusted: subtract the row mean of the other firms "
                "(skipna) and pearsonr over rows where it exists; minCommon 5",
        "minCommon": min_common,
        "polls": rows,
        "pairs": pairs,
    }


# ---------------------------------------------------------------- historical interval
def historical_cases():
    cases = []
    rng = np.random.default_rng(71)
    data = [("small", [1.0, -2.0, 3.0, -4.0]),
            ("seed-71-n40", np.round(rng.normal(0.8, 3.2, 40), 2).tolist())]
    for name, misses in data:
        m = np.array(misses)
        rmse = float(np.sqrt(np.mean(m ** 2)))
        z = float(stats.norm.ppf(0.975))
        emp = float(np.percentile(np.abs(m), 95))  # numpy default: linear interpolation
        cases.append({"name": name, "misses": misses,
                      "expected": {"meanMiss": fl(m.mean()), "rmse": rmse, "rmseHalfWidth": z * rmse,
                                   "empiricalHalfWidth": emp, "halfWidth": max(z * rmse, emp)}})
    return {"call": "numpy: sqrt(mean(m^2)); scipy.stats.norm.ppf(0.975) * rmse; numpy.percentile(|m|, 95) "
                    "(method='linear', the default)",
            "cases": cases}


def main():
    out = {
        "generatedBy": "reference-data/shared-error/make_reference.py",
        "versions": {
            "python": platform.python_version(),
            "numpy": np.__version__,
            "scipy": scipy.__version__,
            "statsmodels": statsmodels.__version__,
            "pandas": pd.__version__,
            "R": r_version(),
        },
        "clusteredMean": clustered_cases(),
        "icc1": icc_cases(),
        "derSimonianLaird": dl_cases(),
        "correlation": correlation_cases(),
        "normality": normality_cases(),
        "houseEffects": house_cases(),
        "pairwise": pairwise_cases(),
        "historical": historical_cases(),
    }
    path = HERE / "reference.json"
    path.write_text(json.dumps(out, indent=1, allow_nan=False) + "\n")
    print(f"wrote {path}", file=sys.stderr)


if __name__ == "__main__":
    main()

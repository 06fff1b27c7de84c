#!/usr/bin/python3
"""Reference values for Veracast's per-poll metrics core (backend/src/analysis/metrics).

Run with Debian's Python (it has numpy, scipy and statsmodels):

    /usr/bin/python3 reference-data/metrics/make_reference.py

It writes reference.json beside this file. Every value is computed here,
independently of the TypeScript code, from library calls named in each case's
"calls" field. Shares are in points (0-100) unless a case says "proportion".
"""
import datetime
import json
import math
import os
import platform

import numpy as np
import scipy
import scipy.stats as st
import statsmodels
from statsmodels.stats.proportion import proportion_confint

Z = float(st.norm.ppf(0.975))
CASES = []


def add(kind, name, inputs, expected, calls):
    CASES.append({"kind": kind, "name": name, "inputs": inputs, "expected": expected, "calls": calls})


# --- Wilson score intervals (statsmodels) ---------------------------------
for x, n in [(37, 120), (512, 1000), (3, 50), (50, 50)]:
    lo, hi = proportion_confint(x, n, alpha=0.05, method="wilson")
    add("wilson", f"wilson {x}/{n}", {"x": x, "n": n}, {"lower": float(lo), "upper": float(hi)},
        [f"statsmodels.stats.proportion.proportion_confint({x}, {n}, alpha=0.05, method='wilson')"])

# --- Share and margin sampling error (proportions) ------------------------
for pa, pb, n in [(0.37, 0.41, 850), (0.52, 0.31, 1500)]:
    share_moe = Z * math.sqrt(pa * (1 - pa) / n)
    # Margin variance from the multinomial covariance matrix, built with numpy.
    cov = (np.diag([pa, pb]) - np.outer([pa, pb], [pa, pb])) / n
    contrast = np.array([1.0, -1.0])
    margin_se = float(math.sqrt(contrast @ cov @ contrast))
    add("sampling", f"sampling pA={pa} pB={pb} n={n}", {"pA": pa, "pB": pb, "n": n},
        {"shareMoe": share_moe, "marginSe": margin_se, "marginMoe": Z * margin_se},
        ["z = scipy.stats.norm.ppf(0.975)",
         "shareMoe = z*sqrt(pA*(1-pA)/n)",
         "marginSe = sqrt(c' S c), S = (diag(p) - outer(p, p))/n, c = (1, -1) (numpy)"])

# --- Kish design effect -----------------------------------------------------
w = np.array([0.8, 1.2, 0.6, 2.4, 1.0, 1.0, 0.7, 1.9])
cv = float(np.std(w, ddof=0) / np.mean(w))
add("kish", "kish 8 weights", {"weights": w.tolist()},
    {"deff": 1 + cv ** 2, "nEff": len(w) / (1 + cv ** 2)},
    ["deff = 1 + (numpy.std(w, ddof=0)/numpy.mean(w))**2", "nEff = len(w)/deff"])

# --- n_eff implied by a stated MOE ------------------------------------------
for moe in [3.5, 2.2, 4.0]:
    add("nEffFromStatedMoe", f"stated MOE {moe}", {"moePts": moe},
        {"nEff": Z ** 2 * 0.25 / (moe / 100) ** 2},
        ["z = scipy.stats.norm.ppf(0.975)", "nEff = z**2*0.25/(moe/100)**2"])


# --- Martin-Traugott-Kennedy A ----------------------------------------------
def mtk(pa, pb, va, vb, n):
    q, qv = pa / (pa + pb), va / (va + vb)
    a = float(scipy.special.logit(q) - scipy.special.logit(qv))
    se = math.sqrt(1 / (n * pa / 100) + 1 / (n * pb / 100))
    z = a / se
    return {"a": a, "se": se, "z": z, "p": float(2 * st.norm.sf(abs(z))),
            "lower": a - Z * se, "upper": a + Z * se}


for pa, pb, va, vb, n in [(41.5, 38.2, 44.1, 43.0, 1200), (52, 35, 55.3, 40.1, 650)]:
    add("mtk", f"mtk {pa}/{pb} vs {va}/{vb} n={n}",
        {"pollA": pa, "pollB": pb, "resultA": va, "resultB": vb, "n": n}, mtk(pa, pb, va, vb, n),
        ["a = scipy.special.logit(pA/(pA+pB)) - scipy.special.logit(VA/(VA+VB))",
         "se = sqrt(1/(n*pA/100) + 1/(n*pB/100))", "p = 2*scipy.stats.norm.sf(abs(a/se))"])

values = [0.12, -0.05, 0.08, 0.21, -0.02, 0.04, 0.15]
tt = st.ttest_1samp(values, 0.0)
k = len(values)
se = float(np.std(values, ddof=1) / math.sqrt(k))
tcrit = float(st.t.ppf(0.975, k - 1))
add("mtkMean", "mean of 7 A values", {"values": values},
    {"mean": float(np.mean(values)), "se": se, "t": float(tt.statistic), "df": k - 1, "p": float(tt.pvalue),
     "lower": float(np.mean(values)) - tcrit * se, "upper": float(np.mean(values)) + tcrit * se},
    ["scipy.stats.ttest_1samp(values, 0.0)", "se = numpy.std(values, ddof=1)/sqrt(k)",
     "interval: mean -/+ scipy.stats.t.ppf(0.975, k-1)*se"])


# --- Arzheimer-Evans A', B, B_w ---------------------------------------------
def ae(poll, result, n):
    keys = [k for k in poll if k != "undecided"]
    p = np.array([poll[k] for k in keys], dtype=float)
    v = np.array([result[k] for k in keys], dtype=float)
    p, v = p / p.sum(), v / v.sum()
    a = np.log(p / (1 - p)) - np.log(v / (1 - v))
    chi = st.chisquare(n * p, n * v)
    g = st.power_divergence(n * p, n * v, lambda_="log-likelihood")
    return {
        "aPrime": dict(zip(keys, a.tolist())),
        "se": dict(zip(keys, (1 / np.sqrt(n * p * (1 - p))).tolist())),
        "b": float(np.mean(np.abs(a))), "bw": float(np.sum(v * np.abs(a))),
        "chi2": float(chi.statistic), "chi2P": float(chi.pvalue),
        "g2": float(g.statistic), "g2P": float(g.pvalue), "df": len(keys) - 1,
    }


AE_CALLS = ["shares rescaled to sum to 1 over the named options (numpy)",
            "aPrime = log(p/(1-p)) - log(v/(1-v))",
            "scipy.stats.chisquare(n*p, n*v)",
            "scipy.stats.power_divergence(n*p, n*v, lambda_='log-likelihood')"]
for poll, result, n in [
    ({"a": 35, "b": 30, "c": 20, "d": 15}, {"a": 33.4, "b": 28.9, "c": 25.2, "d": 12.5}, 1500),
    ({"a": 31, "b": 27, "c": 12, "d": 8, "e": 4, "undecided": 18},
     {"a": 36.2, "b": 30.5, "c": 16.1, "d": 11.0, "e": 6.2}, 900),
]:
    add("ae", f"ae {len(result)} options n={n}", {"poll": poll, "result": result, "n": n}, ae(poll, result, n),
        AE_CALLS)


# --- Whole polls through computePollMetrics --------------------------------
def day(iso):
    return datetime.date.fromisoformat(iso)


def poll_case(name, poll, contest, settings):
    opts = contest["options"]
    total = sum(o["votes"] for o in opts)
    cert = {o["key"]: 100 * o["votes"] / total for o in opts}
    ranked = sorted(opts, key=lambda o: (-o["votes"], o["key"]))
    winner, runner = ranked[0]["key"], ranked[1]["key"]
    ref_a, ref_b, basis = winner, runner, "top_two"
    if contest["orientation"]:
        ba = [o for o in ranked if o["bloc"] == contest["orientation"][0]]
        bb = [o for o in ranked if o["bloc"] == contest["orientation"][1]]
        if ba and bb:
            ref_a, ref_b, basis = ba[0]["key"], bb[0]["key"], "blocs"
    raw = poll["shares"]
    u = raw.get("undecided", 0.0)
    t = settings["undecided"]
    if t == "raw":
        tp, tr = dict(raw), dict(cert)
    elif t == "proportional":
        tp = {k: v / (1 - u / 100) for k, v in raw.items() if k != "undecided"}
        tr = dict(cert)
    else:
        s, sr = raw[ref_a] + raw[ref_b], cert[ref_a] + cert[ref_b]
        tp = {ref_a: 100 * raw[ref_a] / s, ref_b: 100 * raw[ref_b] / s}
        tr = {ref_a: 100 * cert[ref_a] / sr, ref_b: 100 * cert[ref_b] / sr}
    e = (tp[ref_a] - tp[ref_b]) - (tr[ref_a] - tr[ref_b])
    scored = [k for k in tp if k != "undecided" and k in tr]
    m3 = float(np.mean([abs(tp[k] - tr[k]) for k in scored]))
    m5 = abs((tp[winner] - tp[runner]) - (tr[winner] - tr[runner])) if winner in tp and runner in tp else None
    lead = raw[winner] - raw[runner]
    called = None if lead == 0 else bool(lead > 0)
    n_design = poll["n"] / settings["designEffect"]
    n_eff = Z ** 2 * 0.25 / (poll["moe"] / 100) ** 2 if poll["moe"] is not None else n_design
    m = mtk(raw[ref_a], raw[ref_b], cert[ref_a], cert[ref_b], n_design)
    n_cat = n_design * min(1.0, sum(raw[k] for k in scored) / 100)
    aer = ae({k: tp[k] for k in scored}, {k: tr[k] for k in scored}, n_cat)
    pa, pb = tp[ref_a] / 100, tp[ref_b] / 100
    share_half = 100 * Z * math.sqrt(pa * (1 - pa) / n_eff)
    margin_half = 100 * Z * math.sqrt((pa + pb - (pa - pb) ** 2) / n_eff)
    ed, fs, fe = day(contest["electionDate"]), day(poll["fieldworkStart"]), day(poll["fieldworkEnd"])
    expected = {
        "refA": ref_a, "refB": ref_b, "refBasis": basis,
        "marginError": e, "absMarginError": abs(e), "lean": "A" if e > 0 else "B" if e < 0 else "none",
        "shareErrors": {k: tp[k] - tr[k] for k in scored},
        "twoPartyShareError": 100 * (raw[ref_a] / (raw[ref_a] + raw[ref_b]) - cert[ref_a] / (cert[ref_a] + cert[ref_b])),
        "mosteller3": m3, "mosteller3Set": sorted(scored, key=lambda k: (-tr[k], k)), "mosteller5": m5,
        "mtkA": m["a"], "mtkSe": m["se"], "mtkZ": m["z"], "mtkP": m["p"],
        "aePrime": aer["aPrime"], "aeB": aer["b"], "aeBw": aer["bw"], "aeChi2": aer["chi2"], "aeG2": aer["g2"],
        "aeDf": aer["df"], "aeChi2P": aer["chi2P"],
        "winnerCalled": called,
        "shareCovered": bool(abs(tr[ref_a] - tp[ref_a]) <= share_half),
        "marginCovered": bool(abs((tr[ref_a] - tr[ref_b]) - (tp[ref_a] - tp[ref_b])) <= margin_half),
        "daysOut": ((ed - fs).days + (ed - fe).days) / 2, "daysOutEnd": (ed - fe).days,
        "undecidedShare": u, "nEff": n_eff,
    }
    add("poll", name, {"poll": poll, "contest": contest, "settings": settings}, expected,
        ["reference pair, treatments and errors re-implemented in numpy from METHODS.md 1-5",
         "MTK p: 2*scipy.stats.norm.sf(abs(z)); A': scipy.stats.chisquare, scipy.stats.power_divergence",
         "days: datetime.date.fromisoformat differences"])


poll_case(
    "raw, top two, stated MOE",
    {"n": 1012, "moe": 3.1, "fieldworkStart": "2025-10-02", "fieldworkEnd": "2025-10-05",
     "shares": {"p": 41, "q": 37, "r": 9, "other": 4, "undecided": 9}},
    {"electionDate": "2025-10-19", "orientation": None, "options": [
        {"key": "p", "bloc": "X", "votes": 412034}, {"key": "q", "bloc": "Y", "votes": 433870},
        {"key": "r", "bloc": None, "votes": 98112}, {"key": "s", "bloc": None, "votes": 31200}]},
    {"undecided": "raw", "designEffect": 1})
poll_case(
    "proportional, blocs with A not the winner, design effect 1.3",
    {"n": 800, "moe": None, "fieldworkStart": "2024-02-26", "fieldworkEnd": "2024-03-02",
     "shares": {"k1": 36, "k2": 33, "k3": 14, "other": 5, "undecided": 12}},
    {"electionDate": "2024-03-10", "orientation": ["Y", "X"], "options": [
        {"key": "k1", "bloc": "X", "votes": 30500}, {"key": "k2", "bloc": "Y", "votes": 29800},
        {"key": "k3", "bloc": "Z", "votes": 25100}, {"key": "other", "bloc": None, "votes": 6400}]},
    {"undecided": "proportional", "designEffect": 1.3})
poll_case(
    "two-party, stated MOE, far out",
    {"n": 1500, "moe": 2.5, "fieldworkStart": "2026-08-30", "fieldworkEnd": "2026-09-06",
     "shares": {"u": 44.5, "v": 42.0, "w": 6.5, "undecided": 7}},
    {"electionDate": "2026-09-27", "orientation": ["L", "R"], "options": [
        {"key": "u", "bloc": "L", "votes": 1832000}, {"key": "v", "bloc": "R", "votes": 1790500},
        {"key": "w", "bloc": "L", "votes": 240100}]},
    {"undecided": "two_party", "designEffect": 1})

out = {
    "generator": "reference-data/metrics/make_reference.py",
    "versions": {"python": platform.python_version(), "numpy": np.__version__, "scipy": scipy.__version__,
                 "statsmodels": statsmodels.__version__},
    "z95": Z,
    "tolerance": 1e-9,
    "cases": CASES,
}
path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "reference.json")
with open(path, "w", encoding="utf-8") as f:
    json.dump(out, f, indent=2)
    f.write("\n")
print(f"wrote {len(CASES)} cases to {path}")

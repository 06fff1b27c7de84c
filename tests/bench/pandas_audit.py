"""Outside yardstick for the audit benchmark (issue 4 §6), run with Debian's /usr/bin/python3.

Reads the audited elections' rows from MariaDB with set-based queries (PyMySQL) and computes,
per poll, with pandas:
  - the reference pair: the election's orientation blocs when both stand in the contest (the
    blocs set on the election, else the two blocs with the most certified votes summed over
    its contests, larger first; a bloc with several options is represented by its option with
    the most votes), else the certified top two; ties in votes go to the smaller key;
  - the signed margin error on raw shares, (pA - pB) - (VA - VB), in points;
  - Mosteller's measure 3: mean |p_i - V_i| over the options with a share on both sides
    (undecided never), and measure 5: |(pW - pR) - (VW - VR)| on the certified top two;
  - MTK's A = ln((pA / pB) / (VA / VB)), raw shares, when all four are positive.
Certified shares are votes over the contest's total votes, in points.

Environment: DB_HOST, DB_PORT, DB_USER, DB_PASSWORD, DB_NAME; BENCH_ELECTIONS (comma-separated
election keys); BENCH_OUT (CSV file for the per-poll values). Prints one JSON line with the
seconds of each phase (from the first line of this script, pandas' import included) and counts.
"""
import time

T0 = time.perf_counter()

import json  # noqa: E402
import os  # noqa: E402

import numpy as np  # noqa: E402
import pandas as pd  # noqa: E402
import pymysql  # noqa: E402

T_IMPORTED = time.perf_counter()


def frame(cursor, sql, params):
    cursor.execute(sql, params)
    columns = [d[0] for d in cursor.description]
    return pd.DataFrame.from_records(list(cursor.fetchall()), columns=columns)


def read_rows(election_keys):
    conn = pymysql.connect(
        host=os.environ.get("DB_HOST", "127.0.0.1"),
        port=int(os.environ.get("DB_PORT", "3407")),
        user=os.environ["DB_USER"],
        password=os.environ["DB_PASSWORD"],
        database=os.environ["DB_NAME"],
        charset="utf8mb4",
    )
    try:
        with conn.cursor() as cur:
            elections = frame(cur, "SELECT id, `key`, bloc_a, bloc_b FROM elections WHERE `key` IN %s", (election_keys,))
            ids = tuple(int(x) for x in elections["id"]) or (0,)
            contests = frame(cur, "SELECT id, `key`, election_id FROM contests WHERE election_id IN %s", (ids,))
            options = frame(
                cur,
                "SELECT o.contest_id, o.`key`, o.bloc, CAST(IFNULL(o.votes, 0) AS DOUBLE) AS votes"
                " FROM options o JOIN contests k ON k.id = o.contest_id WHERE k.election_id IN %s",
                (ids,),
            )
            polls = frame(
                cur,
                "SELECT p.id, p.`key`, p.contest_id FROM polls p JOIN contests k ON k.id = p.contest_id WHERE k.election_id IN %s",
                (ids,),
            )
            shares = frame(
                cur,
                "SELECT s.poll_id, s.option_key, CAST(s.share AS DOUBLE) AS share FROM poll_shares s"
                " JOIN polls p ON p.id = s.poll_id JOIN contests k ON k.id = p.contest_id WHERE k.election_id IN %s",
                (ids,),
            )
    finally:
        conn.close()
    return elections, contests, options, polls, shares


def orientation(elections, contests, options):
    """Election id -> (bloc A, bloc B) or (None, None)."""
    blocs = options[options["bloc"].fillna("") != ""]
    blocs = blocs.merge(contests[["id", "election_id"]], left_on="contest_id", right_on="id")
    totals = blocs.groupby(["election_id", "bloc"], as_index=False)["votes"].sum()
    totals = totals[totals["votes"] > 0].sort_values(["election_id", "votes", "bloc"], ascending=[True, False, True], kind="mergesort")
    totals["rank"] = totals.groupby("election_id").cumcount()
    first = totals[totals["rank"] == 0].set_index("election_id")["bloc"]
    second = totals[totals["rank"] == 1].set_index("election_id")["bloc"]
    out = elections[["id"]].rename(columns={"id": "election_id"}).copy()
    set_both = (elections["bloc_a"].fillna("") != "") & (elections["bloc_b"].fillna("") != "")
    out["bloc_a"] = np.where(set_both.to_numpy(), elections["bloc_a"].to_numpy(), out["election_id"].map(first).to_numpy())
    out["bloc_b"] = np.where(set_both.to_numpy(), elections["bloc_b"].to_numpy(), out["election_id"].map(second).to_numpy())
    missing = out["bloc_a"].isna() | out["bloc_b"].isna()
    out.loc[missing, ["bloc_a", "bloc_b"]] = None
    return out


def reference_pairs(elections, contests, options):
    """Contest id -> refA, refB, winner, runner-up and the contest's certified total."""
    ranked = options.sort_values(["contest_id", "votes", "key"], ascending=[True, False, True], kind="mergesort").copy()
    total = ranked.groupby("contest_id")["votes"].sum()
    ranked["rank"] = ranked.groupby("contest_id").cumcount()
    winner = ranked[ranked["rank"] == 0].set_index("contest_id")["key"]
    runner = ranked[ranked["rank"] == 1].set_index("contest_id")["key"]
    ref = contests[["id", "election_id"]].rename(columns={"id": "contest_id"})
    ref = ref.merge(orientation(elections, contests, options), on="election_id", how="left")
    first_of_bloc = ranked[ranked["bloc"].fillna("") != ""].drop_duplicates(["contest_id", "bloc"])[["contest_id", "bloc", "key"]]
    ref = ref.merge(first_of_bloc.rename(columns={"bloc": "bloc_a", "key": "bloc_a_key"}), on=["contest_id", "bloc_a"], how="left")
    ref = ref.merge(first_of_bloc.rename(columns={"bloc": "bloc_b", "key": "bloc_b_key"}), on=["contest_id", "bloc_b"], how="left")
    ref["winner"] = ref["contest_id"].map(winner)
    ref["runner_up"] = ref["contest_id"].map(runner)
    ref["total"] = ref["contest_id"].map(total)
    both = ref["bloc_a_key"].notna() & ref["bloc_b_key"].notna()
    ref["ref_a"] = np.where(both, ref["bloc_a_key"], ref["winner"])
    ref["ref_b"] = np.where(both, ref["bloc_b_key"], ref["runner_up"])
    ref["basis"] = np.where(both, "blocs", "top_two")
    return ref.set_index("contest_id")


def compute(elections, contests, options, polls, shares):
    ref = reference_pairs(elections, contests, options)
    certified = options.assign(total=options["contest_id"].map(ref["total"]))
    certified = certified[certified["total"] > 0]
    certified = pd.Series(100 * certified["votes"].to_numpy() / certified["total"].to_numpy(),
                          index=pd.MultiIndex.from_arrays([certified["contest_id"], certified["key"]]))
    share = pd.Series(shares["share"].to_numpy(), index=pd.MultiIndex.from_arrays([shares["poll_id"], shares["option_key"]]))

    p = polls.rename(columns={"id": "poll_id", "key": "poll_key"})
    p = p.join(ref[["ref_a", "ref_b", "winner", "runner_up", "basis"]], on="contest_id")

    def poll_share(col):
        return share.reindex(pd.MultiIndex.from_arrays([p["poll_id"], p[col]])).to_numpy()

    def result_share(col):
        return certified.reindex(pd.MultiIndex.from_arrays([p["contest_id"], p[col]])).to_numpy()

    pa, pb, pw, pr = poll_share("ref_a"), poll_share("ref_b"), poll_share("winner"), poll_share("runner_up")
    va, vb, vw, vr = result_share("ref_a"), result_share("ref_b"), result_share("winner"), result_share("runner_up")
    p["margin_error"] = (pa - pb) - (va - vb)
    p["abs_margin_error"] = np.abs(p["margin_error"])
    p["mosteller5"] = np.abs((pw - pr) - (vw - vr))
    positive = (pa > 0) & (pb > 0) & (va > 0) & (vb > 0)
    with np.errstate(divide="ignore", invalid="ignore"):
        p["mtk_a"] = np.where(positive, np.log(pa / pb) - np.log(va / vb), np.nan)

    # Measure 3: every share whose option has a certified share (undecided never has one).
    s = shares.merge(polls[["id", "contest_id"]].rename(columns={"id": "poll_id"}), on="poll_id")
    v = certified.reindex(pd.MultiIndex.from_arrays([s["contest_id"], s["option_key"]])).to_numpy()
    s = s.assign(abs_error=np.abs(s["share"].to_numpy() - v))
    s = s[~np.isnan(v) & (s["option_key"] != "undecided")]
    p["mosteller3"] = p["poll_id"].map(s.groupby("poll_id")["abs_error"].mean())

    # A poll without a share for A or B has no metrics at all (as in the audit).
    unusable = np.isnan(pa) | np.isnan(pb) | np.isnan(va) | np.isnan(vb)
    p.loc[unusable, ["margin_error", "abs_margin_error", "mosteller3", "mosteller5", "mtk_a"]] = np.nan
    return p


def main():
    keys = tuple(k for k in os.environ["BENCH_ELECTIONS"].split(",") if k)
    out_file = os.environ["BENCH_OUT"]
    elections, contests, options, polls, shares = read_rows(keys)
    t_read = time.perf_counter()
    result = compute(elections, contests, options, polls, shares)
    t_compute = time.perf_counter()
    result[["poll_key", "ref_a", "ref_b", "basis", "margin_error", "abs_margin_error", "mosteller3", "mosteller5", "mtk_a"]].to_csv(
        out_file, index=False, float_format="%.17g"
    )
    t_end = time.perf_counter()
    print(json.dumps({
        "seconds": t_end - T0,
        "phases": {
            "import_libraries": T_IMPORTED - T0,
            "read": t_read - T_IMPORTED,
            "compute": t_compute - t_read,
            "write_csv": t_end - t_compute,
        },
        "counts": {
            "elections": len(elections), "contests": len(contests), "options": len(options), "polls": len(polls), "shares": len(shares),
            "computed": int(result["margin_error"].notna().sum()),
        },
        "versions": {"pandas": pd.__version__, "numpy": np.__version__, "pymysql": pymysql.__version__},
    }))


if __name__ == "__main__":
    main()

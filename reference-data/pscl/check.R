# Outside check of Veracast on real data: late-poll errors of the 2007 Australian House first-
# preference polls, computed straight from the pscl datasets with base R (no Veracast code).
#
# Run from the repository root, after extract.R:   Rscript reference-data/pscl/check.R
# Reads beside this script: results.csv, polls.csv, poll-origin.csv (for poll keys and a
# consistency check). Writes: expected.json.
#
# Window: a poll counts when its fieldwork ended 0 to 14 days before election day (24 Nov 2007),
# both ends included, i.e. fieldwork_end in [2007-11-10, 2007-11-24]. Every such poll counts (not
# only each firm's final one). Shares are as published (raw treatment), in points:
#   ALP share error   = pALP - VALP
#   margin error      = (pALP - pCoalition) - (VALP - VCoalition)
# with pCoalition = Liberal + National as the dataset gives them, and V = certified votes over the
# sum of all options' votes in the contest (results.csv), cross-checked against the dataset's own
# 2007 percentages.

suppressPackageStartupMessages(library(pscl))
data(AustralianElectionPolling)
data(AustralianElections)

script_dir <- function() {
  file_arg <- grep("^--file=", commandArgs(trailingOnly = FALSE), value = TRUE)
  if (length(file_arg) != 1) stop("run this file with Rscript")
  dirname(normalizePath(sub("^--file=", "", file_arg)))
}
dir <- script_dir()

ELECTION_DATE <- as.Date("2007-11-24")
WINDOW_DAYS <- 14
CONTEST_KEY <- "au-2007-house-fp"

read_plain <- function(name) {
  read.csv(file.path(dir, name), colClasses = "character", na.strings = character(0),
           check.names = FALSE, encoding = "UTF-8")
}
results <- read_plain("results.csv")
polls_csv <- read_plain("polls.csv")
origin <- read_plain("poll-origin.csv")

# ---- format checks on the extracted CSVs ------------------------------------------------------

expect_header <- function(path, header) {
  first <- readLines(file.path(dir, path), n = 1)
  if (!identical(first, paste(header, collapse = ","))) stop(path, ": header differs")
}
expect_header("results.csv", c(
  "election_key", "election_date", "election_name", "jurisdiction", "contest_key",
  "contest_name", "option_key", "option_name", "bloc", "votes", "status", "certified_on",
  "source_url"))
expect_header("polls.csv", c(
  "poll_key", "pollster", "sponsor", "contest_key", "fieldwork_start", "fieldwork_end",
  "published_on", "sample_size", "population", "mode", "moe", "option_key", "share"))

iso <- "^[0-9]{4}-[0-9]{2}-[0-9]{2}$"
for (col in c("fieldwork_start", "fieldwork_end", "published_on")) {
  v <- polls_csv[[col]]
  if (!all(grepl(iso, v)) || anyNA(as.Date(v, format = "%Y-%m-%d"))) stop("bad date in ", col)
}
for (col in c("election_date", "certified_on")) {
  if (!all(grepl(iso, results[[col]]))) stop("bad date in results ", col)
}
fs <- as.Date(polls_csv$fieldwork_start)
fe <- as.Date(polls_csv$fieldwork_end)
stopifnot(all(fe >= fs), all(fe <= ELECTION_DATE))
stopifnot(all(as.Date(polls_csv$published_on) <= ELECTION_DATE))
stopifnot(all(grepl("^[1-9][0-9]*$", polls_csv$sample_size)))
stopifnot(all(polls_csv$contest_key == CONTEST_KEY), all(results$contest_key == CONTEST_KEY))
stopifnot(all(polls_csv$population %in% c("lv", "rv", "a")))
stopifnot(all(polls_csv$mode %in% c("phone", "ivr", "online", "text", "mixed", "face", "mail")))
share_num <- as.numeric(polls_csv$share)
stopifnot(!anyNA(share_num), all(share_num >= 0))
share_sum <- tapply(share_num, polls_csv$poll_key, sum)
if (any(share_sum > 100.5)) stop("a poll's shares sum past 100.5")
stopifnot(!anyDuplicated(paste(polls_csv$poll_key, polls_csv$option_key)))
# one set of poll-level values per poll_key
poll_level <- unique(polls_csv[, c("poll_key", "pollster", "fieldwork_start", "fieldwork_end",
                                   "published_on", "sample_size", "population", "mode")])
stopifnot(!anyDuplicated(poll_level$poll_key))

# ---- certified shares -------------------------------------------------------------------------

votes <- as.numeric(results$votes)
names(votes) <- results$option_key
stopifnot(all(votes == round(votes)), all(votes >= 0))
V <- 100 * votes / sum(votes)
v_alp <- unname(V["alp"])
v_coal <- unname(V["coalition"])
res07 <- AustralianElections[AustralianElections$date == ELECTION_DATE, ]
stopifnot(nrow(res07) == 1)
stopifnot(abs(v_alp - res07$ALP) < 1e-9, abs(v_coal - (res07$LP + res07$NP)) < 1e-9)

# ---- late polls straight from the dataset -----------------------------------------------------

d <- AustralianElectionPolling
stopifnot(nrow(origin) == nrow(d), all(as.integer(origin$dataset_row) == seq_len(nrow(d))))
d$poll_key <- origin$poll_key
d$days_before <- as.numeric(ELECTION_DATE - d$endDate)
late <- d[d$days_before >= 0 & d$days_before <= WINDOW_DAYS, ]
late <- late[order(late$endDate, late$poll_key), ]

p_alp <- late$ALP
p_coal <- late$Lib + late$Nat
alp_err <- p_alp - v_alp
margin_err <- (p_alp - p_coal) - (v_alp - v_coal)
days_out_mid <- as.numeric(ELECTION_DATE - late$startDate) -
  as.numeric(late$endDate - late$startDate) / 2

# The extracted polls.csv must carry the same ALP and Coalition shares for these keys.
csv_share <- function(key, option) {
  s <- polls_csv$share[polls_csv$poll_key == key & polls_csv$option_key == option]
  if (length(s) != 1) stop("polls.csv lacks ", option, " for ", key)
  as.numeric(s)
}
stopifnot(all(abs(mapply(csv_share, late$poll_key, "alp") - p_alp) < 1e-9))
stopifnot(all(abs(mapply(csv_share, late$poll_key, "coalition") - p_coal) < 1e-9))
# and no poll in polls.csv ends in the window without being here
csv_days <- as.numeric(ELECTION_DATE - as.Date(poll_level$fieldwork_end))
csv_late <- poll_level$poll_key[csv_days >= 0 & csv_days <= WINDOW_DAYS]
stopifnot(setequal(csv_late, late$poll_key))

# ---- JSON -------------------------------------------------------------------------------------

num <- function(x) {
  s <- sprintf("%.12f", x)
  s <- sub("0+$", "", s)
  s <- sub("\\.$", "", s)
  ifelse(s == "-0", "0", s)
}
str <- function(x) paste0("\"", gsub("\"", "\\\\\"", x), "\"")

poll_entries <- vapply(seq_len(nrow(late)), function(i) {
  fields <- c(
    paste0("\"pollster\": ", str(sub(",.*$", "", as.character(late$org[i])))),
    paste0("\"org\": ", str(as.character(late$org[i]))),
    paste0("\"dataset_row\": ", as.integer(rownames(late)[i])),
    paste0("\"fieldwork_start\": ", str(format(late$startDate[i]))),
    paste0("\"fieldwork_end\": ", str(format(late$endDate[i]))),
    paste0("\"days_before_election\": ", num(late$days_before[i])),
    paste0("\"days_out_midpoint\": ", num(days_out_mid[i])),
    paste0("\"alp_share\": ", num(p_alp[i])),
    paste0("\"coalition_share\": ", num(p_coal[i])),
    paste0("\"alp_share_error\": ", num(alp_err[i])),
    paste0("\"margin_error\": ", num(margin_err[i])),
    paste0("\"abs_margin_error\": ", num(abs(margin_err[i])))
  )
  paste0("    ", str(late$poll_key[i]), ": {\n      ",
         paste(fields, collapse = ",\n      "), "\n    }")
}, character(1))

json <- c(
  "{",
  paste0("  \"description\": ", str(paste(
    "Signed errors of 2007 Australian House first-preference polls whose fieldwork ended",
    "0 to 14 days before election day; raw shares in points; A = ALP, B = Coalition")), ","),
  paste0("  \"r_version\": ", str(R.version.string), ","),
  paste0("  \"pscl_version\": ", str(as.character(packageVersion("pscl"))), ","),
  paste0("  \"command\": ", str("Rscript reference-data/pscl/check.R"), ","),
  paste0("  \"election_key\": ", str(results$election_key[1]), ","),
  paste0("  \"contest_key\": ", str(CONTEST_KEY), ","),
  paste0("  \"election_date\": ", str(format(ELECTION_DATE)), ","),
  paste0("  \"undecided_treatment\": ", str("raw"), ","),
  "  \"window\": {",
  paste0("    \"days_min\": 0,"),
  paste0("    \"days_max\": ", WINDOW_DAYS, ","),
  paste0("    \"both_ends_included\": true,"),
  paste0("    \"measured_from\": ", str("fieldwork_end"), ","),
  paste0("    \"fieldwork_end_from\": ", str(format(ELECTION_DATE - WINDOW_DAYS)), ","),
  paste0("    \"fieldwork_end_to\": ", str(format(ELECTION_DATE)), ","),
  paste0("    \"final_only\": false"),
  "  },",
  "  \"certified\": {",
  paste0("    \"alp_share\": ", num(v_alp), ","),
  paste0("    \"coalition_share\": ", num(v_coal), ","),
  paste0("    \"margin\": ", num(v_alp - v_coal), ","),
  paste0("    \"total_votes\": ", num(sum(votes))),
  "  },",
  paste0("  \"n_polls\": ", nrow(late), ","),
  paste0("  \"mean_alp_share_error\": ", num(mean(alp_err)), ","),
  paste0("  \"mean_margin_error\": ", num(mean(margin_err)), ","),
  paste0("  \"mean_abs_margin_error\": ", num(mean(abs(margin_err))), ","),
  "  \"polls\": {",
  paste0(poll_entries, c(rep(",", length(poll_entries) - 1), "")),
  "  }",
  "}"
)
writeLines(json, file.path(dir, "expected.json"))

cat(sprintf("%d polls in window; mean ALP share error %s; mean margin error %s\n",
            nrow(late), num(mean(alp_err)), num(mean(margin_err))))

# Extract the 2004-07 Australian polling archive and the 2007 House result from the R package
# pscl into Veracast's CSV layouts (SPEC.md section 3).
#
# Run from the repository root:   Rscript reference-data/pscl/extract.R
# Writes, beside this script:     results.csv, polls.csv, poll-origin.csv, provenance.json
#
# Every choice below that the data does not settle on its own is marked ASSUMPTION and is
# explained in README.md.

suppressPackageStartupMessages(library(pscl))
data(AustralianElectionPolling)
data(AustralianElections)

script_dir <- function() {
  file_arg <- grep("^--file=", commandArgs(trailingOnly = FALSE), value = TRUE)
  if (length(file_arg) != 1) stop("run this file with Rscript")
  dirname(normalizePath(sub("^--file=", "", file_arg)))
}
out_dir <- script_dir()

# ---- settings -------------------------------------------------------------------------------

ELECTION_DATE <- as.Date("2007-11-24")
ELECTION_KEY <- "au-2007-federal"
CONTEST_KEY <- "au-2007-house-fp"
# ASSUMPTION (requested for this extract): the part of 100 that a poll's named shares leave over is
# written as `undecided`. The dataset's own DK column is 0 in every row, so this remainder is in
# fact mostly other parties and independents; set this to "other" to label it that way instead.
REMAINDER_OPTION <- "other"
# ASSUMPTION: Australian voting is compulsory and the polls ask enrolled voters, so no likely-voter
# screen applies; Veracast's nearest population code is registered voters.
POPULATION <- "rv"
# Votes are derived from published percentages (2 decimals) on a nominal base of 10,000 formal
# votes: one vote = 0.01 point. The dataset holds no vote counts and no enrolment.
VOTE_BASE <- 10000
DATASET_URL <- "https://cran.r-project.org/package=pscl"

polls_raw <- AustralianElectionPolling
elections <- AustralianElections

# ---- helpers --------------------------------------------------------------------------------

# Points with at most two decimals and no trailing zeros (43.20 -> "43.2", 40.00 -> "40").
fmt_pts <- function(x) {
  s <- sprintf("%.2f", round(x, 2))
  s <- sub("0+$", "", s)
  sub("\\.$", "", s)
}

# Writes a CSV without quoting, after proving that no cell needs quoting.
write_plain_csv <- function(df, path, header) {
  stopifnot(identical(names(df), header))
  cells <- unlist(lapply(df, as.character), use.names = FALSE)
  cells[is.na(cells)] <- ""
  bad <- grepl("[,;\"\r\n]", cells)
  if (any(bad)) stop("cell needs quoting: ", cells[bad][1])
  m <- matrix(cells, ncol = ncol(df))
  lines <- c(paste(header, collapse = ","), apply(m, 1, paste, collapse = ","))
  con <- file(path, open = "wb")
  on.exit(close(con))
  writeLines(lines, con, sep = "\n", useBytes = TRUE)
}

json_str <- function(x) {
  x <- gsub("\\\\", "\\\\\\\\", x)
  x <- gsub("\"", "\\\\\"", x)
  paste0("\"", x, "\"")
}

slug <- function(x) gsub("[^a-z0-9]+", "-", tolower(x))

# ---- results: 2007 House of Representatives, first preferences -----------------------------

res_row <- elections[elections$date == ELECTION_DATE, ]
if (nrow(res_row) != 1) stop("expected exactly one 2007 row in AustralianElections")

named_pct <- c(
  alp = res_row$ALP,
  coalition = res_row$LP + res_row$NP,   # Liberal + National, one Coalition option
  greens = res_row$Green,
  democrats = res_row$Dem,
  "one-nation" = res_row$Hanson
)
if (any(is.na(named_pct))) stop("missing 2007 share in AustralianElections")
# DLP, Communist and Australia Party columns, Family First (no column) and independents all fall
# into `other`, which is what is left of 100 after the named options.
named_votes <- round(named_pct * VOTE_BASE / 100)
other_votes <- VOTE_BASE - sum(named_votes)
if (other_votes < 0) stop("named 2007 shares exceed 100")
res_votes <- c(named_votes, other = other_votes)
stopifnot(all(abs(named_votes - named_pct * VOTE_BASE / 100) < 1e-6))  # shares are exact

option_names <- c(
  alp = "Australian Labor Party",
  coalition = "Liberal-National Coalition",
  greens = "Australian Greens",
  democrats = "Australian Democrats",
  "one-nation" = "One Nation",
  other = "Other parties and independents"
)
option_blocs <- c(
  alp = "ALP", coalition = "COALITION", greens = "GREENS", democrats = "DEMOCRATS",
  "one-nation" = "ONE_NATION", other = ""
)

results <- data.frame(
  election_key = ELECTION_KEY,
  election_date = format(ELECTION_DATE),
  election_name = "2007 Australian federal election",
  jurisdiction = "Australia",
  contest_key = CONTEST_KEY,
  contest_name = "House of Representatives first preferences (national)",
  option_key = names(res_votes),
  option_name = unname(option_names[names(res_votes)]),
  bloc = unname(option_blocs[names(res_votes)]),
  votes = sprintf("%d", as.integer(res_votes)),
  status = "certified",
  certified_on = format(ELECTION_DATE),  # ASSUMPTION: the dataset has no certification date
  source_url = DATASET_URL,
  stringsAsFactors = FALSE
)
results_header <- c(
  "election_key", "election_date", "election_name", "jurisdiction", "contest_key",
  "contest_name", "option_key", "option_name", "bloc", "votes", "status", "certified_on",
  "source_url"
)
write_plain_csv(results, file.path(out_dir, "results.csv"), results_header)

# ---- polls ----------------------------------------------------------------------------------

org <- as.character(polls_raw$org)
remark <- tolower(polls_raw$remark)

# The org factor mixes house and mode ("Morgan, F2F", "Morgan, Phone"): split it.
firm <- sub(",.*$", "", org)
mode <- ifelse(org == "Morgan, F2F", "face",
        ifelse(org == "Morgan, Phone", "phone",
        ifelse(grepl("on-?line", remark), "online",
        ifelse(grepl("phone", remark), "phone",
        ifelse(grepl("face", remark), "face",
               "phone")))))  # ASSUMPTION: Newspoll, Nielsen, Galaxy polled by telephone
# A remark must never contradict the mode taken from the org label.
stopifnot(!any(org == "Morgan, F2F" & grepl("phone|on-?line", remark)))
stopifnot(!any(org == "Morgan, Phone" & grepl("face|on-?line", remark)))

if (any(is.na(polls_raw[, c("ALP", "Lib", "Nat", "Green", "FamilyFirst", "Dems", "OneNation",
                            "DK", "sampleSize", "startDate", "endDate")]))) {
  stop("unexpected missing value in AustralianElectionPolling")
}
stopifnot(all(polls_raw$DK == 0))
stopifnot(all(polls_raw$startDate <= polls_raw$endDate))
stopifnot(all(polls_raw$endDate <= ELECTION_DATE))
# All 239 polls fall after the 2004 election (9 Oct 2004), so all are polls of the 2007 contest.
stopifnot(all(polls_raw$startDate > as.Date("2004-10-09")))

end_stamp <- format(polls_raw$endDate, "%Y%m%d")
poll_key <- paste("au07", slug(firm), mode, end_stamp, sep = "-")
if (anyDuplicated(poll_key)) stop("poll keys collide: ", poll_key[duplicated(poll_key)][1])

# Shares per option. A zero means the option was not reported on its own (most firms fold minor
# parties into "others"), so zero-valued minor options are left out rather than written as 0.
# Family First has no certified counterpart in the dataset; it is written as `other`.
share_cols <- list(
  alp = polls_raw$ALP,
  coalition = polls_raw$Lib + polls_raw$Nat,
  greens = polls_raw$Green,
  democrats = polls_raw$Dems,
  "one-nation" = polls_raw$OneNation,
  other = polls_raw$FamilyFirst
)
stopifnot(all(share_cols$alp > 0), all(share_cols$coalition > 0))
named_sum <- Reduce(`+`, share_cols)
if (any(named_sum > 100.5)) stop("a poll's named shares exceed 100.5")

sample_size <- round(polls_raw$sampleSize)  # ASSUMPTION: nearest integer (see README)
stopifnot(all(sample_size > 0))

rows <- list()
for (i in seq_len(nrow(polls_raw))) {
  shares <- vapply(share_cols, function(col) col[i], numeric(1))
  keep <- shares > 0 | names(shares) %in% c("alp", "coalition")
  shares <- shares[keep]
  remainder <- round(100 - sum(shares), 2)
  if (remainder > 0) {
    if (REMAINDER_OPTION %in% names(shares)) {
      shares[REMAINDER_OPTION] <- shares[REMAINDER_OPTION] + remainder
    } else {
      shares[REMAINDER_OPTION] <- remainder
    }
  }
  rows[[i]] <- data.frame(
    poll_key = poll_key[i],
    pollster = firm[i],
    sponsor = "",
    contest_key = CONTEST_KEY,
    fieldwork_start = format(polls_raw$startDate[i]),
    fieldwork_end = format(polls_raw$endDate[i]),
    published_on = format(polls_raw$endDate[i]),  # ASSUMPTION: no publication date in the data
    sample_size = sprintf("%d", as.integer(sample_size[i])),
    population = POPULATION,
    mode = mode[i],
    moe = "",
    option_key = names(shares),
    share = fmt_pts(unname(shares)),
    stringsAsFactors = FALSE
  )
}
polls <- do.call(rbind, rows)
polls_header <- c(
  "poll_key", "pollster", "sponsor", "contest_key", "fieldwork_start", "fieldwork_end",
  "published_on", "sample_size", "population", "mode", "moe", "option_key", "share"
)
write_plain_csv(polls, file.path(out_dir, "polls.csv"), polls_header)

# Trace from each poll_key back to the dataset row and the columns the layout has no room for.
origin <- data.frame(
  poll_key = poll_key,
  dataset_row = seq_len(nrow(polls_raw)),
  org = org,
  sample_size_raw = as.character(polls_raw$sampleSize),
  named_sum = fmt_pts(named_sum),
  remark = polls_raw$remark,
  source = polls_raw$source,
  stringsAsFactors = FALSE
)
con <- file(file.path(out_dir, "poll-origin.csv"), open = "wb")
write.csv(origin, con, row.names = FALSE, fileEncoding = "UTF-8")
close(con)

# ---- provenance -----------------------------------------------------------------------------

deb_version <- tryCatch(
  system2("dpkg-query", c("-W", shQuote("-f=${Version}"), "r-cran-pscl"),
          stdout = TRUE, stderr = FALSE),
  error = function(e) "", warning = function(w) ""
)
if (length(deb_version) != 1) deb_version <- ""
md5 <- tools::md5sum(file.path(out_dir, c("results.csv", "polls.csv", "poll-origin.csv")))
desc <- packageDescription("pscl")

prov <- c(
  "{",
  paste0("  \"package\": ", json_str("pscl"), ","),
  paste0("  \"package_version\": ", json_str(as.character(packageVersion("pscl"))), ","),
  paste0("  \"package_date\": ", json_str(desc$Date), ","),
  paste0("  \"debian_package\": ", json_str(paste0("r-cran-pscl ", deb_version)), ","),
  paste0("  \"license\": ", json_str(desc$License), ","),
  paste0("  \"r_version\": ", json_str(R.version.string), ","),
  paste0("  \"datasets\": [", json_str("AustralianElectionPolling"), ", ",
         json_str("AustralianElections"), "],"),
  paste0("  \"dataset_url\": ", json_str(DATASET_URL), ","),
  paste0("  \"polls_in_dataset\": ", nrow(polls_raw), ","),
  paste0("  \"poll_rows_written\": ", nrow(polls), ","),
  paste0("  \"election_key\": ", json_str(ELECTION_KEY), ","),
  paste0("  \"contest_key\": ", json_str(CONTEST_KEY), ","),
  paste0("  \"vote_base\": ", VOTE_BASE, ","),
  paste0("  \"remainder_option\": ", json_str(REMAINDER_OPTION), ","),
  paste0("  \"population\": ", json_str(POPULATION), ","),
  "  \"md5\": {",
  paste0("    ", json_str(basename(names(md5))), ": ", json_str(unname(md5)),
         c(rep(",", length(md5) - 1), "")),
  "  },",
  paste0("  \"command\": ", json_str("Rscript reference-data/pscl/extract.R")),
  "}"
)
writeLines(prov, file.path(out_dir, "provenance.json"))

cat(sprintf("results.csv: %d rows; polls.csv: %d rows for %d polls\n",
            nrow(results), nrow(polls), length(unique(polls$poll_key))))

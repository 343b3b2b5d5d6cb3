// The report of a ranking (rank.hpp): the table, the JSON object and the lines about files
// that were not ranked, shared by `terzo rank` and any other front end.
#pragma once

#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "core/analysis/rank.hpp"

namespace terzo {

/// The ranking as a table: rank, value, notes, file, description (empty when nothing ranked).
std::string ranking_text(const Ranking& r, RankMetric metric);
/// One JSON object: metric, files, ranked, failed, skipped, cancelled.
nlohmann::ordered_json ranking_json(const Ranking& r, RankMetric metric);
/// The lines after the table (each ending in a newline): failures, the skipped files when
/// list_skipped, the counts, a note on descriptions that are not plain text, and a word on
/// cancelling. JSON carries the same facts, so with json only the counts and notes are given.
/// timed_out: the ranking was stopped by the caller's time limit rather than by Ctrl-C.
std::string ranking_messages(const Ranking& r, RankMetric metric, bool list_skipped, bool json, bool timed_out = false);

} // namespace terzo

// Ranking a set of tunings by one metric: .scl files named directly or found in folders
// (recursively), each read and measured on its own, best (lowest) first. A file that cannot
// be read or measured is reported with its error and the others are still ranked.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

#include "core/analysis/search.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// What a ranking sorts by; all are "lower is better".
enum class RankMetric {
    mean_fifth, worst_fifth,             ///< |cents from 3/2| over the keys (12 notes)
    mean_major_third, worst_major_third, ///< |cents from 5/4| (12 notes)
    mean_minor_third, worst_minor_third, ///< |cents from 6/5| (12 notes)
    wolves,                              ///< number of wolf fifths and thirds (12 notes)
    fit,                                 ///< the resultant fit of every dyad in one period (any size)
};
/// "mean-fifth", "worst-major-third", "wolves", "fit" …
std::string rank_metric_name(RankMetric m);
/// The accepted names, comma-separated, for help texts.
std::string rank_metric_names();
/// Parses a metric name; InputError at source otherwise.
RankMetric parse_rank_metric(std::string_view text, const std::string& source);

/// Most files one ranking reads.
inline constexpr std::size_t max_rank_files = 1000000;

/// A tuning that was ranked.
struct RankEntry {
    std::string path;
    std::string description;
    std::size_t notes = 0;
    double value = 0;
};
/// A file or argument that could not be ranked, with the error as terzo prints it.
struct RankFailure {
    std::string path;
    std::string message; ///< "path:line:col: error: …"
};
struct Ranking {
    std::vector<RankEntry> entries;    ///< best first; ties by path
    std::vector<RankFailure> failures; ///< unreadable, in path order
    std::vector<RankFailure> skipped;  ///< read, but the metric does not apply (e.g. not 12 notes)
    std::size_t files = 0;             ///< files found
    bool cancelled = false;
};

/// The files a ranking reads: a file argument as given (any extension), a folder's files
/// ending in .scl (any case) at any depth, each list sorted by path. An argument that does not
/// exist, or a folder that cannot be read or holds no .scl file, becomes a failure. InputError at "FILES" when more
/// than max_rank_files are found.
std::vector<std::string> collect_tunings(const std::vector<std::string>& arguments, std::vector<RankFailure>& failures);
/// The metric of one tuning; InputError (naming `name`) when it does not apply, e.g. a key
/// metric of a tuning that is not 12 notes.
double measure_tuning(const Scale& scale, RankMetric metric, const std::string& name);
/// Reads, measures and sorts; uses control.threads threads and reports files done.
Ranking rank_tunings(const std::vector<std::string>& arguments, RankMetric metric, const SearchControl& control);

} // namespace terzo

// A comparison of tunings as a report: per-key tables, the summary across tunings, wolves,
// interval classes, JSON with the keys documented in the README, and SVG plots (per-key bars
// of third deviations side by side, and each tuning's circle of fifths).
#pragma once

#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <vector>

#include "core/analysis/compare.hpp"
#include "core/report/svg.hpp"
#include "core/report/table.hpp"

namespace terzo {

/// Everything `terzo compare` reports about one tuning.
struct ComparedTuning {
    std::string name; ///< the TUNING argument
    std::string description;
    std::size_t size = 0;              ///< degrees
    std::optional<KeyComparison> keys; ///< only for 12-note tunings
    std::vector<IntervalClass> classes;
};

/// Most tunings one comparison takes.
constexpr std::size_t max_compared_tunings = 12;

/// One tuning's keys: key, notes, then cents from pure and beats/s of the fifth, major and
/// minor third, and the fit when computed.
Table key_table(const KeyComparison& c, Spelling spelling);
/// Every tuning's keys in one long table (first column: tuning), for CSV.
Table keys_long_table(const std::vector<ComparedTuning>& tunings, Spelling spelling);
/// One row per 12-note tuning: mean and worst |cents| of fifths and thirds, pure counts,
/// wolves, mean fit.
Table summary_table(const std::vector<ComparedTuning>& tunings);
/// One row per wolf of every tuning.
Table wolves_table(const std::vector<ComparedTuning>& tunings, Spelling spelling);
/// Interval classes of every tuning: tuning, steps, cents, exact value, count, nearest
/// simple ratio, cents from it.
Table classes_table(const std::vector<ComparedTuning>& tunings);

/// The whole comparison as JSON (keys documented in the README).
nlohmann::ordered_json compare_json(const std::vector<ComparedTuning>& tunings,
                                    const CompareOptions& options, int odd_limit,
                                    Spelling spelling);

/// The plots; throws InputError at "--svg" when no tuning has 12 notes.
std::string compare_svg(const std::vector<ComparedTuning>& tunings, Spelling spelling);

} // namespace terzo

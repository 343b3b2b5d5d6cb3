// The reports of the four searches (search.hpp): terminal text and JSON, made from the
// results alone so that `terzo search` and the window show the same tables; and the .scl
// files of the results, each recording the search that produced it.
#pragma once

#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "core/analysis/search.hpp"
#include "core/arith/pitch.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// "cost: 1.00 x rms of the major thirds' deviations" and the constraints line, each ending in
/// a newline.
std::string describe_cost(const Cost& cost);
/// "3/2, 5/4 (4 generators) x2.00": the targets as the reports name them.
std::string target_header(const TargetCost& cost);

/// A circulating search as reported: the exhaustive search, and the continuous one built on
/// it when `continuous` is set.
struct CirculatingReport {
    const CirculatingSpace& space;
    const CostModel& model;
    const CirculatingSearch& exhaustive;
    const ContinuousSearch* continuous = nullptr;
    bool cancelled() const;
};
/// The header, the results table and its legend.
std::string circulating_text(const CirculatingReport& r);
/// One JSON object; scl_files (when not null) comes first, as the files the CLI wrote.
nlohmann::ordered_json circulating_json(const CirculatingReport& r, const std::vector<std::string>* scl_files);
/// The results' tunings (exact for the exhaustive search, cents-only for the continuous).
std::vector<Scale> circulating_scales(const CirculatingReport& r);

struct Rank2Report {
    const TargetCost& cost;
    Pitch period;
    int generators = 11;
    const std::vector<Rank2Result>& results;
};
std::string rank2_text(const Rank2Report& r);
nlohmann::ordered_json rank2_json(const Rank2Report& r, const std::vector<std::string>* scl_files);
std::vector<Scale> rank2_scales(const Rank2Report& r);

struct EqualReport {
    const TargetCost& cost;
    Pitch period;
    int max_steps = 72;
    const std::vector<EqualResult>& results;
};
std::string equal_text(const EqualReport& r);
nlohmann::ordered_json equal_json(const EqualReport& r, const std::vector<std::string>* scl_files);
/// Throws InputError at "--write-scl" when a result has more steps than a scale may have
/// (max_scale_size); the table and JSON show such results, only their .scl cannot be made.
std::vector<Scale> equal_scales(const EqualReport& r);

/// The .scl texts of search results named <stem>-01.scl, <stem>-02.scl …: each file's comments
/// record `parameters` (the search as given) and the header of the report, so that a file can
/// be traced back to the search that made it.
struct NamedText {
    std::string name, text;
};
std::vector<NamedText> search_scl_files(const std::string& stem, const std::vector<Scale>& scales,
                                        const std::vector<std::string>& comments);

} // namespace terzo

// The proposals of `terzo suggest` as reports: a terminal table and the JSON document (keys
// documented in docs/suggest.md and kept stable). CLI and window print proposals through these.
#pragma once

#include <cstddef>
#include <ostream>
#include <string>

#include <nlohmann/json.hpp>

#include "core/analysis/suggest.hpp"

namespace terzo {

/// What a suggest report covers: the request and its results.
struct SuggestReport {
    const Keyboard* keyboard = nullptr;
    SuggestOptions options;
    Suggestions results;
    std::string candidates;   ///< the SPEC as given
    std::size_t top = 10;     ///< proposals shown per list
    bool removals = false;    ///< --remove was asked for
};

/// A candidate as text: its ratio ("7/4"), its exact value ("2^(5/31)") or its cents ("350.000 c").
std::string candidate_label(const Pitch& pitch);

/// {"fit", "order", "span", "partials", "ref_hz", "pitch_floor_hz", "near_cents",
///  "candidates", "add": [...], "remove": [...]}, each list best first and cut to `top`.
nlohmann::ordered_json suggest_json(const SuggestReport& report);

/// The human-readable report: the scale's fit, the best additions and removals, a legend.
void write_suggest_text(std::ostream& out, const SuggestReport& report);

} // namespace terzo

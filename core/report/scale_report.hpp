// A scale as a report: the degree table of "terzo inspect" and its JSON form, with the keys
// documented in the README. Both front ends print scales through these.
#pragma once

#include <nlohmann/json.hpp>

#include "core/report/table.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// {"cents", "ratio" (string or null), "exact", "value"} for one pitch.
nlohmann::ordered_json pitch_json(const Pitch& p);
/// {"description", "size", "period": {...}, "degrees": [{"index", ...}, ...]}.
nlohmann::ordered_json scale_json(const Scale& scale);
/// Rows: degree index, exact value (ratio or prime powers; "~" for cents-only), cents to
/// three decimals, and the step in cents from the previous degree; the period comes last.
Table degree_table(const Scale& scale);

} // namespace terzo

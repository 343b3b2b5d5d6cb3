// Changing a scale that already exists: rotate it to start on another degree (a mode),
// move its pattern up by some degrees (transposing a 12-note temperament to another key),
// stretch or shrink its period, or keep a subset of its degrees. Exact values stay exact.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "core/tuning/scale.hpp"

namespace terzo {

/// The mode starting on degree k (0 <= k < size): degree i becomes degree k+i over degree k,
/// wrapping round the period.
Scale rotate_to_degree(const Scale& scale, std::size_t k, std::string description);
/// The same pattern of steps moved up k degrees (0 <= k < size): the degree that was the
/// unison's step pattern now starts k degrees higher. Equals the mode on degree size-k.
Scale transpose_pattern(const Scale& scale, std::size_t k, std::string description);
/// Every degree d = period^x becomes new_period^x. Exact when d is an exact rational power
/// of an exact period and new_period is exact; otherwise cents-only (by proportion).
Scale stretch_period(const Scale& scale, const Pitch& new_period, std::string description);
/// The degrees at the given indexes (strictly increasing, each < size; 0 is kept whether
/// listed or not), with the same period.
Scale keep_degrees(const Scale& scale, const std::vector<std::size_t>& indexes,
                   std::string description);

} // namespace terzo

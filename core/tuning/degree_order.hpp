// Degree order: a scale file lists its degrees in the order it likes, but a keyboard needs
// them rising inside the period. These functions say what is out of place (so it can be
// stated when the tuning is read) and give the degrees sorted by pitch (for key maps).
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "core/tuning/scale.hpp"

namespace terzo {

/// One degree out of place, with a sentence such as "degree 5 (11/8) is lower than degree 4
/// (3/2)". degree is the degree's index as written (1 is the file's first pitch).
struct DegreeOrderProblem {
    std::size_t degree = 0;
    std::string message;
};

/// Degrees below 1/1 or equal to it, at or above the period, or not above the degree before
/// them, in the order written; empty for a scale that rises inside its period.
std::vector<DegreeOrderProblem> degree_order_problems(const Scale& scale);

/// A scale whose degrees are brought into [1/1, period) exactly and sorted by pitch (ties keep
/// their written order), with file_degree[i] = the written index of sorted degree i.
struct SortedScale {
    Scale scale;
    std::vector<std::size_t> file_degree;
};
SortedScale sort_by_pitch(const Scale& scale);

} // namespace terzo

// Internal to the four searches (search_*.cpp): the constants of the circle of fifths, the
// checks every search runs on its control and result count, and the statistic of target
// errors shared by the rank-2 and equal-division searches. Not part of the public surface.
#pragma once

#include <cstddef>
#include <limits>
#include <vector>

#include "core/analysis/search.hpp"

namespace terzo::detail {

constexpr double S = syntonic_comma_cents;
constexpr double P = pythagorean_comma_cents;
constexpr double F = pure_fifth_cents;
constexpr double kInf = std::numeric_limits<double>::infinity();

/// Pitch class reached after i fifths from C: fifth i of the circle starts there.
constexpr int pc_of(int i) { return 7 * i % 12; }

/// InputError at "--threads" or "--top" for a thread count or result count out of range.
void check_control(const SearchControl& control, std::size_t top);

/// The weighted statistic (cost.statistic) of the targets' errors in cents.
double target_statistic(const TargetCost& cost, const std::vector<TargetError>& errors);

} // namespace terzo::detail

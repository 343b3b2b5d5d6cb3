// Just-intonation constructions, all exact rationals: segments of the harmonic and
// subharmonic series, the tonality diamond of a set of odd numbers, and product sets (every
// product of k factors chosen from a set). The callers check sizes against the recipe limits.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "core/tuning/scale.hpp"

namespace terzo {

/// Harmonics low, low+1 … high over low: degrees n/low, period high/low (1 <= low < high).
Scale harmonic_segment(std::int64_t low, std::int64_t high, std::string description);
/// The mirror image: high/n for n = high … low, period high/low (1 <= low < high).
Scale subharmonic_segment(std::int64_t low, std::int64_t high, std::string description);
/// Every a/b for a, b in the set, brought into the octave, without duplicates, sorted.
Scale tonality_diamond(const std::vector<std::int64_t>& odds, std::string description);
/// Number of ways to choose k of n (n <= 64), or -1 when it exceeds limit.
std::int64_t choose_count(int n, int k, std::int64_t limit);
/// The products of every choice of k factors (by position) from the set, each divided by the
/// smallest such product and brought into the octave; without duplicates, sorted.
Scale product_set(int k, const std::vector<std::int64_t>& factors, std::string description);

} // namespace terzo

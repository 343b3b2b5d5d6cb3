// Test support: scales built in code or read from .scl text, shared by every layer's tests.
#pragma once

#include <sstream>
#include <string>
#include <vector>

#include "core/arith/pitch.hpp"
#include "core/tuning/scl.hpp"
#include "core/tuning/scale.hpp"

namespace terzo::test {

/// A scale read from the text of a .scl file (named "test.scl" in messages).
inline Scale scl_text(const std::string& text) {
    std::istringstream in(text);
    return read_scl(in, "test.scl");
}

/// A scale of ratios (degree 0 implied) and a 2/1 period unless given.
inline Scale ratio_scale(std::vector<std::pair<long, long>> ratios, Ratio period = Ratio(2)) {
    std::vector<Pitch> d;
    for (auto [n, m] : ratios) d.push_back(Pitch::from_ratio(Ratio(n, m)));
    return Scale("ratios", d, Pitch::from_ratio(period));
}

/// The 5-limit just chromatic scale of tests/analysis/data/just12.scl.
inline Scale just12() {
    return ratio_scale({{16, 15}, {9, 8}, {6, 5}, {5, 4}, {4, 3}, {45, 32}, {3, 2}, {8, 5},
                        {5, 3}, {9, 5}, {15, 8}});
}

/// n equal divisions of 2/1 as exact tempered steps 2^(k/n).
inline Scale equal_division(int n) {
    std::vector<Pitch> d;
    for (int k = 1; k < n; ++k) d.push_back(Pitch::from_vector(PrimeVector::prime_power(2, Ratio(k, n))));
    return Scale("equal", d, Pitch::from_ratio(Ratio(2)));
}

/// The same steps known only by their cents (as a .scl file with "400.0" lines gives them).
inline Scale equal_division_cents(int n) {
    std::vector<Pitch> d;
    for (int k = 1; k < n; ++k) d.push_back(Pitch::from_cents(1200.0 * k / n));
    return Scale("equal, cents", d, Pitch::from_cents(1200.0));
}

} // namespace terzo::test

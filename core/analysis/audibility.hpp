// An estimate of how audible a combination tone is for two loud pure primaries, built from
// published psychoacoustic findings (sources in audibility.cpp and the README). It is a
// rough relative weight in [0, 1], not a loudness: an estimate, and labelled so everywhere.
#pragma once

#include "core/analysis/combination.hpp"

namespace terzo {

/// Relative audibility estimate in [0, 1] of term (a, b) for primaries f_low < f_high (Hz).
double audibility(const CombinationTerm& term, double f_low, double f_high);

/// The same for a tone between partials: the primaries are the two partials (in whichever
/// order they fall), each weighted by 1/harmonic number (an assumed spectrum).
double audibility(const CombinationTerm& term, double f_low, double f_high, int low_partial,
                  int high_partial);

} // namespace terzo

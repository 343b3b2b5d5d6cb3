// A tuning's fit: one number summarising how well its combination tones land on its own notes
// (lower is better). Defined here, once: the weighted root mean square of landing deviations in
// cents, each tone weighted by fit_weight().
#pragma once

#include <cstddef>
#include <vector>

#include "core/analysis/combination.hpp"

namespace terzo {

struct Fit {
    double rms_cents = 0.0;   ///< sqrt(sum w*d^2 / sum w); 0 when no tone has weight
    double total_weight = 0.0;
    std::size_t tones = 0;    ///< tones with non-zero weight
    std::size_t exact = 0;    ///< of those, landings proven exact
};

/// Weight of one tone: its audibility estimate divided by (order - 1), so higher orders count less.
double fit_weight(const Tone& tone);

/// The fit summed dyad by dyad, for tones that are not kept.
class FitSum {
public:
    void add(const DyadTones& dyad);
    Fit result() const;

private:
    Fit fit_;
    double sum_ = 0.0; // sum of w*d^2
};

/// The fit over a set of dyads (every dyad of a keyboard, or the pairs of a chord).
Fit fit(const std::vector<DyadTones>& dyads);

/// The fit of every dyad of the keyboard, computed dyad by dyad without keeping the tones.
Fit keyboard_fit(const Keyboard& keyboard, const ToneOptions& options);

} // namespace terzo

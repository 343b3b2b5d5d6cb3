// A tuning's fit: one number summarising how well its combination tones land on its own notes
// (lower is better). Defined here, once: the weighted root mean square of landing deviations in
// cents, each tone weighted by fit_weight().
#pragma once

#include <cstddef>
#include <vector>

#include "core/analysis/combination.hpp"

namespace terzo {

/// The lower limit of pitch perception: tones below about 20 Hz are not heard as a pitch but,
/// at most, as beating or pressure (common practice, no source; ISO 7196:1995 calls sound
/// below 20 Hz infrasound and ISO 226:2003's equal-loudness contours start at 20 Hz, both
/// from memory). The fit leaves such tones out when asked to (FitOptions::pitch_floor_hz).
inline constexpr double pitch_perception_floor_hz = 20.0;

struct FitOptions {
    /// Tones below this frequency (Hz) get weight 0. 0 counts every tone (the default of
    /// `terzo resultants` and of every caller that does not ask).
    double pitch_floor_hz = 0.0;
};

struct Fit {
    double rms_cents = 0.0;   ///< sqrt(sum w*d^2 / sum w); 0 when no tone has weight
    double total_weight = 0.0;
    std::size_t tones = 0;    ///< tones with non-zero weight
    std::size_t exact = 0;    ///< of those, landings proven exact
};

/// Weight of a tone of `term` at `hz` with audibility estimate `audibility`: the estimate
/// divided by (order - 1), so higher orders count less; 0 below options.pitch_floor_hz.
inline double fit_weight(const CombinationTerm& term, double audibility, double hz,
                         const FitOptions& options = {}) {
    if (hz < options.pitch_floor_hz) return 0.0;
    return audibility / (term.order() - 1);
}
/// The same for one computed tone.
double fit_weight(const Tone& tone, const FitOptions& options = {});

/// The fit summed dyad by dyad, for tones that are not kept.
class FitSum {
public:
    explicit FitSum(FitOptions options = {}) : options_(options) {}
    void add(const DyadTones& dyad);
    Fit result() const;

private:
    FitOptions options_;
    Fit fit_;
    double sum_ = 0.0; // sum of w*d^2
};

/// The fit over a set of dyads (every dyad of a keyboard, or the pairs of a chord).
Fit fit(const std::vector<DyadTones>& dyads, const FitOptions& options = {});

/// Throws InputError naming "--pitch-floor" unless 0 <= pitch_floor_hz <= 20000 Hz.
void check_fit_options(const FitOptions& options);

/// The fit of every dyad of the keyboard, computed dyad by dyad without keeping the tones.
Fit keyboard_fit(const Keyboard& keyboard, const ToneOptions& options);

} // namespace terzo

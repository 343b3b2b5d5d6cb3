#include "core/analysis/fit.hpp"

#include <cmath>
#include <sstream>

namespace terzo {

double fit_weight(const Tone& tone, const FitOptions& options) {
    return fit_weight(tone.term, tone.audibility, tone.hz, options);
}

Fit fit(const std::vector<DyadTones>& dyads, const FitOptions& options) {
    Fit f;
    double sum = 0.0;
    for (const auto& d : dyads)
        for (const auto& t : d.tones) {
            const double w = fit_weight(t, options);
            if (w <= 0.0) continue;
            sum += w * t.landing.deviation_cents * t.landing.deviation_cents;
            f.total_weight += w;
            ++f.tones;
            if (t.landing.exact) ++f.exact;
        }
    if (f.total_weight > 0.0) f.rms_cents = std::sqrt(sum / f.total_weight);
    return f;
}

void check_fit_options(const FitOptions& options) {
    // 20 kHz: the upper end of the audio band; a floor above it would leave no tone at all.
    if (!(options.pitch_floor_hz >= 0.0 && options.pitch_floor_hz <= 20000.0)) {
        std::ostringstream value;
        value << options.pitch_floor_hz;
        fail({"--pitch-floor"}, "pitch floor " + value.str() + " Hz is outside the allowed range 0 to 20000 Hz");
    }
}

} // namespace terzo

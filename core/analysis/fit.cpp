#include "core/analysis/fit.hpp"

#include <cmath>
#include <sstream>

namespace terzo {

double fit_weight(const Tone& tone, const FitOptions& options) {
    return fit_weight(tone.term, tone.audibility, tone.hz, options);
}

void check_fit_options(const FitOptions& options) {
    // 20 kHz: the upper end of the audio band; a floor above it would leave no tone at all.
    if (!(options.pitch_floor_hz >= 0.0 && options.pitch_floor_hz <= 20000.0)) {
        std::ostringstream value;
        value << options.pitch_floor_hz;
        fail({"--pitch-floor"}, "pitch floor " + value.str() + " Hz is outside the allowed range 0 to 20000 Hz");
    }
}

void FitSum::add(const DyadTones& dyad) {
    for (const auto& t : dyad.tones) {
        const double w = fit_weight(t, options_);
        if (w <= 0.0) continue;
        sum_ += w * t.landing.deviation_cents * t.landing.deviation_cents;
        fit_.total_weight += w;
        ++fit_.tones;
        if (t.landing.exact) ++fit_.exact;
    }
}

Fit FitSum::result() const {
    Fit f = fit_;
    if (f.total_weight > 0.0) f.rms_cents = std::sqrt(sum_ / f.total_weight);
    return f;
}

Fit fit(const std::vector<DyadTones>& dyads, const FitOptions& options) {
    FitSum sum(options);
    for (const auto& d : dyads) sum.add(d);
    return sum.result();
}

Fit keyboard_fit(const Keyboard& keyboard, const ToneOptions& options) {
    FitSum sum;
    for_each_keyboard_dyad(keyboard, options, [&](const DyadTones& d) { sum.add(d); });
    return sum.result();
}

} // namespace terzo

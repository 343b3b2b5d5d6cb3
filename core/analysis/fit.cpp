#include "core/analysis/fit.hpp"

#include <cmath>

namespace terzo {

double fit_weight(const Tone& tone) { return tone.audibility / (tone.term.order() - 1); }

void FitSum::add(const DyadTones& dyad) {
    for (const auto& t : dyad.tones) {
        const double w = fit_weight(t);
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

Fit fit(const std::vector<DyadTones>& dyads) {
    FitSum sum;
    for (const auto& d : dyads) sum.add(d);
    return sum.result();
}

Fit keyboard_fit(const Keyboard& keyboard, const ToneOptions& options) {
    FitSum sum;
    for_each_keyboard_dyad(keyboard, options, [&](const DyadTones& d) { sum.add(d); });
    return sum.result();
}

} // namespace terzo

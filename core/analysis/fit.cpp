#include "core/analysis/fit.hpp"

#include <cmath>

namespace terzo {

double fit_weight(const Tone& tone) { return tone.audibility / (tone.term.order() - 1); }

Fit fit(const std::vector<DyadTones>& dyads) {
    Fit f;
    double sum = 0.0;
    for (const auto& d : dyads)
        for (const auto& t : d.tones) {
            const double w = fit_weight(t);
            if (w <= 0.0) continue;
            sum += w * t.landing.deviation_cents * t.landing.deviation_cents;
            f.total_weight += w;
            ++f.tones;
            if (t.landing.exact) ++f.exact;
        }
    if (f.total_weight > 0.0) f.rms_cents = std::sqrt(sum / f.total_weight);
    return f;
}

} // namespace terzo

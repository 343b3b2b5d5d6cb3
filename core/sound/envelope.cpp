#include "core/sound/envelope.hpp"

#include <algorithm>
#include <cmath>

namespace terzo {

// g(u) = (1 - cos(pi u)) / 2: continuous with zero slope at u = 0 and u = 1, so neither
// the start nor the end of a ramp has a corner (a corner in the envelope is heard as a click).
double ramp_gain(double u) {
    if (u <= 0.0) return 0.0;
    if (u >= 1.0) return 1.0;
    return 0.5 - 0.5 * std::cos(M_PI * u);
}

void apply_envelope(std::vector<double>& samples, const Envelope& envelope, double sample_rate) {
    const std::size_t n = samples.size();
    auto ramp_frames = [&](double seconds) {
        return std::min<std::size_t>(n,
                                     static_cast<std::size_t>(std::llround(seconds * sample_rate)));
    };
    const std::size_t a = ramp_frames(envelope.attack_s), r = ramp_frames(envelope.release_s);
    // Sample i of an a-frame ramp sits at u = i / a, so the first sample is exactly silent.
    for (std::size_t i = 0; i < a; ++i)
        samples[i] *= ramp_gain(double(i) / double(a));
    // The release mirrors the attack: the last sample is exactly silent.
    for (std::size_t i = 0; i < r; ++i)
        samples[n - 1 - i] *= ramp_gain(double(i) / double(r));
}

} // namespace terzo

#include "core/io/pcm.hpp"

#include <cmath>

namespace terzo {

// Rounding to nearest keeps the quantisation error within half a step and unbiased
// (libsndfile 1.2.0's own clipping conversion rounds down, measured: 0.9 of a step becomes
// 0 and -0.3 becomes -1, an offset of half a step). std::nearbyint rounds halves to even in
// the default floating-point rounding mode.
std::vector<std::int16_t> to_pcm16(const std::vector<double>& samples) {
    std::vector<std::int16_t> out(samples.size());
    for (std::size_t i = 0; i < samples.size(); ++i) {
        const double v = std::nearbyint(samples[i] * 32768.0);
        out[i] = v >= 32767.0    ? std::int16_t(32767)
                 : v <= -32768.0 ? std::int16_t(-32768)
                                 : std::int16_t(v);
    }
    return out;
}

} // namespace terzo

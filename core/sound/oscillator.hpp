// A driven nonlinear oscillator as a model of a nonlinear ear with memory:
//     x'' + (w0 / Q) x' + w0^2 (x + c2 x^2 + c3 x^3) = w0^2 u(t),
// u the input, x the output, w0 = 2 pi resonance_hz. Below the resonance x follows u (static
// gain 1) plus the combination tones the x^2 and x^3 terms create. A model, not any ear.
#pragma once

#include <vector>

namespace terzo {

/// Parameters of the oscillator. The defaults put a broad resonance (Q about 0.7, nearly
/// flat response below it) above the usual range of notes.
struct Oscillator {
    double resonance_hz = 2000.0; ///< w0 / (2 pi)
    double q = 0.7;               ///< quality factor; damping gamma = w0 / Q
    double c2 = 0.2;              ///< quadratic stiffness, relative to the linear w0^2
    double c3 = 0.3;              ///< cubic stiffness, relative to the linear w0^2
};

/// |x| beyond which the oscillator counts as diverged (with c2^2 > 3 c3 the potential has a
/// second, lower side and a strong drive can push x over the barrier and away).
inline constexpr double oscillator_divergence_bound = 100.0;

/// x(t) at every input sample, starting at rest. Throws InputError (source "--model") if x
/// grows past oscillator_divergence_bound.
std::vector<double> drive_oscillator(const std::vector<double>& input, const Oscillator& osc,
                                     double sample_rate);

} // namespace terzo

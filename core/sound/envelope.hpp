// Amplitude envelopes: every sound terzo makes fades in from silence and back out to it
// through raised-cosine ramps, whose slope is zero at both ends, so no edge clicks.
#pragma once

#include <vector>

namespace terzo {

/// Ramp lengths in seconds; the level holds at 1 between them.
struct Envelope {
    double attack_s = 0.05; ///< fade-in from silence at the start
    double release_s = 0.2; ///< fade-out to silence at the end
};

/// Gain of a raised-cosine ramp at fraction u of its length: 0 at u <= 0, 1 at u >= 1.
double ramp_gain(double u);
/// Multiplies the buffer by the envelope (attack from the first sample, release ending at
/// the last); ramps longer than the buffer are shortened to fit.
void apply_envelope(std::vector<double>& samples, const Envelope& envelope, double sample_rate);

} // namespace terzo

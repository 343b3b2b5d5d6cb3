// Additive synthesis into a sample buffer (no sound device): sums of sine partials, and the
// partials of harmonic notes with a chosen number of harmonics and a roll-off in dB per octave.
#pragma once

#include <cstddef>
#include <vector>

namespace terzo {

/// One sinusoid: amplitude * cos(2 pi frequency t), starting at its crest at t = 0.
struct Partial {
    double frequency_hz = 0.0;
    double amplitude = 0.0;
};

/// The sound of one note: its fundamental and harmonics 2..partials above it.
struct Timbre {
    int partials = 1;                   ///< 1 is a pure sine
    double rolloff_db_per_octave = 6.0; ///< level of harmonic n is -rolloff * log2(n) dB
};

/// Amplitude of harmonic n (1 = fundamental) relative to the fundamental.
double harmonic_gain(const Timbre& timbre, int n);
/// The partials of notes at the given fundamentals, each note's fundamental at
/// note_amplitude; harmonics above max_hz are left out.
std::vector<Partial> harmonic_partials(const std::vector<double>& fundamentals_hz,
                                       double note_amplitude, const Timbre& timbre, double max_hz);
/// Sum of the partials over `frames` samples at sample_rate.
std::vector<double> synthesize(const std::vector<Partial>& partials, std::size_t frames,
                               double sample_rate);

} // namespace terzo

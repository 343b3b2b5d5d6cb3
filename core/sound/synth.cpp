#include "core/sound/synth.hpp"

#include <cmath>

namespace terzo {

double harmonic_gain(const Timbre& timbre, int n) {
    return std::pow(10.0, -timbre.rolloff_db_per_octave * std::log2(double(n)) / 20.0);
}

std::vector<Partial> harmonic_partials(const std::vector<double>& fundamentals_hz,
                                       double note_amplitude, const Timbre& timbre, double max_hz) {
    std::vector<Partial> out;
    for (double f : fundamentals_hz)
        for (int n = 1; n <= timbre.partials && n * f <= max_hz; ++n)
            out.push_back({n * f, note_amplitude * harmonic_gain(timbre, n)});
    return out;
}

// Each partial is a phasor turned by exp(i w) per sample: one complex multiplication, written
// out in real arithmetic (std::complex's operator* checks for infinities and NaN through a
// library call), instead of a cosine call. Rounding makes a running phasor drift in phase
// and length, so at the start of every block of `block` samples it is set again from the
// exact phase, computed from the whole number of cycles modulo 1. Against long-double
// cosines the error stays below 1e-9 of the amplitude (measured: 2e-10 at 8 kHz after 60 s,
// mostly the rounding of that phase), far below the -80 dB the spectrum tests look for.
// Partials go through a block in groups of `lanes`, whose independent multiplications the
// processor can overlap.
std::vector<double> synthesize(const std::vector<Partial>& partials, std::size_t frames,
                               double sample_rate) {
    std::vector<double> out(frames, 0.0);
    constexpr std::size_t block = 1024, lanes = 4;
    for (std::size_t start = 0; start < frames; start += block) {
        const std::size_t end = std::min(frames, start + block);
        for (std::size_t first = 0; first < partials.size(); first += lanes) {
            double zr[lanes] = {}, zi[lanes] = {}, sr[lanes] = {}, si[lanes] = {};
            for (std::size_t k = 0; k < lanes && first + k < partials.size(); ++k) {
                const Partial& p = partials[first + k];
                const double cycles_per_sample = p.frequency_hz / sample_rate;
                double cycles = cycles_per_sample * double(start);
                cycles -= std::floor(cycles);
                zr[k] = p.amplitude * std::cos(2.0 * M_PI * cycles);
                zi[k] = p.amplitude * std::sin(2.0 * M_PI * cycles);
                sr[k] = std::cos(2.0 * M_PI * cycles_per_sample);
                si[k] = std::sin(2.0 * M_PI * cycles_per_sample);
            }
            for (std::size_t i = start; i < end; ++i) {
                double sum = 0.0;
                for (std::size_t k = 0; k < lanes; ++k) {
                    sum += zr[k];
                    const double r = zr[k] * sr[k] - zi[k] * si[k];
                    zi[k] = zr[k] * si[k] + zi[k] * sr[k];
                    zr[k] = r;
                }
                out[i] += sum;
            }
        }
    }
    return out;
}

} // namespace terzo

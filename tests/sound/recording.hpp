// Test helper: synthetic recordings of plucked or struck strings with a known truth, for the
// measurement tests and benchmark. Each note is a sum of partials at the stiff-string
// frequencies f_k = k f0 sqrt(1 + B k^2) (Fletcher 1964), each decaying exponentially (higher
// partials faster), with a burst of decaying noise at the attack, a damper that silences the
// note in 30 ms when the next one starts, and steady white noise under everything at a given
// level below the recording's peak. Not part of core.
#pragma once

#include <cmath>
#include <cstdint>
#include <random>
#include <vector>

namespace terzo::test {

struct StringNote {
    double hz = 440;      ///< the first partial, f0 sqrt(1 + B)
    double seconds = 1.0; ///< from its onset to the damper (or the next note)
    double gap_s = 0.0;   ///< silence after the damper, before the next note
    double level_db = 0;  ///< relative to the other notes
};

struct StringSound {
    double sample_rate = 48000;
    double inharmonicity = 1e-4; ///< B
    int partials = 16;
    double decay_s = 1.5;         ///< time constant of the first partial's amplitude
    double attack_noise_db = -20; ///< peak of the attack's noise burst relative to the note
    double noise_db = -45;        ///< background noise RMS relative to the recording's peak
    std::uint32_t seed = 1;
};

struct Recording {
    std::vector<double> samples;
    std::vector<double> onset_s, damper_s; ///< truth: where each note starts and is damped
};

inline Recording string_recording(const std::vector<StringNote>& notes, const StringSound& s,
                                  double lead_s = 0.3) {
    std::mt19937 rng(s.seed);
    std::uniform_real_distribution<double> phase(0.0, 2.0 * M_PI);
    std::normal_distribution<double> gauss(0.0, 1.0);
    double total = lead_s;
    for (const auto& n : notes) total += n.seconds + n.gap_s;
    total += 0.3;
    const std::size_t frames = std::size_t(total * s.sample_rate);
    Recording r;
    r.samples.assign(frames, 0.0);
    double t0 = lead_s;
    for (const auto& n : notes) {
        const std::size_t a = std::size_t(t0 * s.sample_rate);
        const std::size_t damp = std::size_t((t0 + n.seconds) * s.sample_rate);
        const std::size_t release = std::size_t(0.03 * s.sample_rate);
        const std::size_t b = std::min(frames, damp + release);
        r.onset_s.push_back(double(a) / s.sample_rate);
        r.damper_s.push_back(double(damp) / s.sample_rate);
        const double gain = std::pow(10.0, n.level_db / 20.0);
        const double f0 = n.hz / std::sqrt(1.0 + s.inharmonicity);
        for (int k = 1; k <= s.partials; ++k) {
            const double fk = k * f0 * std::sqrt(1.0 + s.inharmonicity * k * k);
            if (fk > 0.45 * s.sample_rate) break;
            const double amp = gain * 0.3 / k;
            const double tau = s.decay_s / (1.0 + 0.2 * (k - 1));
            const double ph = phase(rng);
            const double w = 2.0 * M_PI * fk / s.sample_rate;
            for (std::size_t i = a; i < b; ++i) {
                const double t = double(i - a) / s.sample_rate;
                double env = amp * std::exp(-t / tau);
                // A 2 ms rise, and the damper's 30 ms fall.
                if (i - a < std::size_t(0.002 * s.sample_rate))
                    env *= double(i - a) / (0.002 * s.sample_rate);
                if (i >= damp) env *= 1.0 - double(i - damp) / double(release);
                r.samples[i] += env * std::cos(w * double(i - a) + ph);
            }
        }
        // The pluck or hammer: white noise decaying with a 5 ms time constant.
        const double burst = gain * 0.3 * std::pow(10.0, s.attack_noise_db / 20.0);
        for (std::size_t i = a; i < std::min(b, a + std::size_t(0.03 * s.sample_rate)); ++i)
            r.samples[i] += burst * std::exp(-double(i - a) / (0.005 * s.sample_rate)) * gauss(rng);
        t0 += n.seconds + n.gap_s;
    }
    double peak = 0;
    for (double v : r.samples) peak = std::max(peak, std::abs(v));
    const double noise = peak * std::pow(10.0, s.noise_db / 20.0);
    for (double& v : r.samples) v += noise * gauss(rng);
    return r;
}

/// Cents from b to a.
inline double cents_between(double a, double b) {
    return 1200.0 * std::log2(a / b);
}

} // namespace terzo::test

// Additive synthesis: harmonic partials and roll-off, and the phasor synthesis against the C
// library's long-double cosine (cosl) as the reference.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "core/sound/level.hpp"
#include "core/sound/render.hpp"
#include "core/sound/synth.hpp"

using namespace terzo;

TEST_CASE("harmonic partials roll off by the given dB per octave and stop below sample_rate / 6",
          "[synth]") {
    Timbre t{8, 6.0};
    CHECK(harmonic_gain(t, 1) == 1.0);
    CHECK(gain_to_db(harmonic_gain(t, 2)) == Approx(-6.0));
    CHECK(gain_to_db(harmonic_gain(t, 8)) == Approx(-18.0));
    const auto p = harmonic_partials({1000.0, 3000.0}, 0.5, t, highest_partial_hz(48000));
    REQUIRE(p.size() == 8 + 2); // 1000..8000 Hz, then 3000 and 6000 Hz
    CHECK(p[7].frequency_hz == 8000.0);
    CHECK(p[9].frequency_hz == 6000.0);
    CHECK(p[9].amplitude == Approx(0.5 * db_to_gain(-6.0)));
}

TEST_CASE("synthesized partials match long-double cosines to 1e-9 for a minute", "[synth]") {
    const double fs = 48000;
    const std::vector<Partial> partials{{27.5, 0.5}, {440.0, 0.25}, {7999.3, 0.125}};
    const std::size_t frames = 60 * 48000;
    const auto y = synthesize(partials, frames, fs);
    const long double two_pi = 6.283185307179586476925286766559L;
    double worst = 0;
    for (std::size_t i = 0; i < frames; i += 7) { // every 7th sample: all block positions
        long double ref = 0;
        for (const Partial& p : partials)
            ref += p.amplitude * cosl(two_pi * fmodl((long double)p.frequency_hz * i / fs, 1.0L));
        worst = std::max(worst, double(fabsl(y[i] - ref)));
    }
    CHECK(worst < 1e-9);
}

TEST_CASE("a partial starts at its crest", "[synth]") {
    const auto y = synthesize({{1000, 0.5}}, 48, 48000);
    CHECK(y[0] == 0.5);
    CHECK(y[12] == Approx(0.0).margin(1e-15)); // a quarter period later
    CHECK(y[24] == Approx(-0.5).epsilon(1e-14));
}

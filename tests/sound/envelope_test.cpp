// Envelopes: raised-cosine ramps with silent ends.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "core/sound/envelope.hpp"

using namespace terzo;

TEST_CASE("ramps are raised cosines with silent ends", "[envelope]") {
    CHECK(ramp_gain(0.0) == 0.0);
    CHECK(ramp_gain(0.5) == Approx(0.5));
    CHECK(ramp_gain(1.0) == 1.0);
    CHECK(ramp_gain(-1.0) == 0.0);
    std::vector<double> x(1000, 1.0);
    apply_envelope(x, Envelope{0.01, 0.002}, 10000); // 100 and 20 frames
    CHECK(x[0] == 0.0);
    CHECK(x[50] == Approx(0.5));
    CHECK(x[100] == 1.0);
    CHECK(x[989] == Approx(0.5));
    CHECK(x[999] == 0.0);
}

TEST_CASE("ramps longer than the buffer are shortened to fit", "[envelope]") {
    std::vector<double> x(10, 1.0);
    apply_envelope(x, Envelope{5.0, 5.0}, 48000);
    CHECK(x.front() == 0.0);
    CHECK(x.back() == 0.0);
    CHECK(std::all_of(x.begin(), x.end(), [](double v) { return v >= 0.0 && v < 1.0; }));
}

// Levels: dB conversions, the peak cap and DC removal.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "core/sound/level.hpp"
#include "core/sound/render.hpp"

using namespace terzo;

TEST_CASE("the default peak cap is -12 dBFS", "[level]") {
    CHECK(RenderSettings{}.peak_dbfs == -12.0);
    CHECK(db_to_gain(-12.0) == Approx(0.251188643150958).epsilon(1e-12));
    CHECK(gain_to_db(0.5) == Approx(-6.020599913279624).epsilon(1e-12));
}

TEST_CASE("DC removal takes out an offset and leaves audible tones alone", "[level]") {
    std::vector<double> dc(48000, 0.3);
    remove_dc(dc, 48000);
    CHECK(dc.back() ==
          Approx(0.3 * std::exp(-4 * M_PI)).epsilon(0.01)); // decays as exp(-2 pi fc t)
    // A 100 Hz sine after one second: within 0.01 dB of its level.
    std::vector<double> x(96000);
    for (std::size_t i = 0; i < x.size(); ++i)
        x[i] = std::sin(2 * M_PI * 100 * double(i) / 48000);
    remove_dc(x, 48000);
    double p = 0;
    for (std::size_t i = 48000; i < x.size(); ++i)
        p = std::max(p, std::abs(x[i]));
    CHECK(std::abs(gain_to_db(p)) < 0.01);
}

TEST_CASE("scaling to a peak leaves silence silent and hits the level exactly", "[level]") {
    std::vector<double> zero(10, 0.0);
    scale_to_peak(zero, -12);
    CHECK(peak(zero) == 0.0);
    std::vector<double> x{0.1, -0.8, 0.3};
    scale_to_peak(x, -6.0206);
    CHECK(peak(x) == Approx(0.5).epsilon(1e-5));
    CHECK(x[0] == Approx(0.1 * 0.5 / 0.8).epsilon(1e-5));
}

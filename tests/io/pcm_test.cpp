// 16-bit conversion: rounding to nearest with halves to even (IEEE 754's default rounding,
// IEEE 754-2008 section 4.3.3, from memory), clipping at full scale, and the WAV writer
// storing exactly these samples.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>

#include "core/io/pcm.hpp"
#include "core/io/wav.hpp"

using namespace terzo;

TEST_CASE("16-bit samples are x * 32768 rounded to nearest, halves to even", "[pcm]") {
    const double step = 1.0 / 32768;
    const auto p = to_pcm16({0.3 * step, 0.6 * step, -0.3 * step, -0.6 * step, 1.5 * step,
                             2.5 * step, -1.5 * step, 0.25, -0.5});
    CHECK(p == std::vector<std::int16_t>{0, 1, 0, -1, 2, 2, -2, 8192, -16384});
}

TEST_CASE("16-bit conversion clips at full scale", "[pcm]") {
    const auto p =
        to_pcm16({1.0, -1.0, 2.0, -2.0, 32767.4 / 32768, 32767.6 / 32768, -32768.6 / 32768});
    CHECK(p == std::vector<std::int16_t>{32767, -32768, 32767, -32768, 32767, 32767, -32768});
}

TEST_CASE("a 16-bit WAV file holds exactly the converted samples", "[pcm]") {
    std::vector<double> x;
    for (int i = 0; i < 4000; ++i)
        x.push_back(0.9 * std::sin(0.01 * i) + 1e-5 * (i % 7));
    const std::string wav = encode_wav(x, WavFormat{48000, SampleFormat::int16});
    REQUIRE(wav.size() == 44 + 2 * x.size()); // a 44-byte header, then the samples
    std::vector<std::int16_t> stored(x.size());
    std::memcpy(stored.data(), wav.data() + 44, 2 * x.size()); // little-endian, as this machine
    CHECK(stored == to_pcm16(x));
}

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "core/report/palette.hpp"

using namespace terzo;
using Catch::Matchers::WithinAbs;

namespace {
const ColourVision all_visions[] = {ColourVision::typical, ColourVision::protanopia, ColourVision::deuteranopia,
                                    ColourVision::tritanopia};

double smallest_difference(const std::vector<Rgb>& colours, std::size_t first, ColourVision vision) {
    double least = 1e9;
    for (std::size_t i = 0; i < first; ++i)
        for (std::size_t j = i + 1; j < first; ++j) least = std::min(least, colour_difference(colours[i], colours[j], vision));
    return least;
}
} // namespace

TEST_CASE("sRGB red, white and black take their published Oklab values", "[palette]") {
    // Oklab of sRGB red (1, 0, 0): L 0.627955, a 0.224863, b 0.125846 (B. Ottosson, "A
    // perceptual color space for image processing", 2020; from memory, docs/references.md).
    const Oklab red = to_oklab({1, 0, 0});
    CHECK_THAT(red.l, WithinAbs(0.627955, 1e-5));
    CHECK_THAT(red.a, WithinAbs(0.224863, 1e-5));
    CHECK_THAT(red.b, WithinAbs(0.125846, 1e-5));
    // White has lightness 1 and no hue, black lightness 0: the space's definition.
    const Oklab white = to_oklab({1, 1, 1});
    CHECK_THAT(white.l, WithinAbs(1.0, 1e-6));
    CHECK_THAT(white.a, WithinAbs(0.0, 1e-6));
    CHECK_THAT(white.b, WithinAbs(0.0, 1e-6));
    CHECK_THAT(to_oklab({0, 0, 0}).l, WithinAbs(0.0, 1e-9));
}

TEST_CASE("a colour survives the trip to Oklab and back", "[palette]") {
    for (const Rgb c : {Rgb{0.2, 0.4, 0.6}, Rgb{0.9, 0.1, 0.3}, Rgb{0.5, 0.5, 0.5}}) {
        const Rgb back = from_oklab(to_oklab(c));
        CHECK_THAT(back.r, WithinAbs(c.r, 1e-7));
        CHECK_THAT(back.g, WithinAbs(c.g, 1e-7));
        CHECK_THAT(back.b, WithinAbs(c.b, 1e-7));
    }
    CHECK(hex_colour({1, 0.5, 0}) == "#ff8000");
}

TEST_CASE("the dichromat simulations leave greys alone and merge red with green", "[palette]") {
    // Each row of the published matrices sums to 1, so a grey is seen unchanged (Machado et al.
    // 2009); for protanopia and deuteranopia a red and a green of equal lightness come close.
    for (ColourVision v : all_visions) {
        const Rgb grey = as_seen({0.5, 0.5, 0.5}, v);
        CHECK_THAT(grey.r, WithinAbs(0.5, 1e-3));
        CHECK_THAT(grey.g, WithinAbs(0.5, 1e-3));
        CHECK_THAT(grey.b, WithinAbs(0.5, 1e-3));
    }
    const Rgb red = from_oklab({0.6, 0.12, 0.06}), green = from_oklab({0.6, -0.12, 0.06});
    CHECK(colour_difference(red, green, ColourVision::typical) > 0.2);
    CHECK(colour_difference(red, green, ColourVision::deuteranopia) < 0.5 * colour_difference(red, green, ColourVision::typical));
    CHECK(colour_difference(red, green, ColourVision::protanopia) < 0.5 * colour_difference(red, green, ColourVision::typical));
}

TEST_CASE("the first four series colours stay apart for every common colour vision", "[palette]") {
    const std::vector<Rgb> colours = series_colours(12);
    REQUIRE(colours.size() == 12);
    for (ColourVision v : all_visions) {
        CHECK(smallest_difference(colours, 4, v) >= 0.179);
        CHECK(smallest_difference(colours, 6, v) >= 0.038);
    }
    // Evenly spaced hues: the twelve hues are the twelve twelfths of the circle, each once.
    std::vector<int> twelfths;
    for (const Rgb& c : colours) {
        const Oklab lab = to_oklab(c);
        double deg = std::atan2(lab.b, lab.a) * 180 / std::acos(-1.0) - 9;
        twelfths.push_back(static_cast<int>(std::lround((deg < 0 ? deg + 360 : deg) / 30)) % 12);
    }
    std::sort(twelfths.begin(), twelfths.end());
    for (int k = 0; k < 12; ++k) CHECK(twelfths[static_cast<std::size_t>(k)] == k);
    CHECK(hex_colour(colours[0]) != hex_colour(colours[1]));
}

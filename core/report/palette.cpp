#include "core/report/palette.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>

namespace terzo {

namespace {

using Matrix = std::array<std::array<double, 3>, 3>;

double to_linear(double c) { return c <= 0.04045 ? c / 12.92 : std::pow((c + 0.055) / 1.055, 2.4); }
double to_gamma(double c) { return c <= 0.0031308 ? 12.92 * c : 1.055 * std::pow(c, 1 / 2.4) - 0.055; }

std::array<double, 3> times(const Matrix& m, const std::array<double, 3>& v) {
    std::array<double, 3> out{};
    for (std::size_t i = 0; i < 3; ++i) out[i] = m[i][0] * v[0] + m[i][1] * v[1] + m[i][2] * v[2];
    return out;
}

// Linear sRGB <-> Oklab, the matrices as published with the colour space (Ottosson 2020).
const Matrix linear_to_lms{{{0.4122214708, 0.5363325363, 0.0514459929},
                            {0.2119034982, 0.6806995451, 0.1073969566},
                            {0.0883024619, 0.2817188376, 0.6299787005}}};
const Matrix lms_to_lab{{{0.2104542553, 0.7936177850, -0.0040720468},
                         {1.9779984951, -2.4285922050, 0.4505937099},
                         {0.0259040371, 0.7827717662, -0.8086757660}}};
const Matrix lab_to_lms{{{1, 0.3963377774, 0.2158037573},
                         {1, -0.1055613458, -0.0638541728},
                         {1, -0.0894841775, -1.2914855480}}};
const Matrix lms_to_linear{{{4.0767416621, -3.3077115913, 0.2309699292},
                            {-1.2684380046, 2.6097574011, -0.3413193965},
                            {-0.0041960863, -0.7034186147, 1.7076147010}}};

// Dichromat simulation on linear sRGB at severity 1.0 (Machado, Oliveira and Fernandes, "A
// physiologically-based model for simulation of color vision deficiency", IEEE TVCG 15(6),
// 2009, table of matrices; from memory, see docs/references.md).
const Matrix protanopia{{{0.152286, 1.052583, -0.204868},
                         {0.114503, 0.786281, 0.099216},
                         {-0.003882, -0.048116, 1.051998}}};
const Matrix deuteranopia{{{0.367322, 0.860646, -0.227968},
                           {0.280085, 0.672501, 0.047413},
                           {-0.011820, 0.042940, 0.968881}}};
const Matrix tritanopia{{{1.255528, -0.076749, -0.178779},
                         {-0.078411, 0.930809, 0.147602},
                         {0.004733, 0.691367, 0.303900}}};

std::array<double, 3> linear_of(const Rgb& c) { return {to_linear(c.r), to_linear(c.g), to_linear(c.b)}; }

bool in_gamut(const Rgb& c) {
    const double eps = 1e-9;
    return c.r >= -eps && c.r <= 1 + eps && c.g >= -eps && c.g <= 1 + eps && c.b >= -eps && c.b <= 1 + eps;
}

Rgb clamped(const Rgb& c) {
    return {std::clamp(c.r, 0.0, 1.0), std::clamp(c.g, 0.0, 1.0), std::clamp(c.b, 0.0, 1.0)};
}

} // namespace

Oklab to_oklab(const Rgb& c) {
    std::array<double, 3> lms = times(linear_to_lms, linear_of(c));
    for (double& x : lms) x = std::cbrt(x);
    const std::array<double, 3> lab = times(lms_to_lab, lms);
    return {lab[0], lab[1], lab[2]};
}

Rgb from_oklab(const Oklab& c) {
    std::array<double, 3> lms = times(lab_to_lms, {c.l, c.a, c.b});
    for (double& x : lms) x = x * x * x;
    const std::array<double, 3> lin = times(lms_to_linear, lms);
    // The transfer function is odd-extended, so out-of-gamut values stay visible to callers.
    auto enc = [](double x) { return x < 0 ? -to_gamma(-x) : to_gamma(x); };
    return {enc(lin[0]), enc(lin[1]), enc(lin[2])};
}

std::string hex_colour(const Rgb& c) {
    auto byte = [](double x) { return static_cast<int>(std::lround(std::clamp(x, 0.0, 1.0) * 255)); };
    char out[8];
    std::snprintf(out, sizeof out, "#%02x%02x%02x", byte(c.r), byte(c.g), byte(c.b));
    return out;
}

Rgb as_seen(const Rgb& c, ColourVision vision) {
    const Matrix* m = vision == ColourVision::protanopia     ? &protanopia
                      : vision == ColourVision::deuteranopia ? &deuteranopia
                      : vision == ColourVision::tritanopia   ? &tritanopia
                                                             : nullptr;
    if (!m) return c;
    const std::array<double, 3> lin = times(*m, linear_of(c));
    auto enc = [](double x) { return to_gamma(std::clamp(x, 0.0, 1.0)); };
    return {enc(lin[0]), enc(lin[1]), enc(lin[2])};
}

double colour_difference(const Rgb& x, const Rgb& y, ColourVision vision) {
    const Oklab p = to_oklab(as_seen(x, vision)), q = to_oklab(as_seen(y, vision));
    return std::sqrt((p.l - q.l) * (p.l - q.l) + (p.a - q.a) * (p.a - q.a) + (p.b - q.b) * (p.b - q.b));
}

std::vector<Rgb> series_colours(std::size_t n) {
    // Our choice, found by trying start hues, hue orders and lightness cycles for the largest
    // smallest difference among the first four colours under every vision (docs/compare.md).
    constexpr double start_degrees = 9, chroma = 0.18;
    constexpr std::array<double, 3> lightness{0.50, 0.65, 0.80};
    const double pi = std::acos(-1.0);
    std::vector<Rgb> out;
    for (std::size_t k = 0; k < n; ++k) {
        const double hue = (start_degrees + static_cast<double>(k * 7 % 12) * 30) * pi / 180;
        const double l = lightness[k % lightness.size()];
        Rgb c;
        for (double ch = chroma; ch > 0; ch -= 0.002) {
            c = from_oklab({l, ch * std::cos(hue), ch * std::sin(hue)});
            if (in_gamut(c)) break;
        }
        out.push_back(clamped(c));
    }
    return out;
}

} // namespace terzo

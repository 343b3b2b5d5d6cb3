// Colours of our own for plots with several series (one colour per tuning in a comparison):
// hues evenly spaced in the Oklab perceptual colour space, ordered so that the first few
// series stay apart for viewers with the common colour-vision deficiencies too.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

namespace terzo {

/// An sRGB colour, each channel from 0 to 1 (gamma-encoded, as written in "#rrggbb").
struct Rgb {
    double r = 0, g = 0, b = 0;
};

/// A colour in Oklab (B. Ottosson, "A perceptual color space for image processing", 2020):
/// l lightness 0..1, a green-red, b blue-yellow; distances approximate perceived differences.
struct Oklab {
    double l = 0, a = 0, b = 0;
};

/// sRGB -> Oklab (through linear sRGB, IEC 61966-2-1 transfer function).
Oklab to_oklab(const Rgb& c);
/// Oklab -> sRGB; channels outside 0..1 are returned as they are (out of gamut).
Rgb from_oklab(const Oklab& c);
/// "#rrggbb", each channel rounded and clamped to 0..255.
std::string hex_colour(const Rgb& c);

/// The ways of seeing colour a palette is checked for.
enum class ColourVision { typical, protanopia, deuteranopia, tritanopia };
/// How c looks with the given vision (full severity; Machado, Oliveira and Fernandes 2009).
Rgb as_seen(const Rgb& c, ColourVision vision);
/// Distance of two colours in Oklab as seen with the given vision (0.02 is about the smallest
/// difference one notices side by side).
double colour_difference(const Rgb& x, const Rgb& y, ColourVision vision);

/// n colours for n series: hue k * 7 (mod 12) twelfths of the circle from 9 degrees, lightness
/// cycling 0.50, 0.65, 0.80, chroma 0.18 reduced until the colour fits sRGB; after twelve the
/// cycle repeats. The first four differ by at least 0.179 for every vision above, the first
/// six by at least 0.038 (docs/compare.md shows the figures).
std::vector<Rgb> series_colours(std::size_t n);

} // namespace terzo

// Recipes: one line of text that builds a tuning from a rule, such as "equal 31",
// "meantone 1/4 from Eb" or "fifths from C: -P/4 -P/4 -P/4 0 0 -P/4 0 0 0 0 0 0". The syntax
// is documented in the README ("Recipes"); every mistake is reported as
// recipe:1:COLUMN: error: ... with the column of the offending character.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

#include "core/tuning/scale.hpp"

namespace terzo {

/// Longest recipe text accepted, in bytes.
inline constexpr std::size_t max_recipe_length = 10000;
/// Largest whole number in a harmonic segment, a tonality diamond or a product set.
inline constexpr long long max_recipe_integer = 1000000;
/// Most numbers in a tonality diamond or a product set.
inline constexpr std::size_t max_recipe_set = 64;
/// Largest numerator or denominator of an exponent or a comma fraction.
inline constexpr long long max_recipe_exponent = 10000;

/// Most modifiers after a construction: each one recomputes every degree exactly, which for
/// the largest exact tunings (4096 degrees with numbers of thousands of digits) takes up to
/// about a second, so the limit keeps any recipe within seconds.
inline constexpr std::size_t max_recipe_modifiers = 16;

/// The words a recipe can start with.
inline constexpr std::string_view recipe_kinds =
    "equal, chain, meantone, fifths, harmonics, subharmonics, diamond, products, list";

/// True when the first word of text is one of recipe_kinds.
bool starts_like_recipe(std::string_view text);
/// Builds the tuning a recipe describes; throws InputError{"recipe", 1, column}.
Scale build_recipe(std::string_view text);

} // namespace terzo

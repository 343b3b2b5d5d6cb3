// Tempered tunings, exact as products of rational powers of primes: equal divisions of any
// interval, chains of a generator within a period (Pythagorean tunings, meantones, scales of
// a regular temperament), comma-fraction meantone fifths, and circles of twelve fifths each
// tempered by its own amount (the circulating temperaments).
#pragma once

#include <array>
#include <optional>
#include <string>

#include "core/arith/pitch.hpp"
#include "core/arith/prime_vector.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// The Pythagorean comma 3^12/2^19 = 531441/524288.
PrimeVector pythagorean_comma();
/// The syntonic comma 81/80.
PrimeVector syntonic_comma();
/// The schisma 32805/32768, the Pythagorean comma divided by the syntonic comma.
PrimeVector schisma();

/// steps equal steps of interval (> 1/1), which is the period: degree i is interval^(i/steps);
/// cents-only when the interval is. 1 <= steps <= max_scale_size.
Scale equal_division(int steps, const Pitch& interval, std::string description);
/// generator^j for j = -down..up, each brought into the period, sorted; duplicates (when
/// the generator is a rational part of the period) are kept once.
Scale generator_chain(const Pitch& generator, int up, int down, const Pitch& period,
                      std::string description);
/// The fifth 3/2 narrowed by fraction of the syntonic comma: 3/2 * (81/80)^(-fraction);
/// a negative fraction widens it.
PrimeVector meantone_fifth(const Ratio& fraction);

/// Twelve fifths around the circle, the first one starting on start_pitch_class (0 = C) and
/// each next one on the note the previous one reached. tempering[i] multiplies the pure 3/2
/// of fifth i (a narrowing by P/4 is P^(-1/4)); an empty entry is the wolf, the one fifth
/// left to take up whatever the others leave.
struct FifthCircle {
    int start_pitch_class = 0;
    std::array<std::optional<PrimeVector>, 12> tempering;
};

/// The product of the twelve tempered fifths divided by seven octaves: exactly 1 when the
/// circle closes, above 1 when the fifths overshoot. Needs a circle without a wolf.
PrimeVector circle_leftover(const FifthCircle& circle);
/// Which fifth (0..11) is the wolf, if any.
std::optional<int> wolf_index(const FifthCircle& circle);
/// The size of fifth i as the scale plays it (for the wolf: what the others leave it).
PrimeVector circle_fifth(const FifthCircle& circle, int i);
/// The twelve notes C, C#, ... B of a circle that closes or has exactly one wolf, C = 1/1.
Scale fifth_circle_scale(const FifthCircle& circle, std::string description);

} // namespace terzo

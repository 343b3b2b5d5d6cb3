// Building a scale from a set of pitches: every pitch is brought into the period exactly,
// duplicates are dropped and the rest sorted by size. Shared by the recipe builders
// (equal divisions, chains, just constructions) and the scale modifiers.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "core/arith/pitch.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// The exact prime vector of an exact pitch, also for rationals beyond 64 bits whose prime
/// factors are all below 10000; nullopt for cents-only pitches and for other huge rationals.
std::optional<PrimeVector> exact_vector(const Pitch& p);
/// a * b, exact whenever both are exact (unlike Pitch's operator for rationals beyond 64 bits).
Pitch exact_product(const Pitch& a, const Pitch& b);
/// a / b, exact whenever both are exact.
Pitch exact_quotient(const Pitch& a, const Pitch& b);
/// p^e for a rational e: exact for exact p, cents-only otherwise.
Pitch exact_power(const Pitch& p, const Ratio& e);
/// p multiplied by the period's integer power that brings it into [1/1, period).
Pitch reduce_into_period(const Pitch& p, const Pitch& period);
/// A scale of the pitches brought into the period, without duplicates, sorted by size; the
/// unison must be one of them (it becomes degree 0).
Scale scale_from_pitch_set(std::string description, const std::vector<Pitch>& pitches,
                           const Pitch& period);

} // namespace terzo

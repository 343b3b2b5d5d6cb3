// Lattice coordinates of a pitch: its exponents of 3, 5 and 7, octave-equivalent (the
// exponent of 2 is dropped), the plane on which just intervals are drawn. Pitches that are
// not 7-limit ratios (tempered or cents-only degrees, 11/8 ...) are placed at their nearest
// just interpretation: the closest 7-limit ratio within a stated tolerance and odd limit.
#pragma once

#include <array>
#include <optional>

#include "core/arith/pitch.hpp"

namespace terzo {

/// How a pitch was placed on the lattice.
enum class LatticeHow {
    exact,   ///< the pitch is a 7-limit ratio: its own exponents
    nearest, ///< nearest just interpretation within the tolerance
    none     ///< no 7-limit ratio within the tolerance and odd limit
};

/// Limits of the nearest-just search.
struct LatticeOptions {
    double tolerance_cents = 20.0; ///< largest |pitch - interpretation|, 0 < t <= 600
    int odd_limit = 15;            ///< largest odd numerator or denominator, 1 <= n <= 243
};

/// Where one pitch sits on the 3-5-7 lattice.
struct LatticePlace {
    LatticeHow how = LatticeHow::none;
    std::array<int, 3> exponents{}; ///< of 3, 5, 7 (zero when how == none)
    Ratio just{1};                  ///< the interpretation, reduced into [1/1, 2/1)
    double deviation_cents = 0.0;   ///< pitch minus interpretation, octave-reduced; 0 if exact
};

/// Exponents of 3, 5, 7 of a positive ratio; nullopt when another odd prime divides it.
std::optional<std::array<int, 3>> lattice_exponents(const Ratio& r);
/// Places a pitch (an interval above degree 0) on the lattice. Rational 7-limit pitches are
/// exact whatever the options; anything else takes the 7-limit ratio of odd limit at most
/// options.odd_limit nearest in octave-reduced cents, if within options.tolerance_cents
/// (ties go to the smaller odd limit, then the lower ratio). Throws InputError (source
/// "lattice tolerance" or "odd limit") when an option is out of range.
LatticePlace place_on_lattice(const Pitch& p, const LatticeOptions& options = {});

} // namespace terzo

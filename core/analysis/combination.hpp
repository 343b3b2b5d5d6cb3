// Combination tones (resultants): for two notes f_low < f_high and a combination term (a, b)
// with a, b non-zero integers, the tone a*f_low + b*f_high when it is positive, with its exact
// value where the notes allow and its landing on the tuning. Terms of order |a| + |b| from 2 up
// to a chosen order; optionally between harmonics (partials) of complex tones.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "core/analysis/keyboard.hpp"
#include "core/analysis/landing.hpp"
#include "core/arith/prime_vector.hpp"
#include "core/arith/ratio.hpp"

namespace terzo {

/// Limits (checked by check_options and keyboard_tones; each names its Setting).
inline constexpr int max_order = 12;                 ///< Setting::order
inline constexpr int max_partials = 32;              ///< Setting::partials
inline constexpr std::uint64_t max_tones = 1000000;  ///< tones computed by one request, at most

/// The term a*f_low + b*f_high; a and b are non-zero.
struct CombinationTerm {
    int a = -1;
    int b = 1;
    /// |a| + |b|.
    int order() const { return (a < 0 ? -a : a) + (b < 0 ? -b : b); }
    /// "difference tone" (-1, 1), "cubic difference tone" (2, -1), "summation tone" (1, 1),
    /// otherwise the coefficients, e.g. "3L-2H".
    std::string name() const;
    /// a*f_low + b*f_high.
    double hz(double f_low, double f_high) const { return a * f_low + b * f_high; }
    friend bool operator==(const CombinationTerm& x, const CombinationTerm& y) {
        return x.a == y.a && x.b == y.b;
    }
};

/// Every term of order 2..order (both coefficients non-zero), by order, then a descending.
/// Terms that can never be positive for f_low < f_high (both coefficients negative) are left out.
std::vector<CombinationTerm> combination_terms(int order);

/// Helmholtz's ordering of difference tones for one dyad: level 1 is f_high - f_low; level k+1
/// holds the differences between a level-k tone and either primary that are new (not zero, not
/// a primary, not met before). Each as its (a, b) term with its level, up to `order`.
struct HelmholtzTone {
    CombinationTerm term;
    int level;
};
std::vector<HelmholtzTone> helmholtz_ladder(double f_low, double f_high, int order);

/// One combination tone of a dyad.
struct Tone {
    CombinationTerm term;      ///< applied to the partials below: a*(low_partial*f_low) + ...
    int low_partial = 1;       ///< harmonic number of the low note that made the tone
    int high_partial = 1;      ///< harmonic number of the high note that made the tone
    double hz = 0.0;
    double cents = 0.0;        ///< above the reference
    std::optional<Ratio> ratio;        ///< hz / ref exactly, when both notes are rational
    std::optional<PrimeVector> vector; ///< the exact value when the notes are tempered but their
                                       ///< ratio is rational (e.g. an octave of 2^(k/12) steps)
    Landing landing;
    double audibility = 0.0;   ///< estimate in [0, 1], see audibility.hpp

    /// The exact value as a Pitch, when known.
    std::optional<Pitch> exact_value() const;
};

/// The tones of one dyad.
struct DyadTones {
    Note low, high;
    std::vector<Tone> tones; ///< by partial pair, then order, then frequency
};

struct ToneOptions {
    int order = 3;      ///< highest order |a| + |b|, 2..max_order
    int partials = 1;   ///< harmonics per note, 1..max_partials (1: pure tones)
    /// false: floating point only (no ratios, no exact landings); for comparison and benchmarks.
    bool exact = true;
};

/// Throws InputError naming Setting::order or Setting::partials when one is out of range.
void check_options(const ToneOptions& options);

/// All tones of one dyad (given in either order, the lower note counts as low; a unison
/// gives the multiples (a + b) * f).
std::vector<Tone> dyad_tones(const Keyboard& keyboard, const Note& low, const Note& high,
                             const ToneOptions& options);

/// All tones of every dyad of the keyboard (low < high), dyads ordered by low note then high
/// note. Throws InputError when the request would compute more than max_tones tones.
std::vector<DyadTones> keyboard_tones(const Keyboard& keyboard, const ToneOptions& options);

/// An upper bound on the tones computed for `dyads` dyads (used to enforce max_tones).
std::uint64_t tone_count_bound(std::uint64_t dyads, const ToneOptions& options);
/// Throws InputError (naming Setting::order and the other settings to lower) when
/// tone_count_bound(dyads, options) exceeds max_tones.
void check_tone_count(std::uint64_t dyads, const ToneOptions& options);

} // namespace terzo

// Combination tones (resultants): for two notes f_low < f_high and a combination term (a, b)
// with a, b non-zero integers, the tone a*f_low + b*f_high when it is positive, with its exact
// value where the notes allow and its landing on the tuning. Terms of order |a| + |b| from 2 up
// to a chosen order; optionally between harmonics (partials) of complex tones.
#pragma once

#include <cstdint>
#include <functional>
#include <memory>
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
inline constexpr std::uint64_t max_tones = 20000000; ///< tones computed by one request, at most

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

/// Which exact value a tone has; the value itself is computed only when asked for
/// (DyadExact), so a tone stays a plain record.
enum class ExactKind : unsigned char {
    none,   ///< not exact: cents-only notes, or tempered notes with an irrational ratio
    ratio,  ///< a rational multiple of the reference
    vector, ///< an exact tempered value (product of rational powers of primes), not rational
};

/// One combination tone of a dyad: a plain record (no heap), stored contiguously.
struct Tone {
    CombinationTerm term;      ///< applied to the partials below: a*(low_partial*f_low) + ...
    int low_partial = 1;       ///< harmonic number of the low note that made the tone
    int high_partial = 1;      ///< harmonic number of the high note that made the tone
    double hz = 0.0;
    double cents = 0.0;        ///< above the reference
    Landing landing;
    double audibility = 0.0;   ///< estimate in [0, 1], see audibility.hpp
    ExactKind exact = ExactKind::none; ///< which exact value DyadExact gives for it
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

/// How the tones of one dyad get exact values (the engine's plan for the dyad, kept for
/// readers): made from the two notes, it turns a Tone back into its exact value on request.
class DyadExact {
public:
    DyadExact() = default;
    /// `low` must be the lower note of the dyad. exact = false plans no exact values.
    DyadExact(const Note& low, const Note& high, bool exact = true);
    /// tone / reference exactly, when the tone is rational.
    std::optional<Ratio> ratio(const Tone& tone) const;
    /// The exact value, rational or tempered, when the tone has one.
    std::optional<Pitch> value(const Tone& tone) const;
    /// The exact value as text ("1/4", "2^(1/3)*3"), or "-" when it is not exact.
    std::string text(const Tone& tone) const;

    /// How the dyad's tones are computed exactly (see combination.cpp).
    enum class Plan { rational_small, rational_big, tempered, none };
    Plan plan = Plan::none;
    std::int64_t nl = 0, nh = 0, den = 1; ///< rational_small: the notes are nl/den and nh/den
    Ratio rl, rh;                         ///< rational_big: the notes
    PrimeVector low_vector;               ///< tempered: the low note ...
    Ratio q;                              ///< ... and f_high / f_low
};

/// The exact value of one tone of `dyad`, when it has one (computed now).
std::optional<Pitch> exact_value(const DyadTones& dyad, const Tone& tone);
/// tone / reference exactly, when the tone of `dyad` is rational (computed now).
std::optional<Ratio> exact_ratio(const DyadTones& dyad, const Tone& tone);

/// Throws InputError naming Setting::order or Setting::partials when one is out of range.
void check_options(const ToneOptions& options);

/// The resultant engine: one keyboard and one set of options, prepared once (terms, the
/// nearest-note table, a cache of note ratios) and then run dyad by dyad into a buffer the
/// caller reuses, so no tone costs a heap allocation. Floating point finds what is near;
/// exact arithmetic runs only where a tone is within rounding error of a note. Not for
/// concurrent use of one engine from several threads (the note cache fills lazily).
class ResultantEngine {
public:
    /// Throws InputError naming the option when the options are out of range.
    ResultantEngine(const Keyboard& keyboard, const ToneOptions& options);
    ~ResultantEngine();
    ResultantEngine(const ResultantEngine&) = delete;
    ResultantEngine& operator=(const ResultantEngine&) = delete;

    /// The tones of the dyad low < high into `out` (replacing what it held, reusing its memory).
    void tones(const Note& low, const Note& high, std::vector<Tone>& out) const;
    const Keyboard& keyboard() const { return *keyboard_; }
    const ToneOptions& options() const { return options_; }

    struct Tables; ///< what is prepared once (combination.cpp)

private:
    const Keyboard* keyboard_;
    ToneOptions options_;
    std::unique_ptr<Tables> tables_;
};

/// All tones of one dyad (given in either order, the lower note counts as low; a unison
/// gives the multiples (a + b) * f).
std::vector<Tone> dyad_tones(const Keyboard& keyboard, const Note& low, const Note& high,
                             const ToneOptions& options);

/// Calls visit(dyad) for every dyad of the keyboard (low < high, dyads ordered by low note
/// then high note), one dyad at a time in a reused DyadTones: memory does not grow with the
/// number of tones. Throws InputError, before the first visit, when the options are out of
/// range or the request would compute more than max_tones tones.
void for_each_keyboard_dyad(const Keyboard& keyboard, const ToneOptions& options,
                            const std::function<void(const DyadTones&)>& visit);

/// All tones of every dyad of the keyboard, kept (for_each_keyboard_dyad without keeping
/// them is the way for big requests).
std::vector<DyadTones> keyboard_tones(const Keyboard& keyboard, const ToneOptions& options);

/// An upper bound on the tones computed for `dyads` dyads (used to enforce max_tones).
std::uint64_t tone_count_bound(std::uint64_t dyads, const ToneOptions& options);
/// Throws InputError (naming Setting::order and the other settings to lower) when
/// tone_count_bound(dyads, options) exceeds max_tones.
void check_tone_count(std::uint64_t dyads, const ToneOptions& options);

} // namespace terzo

// Costs of 12-note tunings for the search: a sum of documented, weighted parts (how far the
// fifths, major thirds or minor thirds lie from pure over the twelve keys, as a mean, root
// mean square or worst value; how far their beat rates at a reference exceed a limit; the
// resultant fit of a chord on every root) and constraints that rule a tuning out.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "core/analysis/compare.hpp"
#include "core/error.hpp"

namespace terzo {

/// The three interval classes a 12-note cost looks at, each on all twelve notes.
enum class KeyInterval { fifth, major_third, minor_third };
/// "fifth", "major-third", "minor-third" (the words the part syntax uses).
std::string key_interval_name(KeyInterval k);

/// How the twelve deviations of one interval class become one number (all in cents).
enum class Statistic {
    mean,  ///< weighted mean of |deviation|
    rms,   ///< weighted root mean square of the deviations
    worst, ///< largest |deviation| among the intervals with positive weight
};
std::string statistic_name(Statistic s); ///< "mean", "rms", "worst"

/// weight * statistic(|deviation from pure| of the twelve intervals of one class).
struct DeviationPart {
    KeyInterval interval = KeyInterval::fifth;
    Statistic statistic = Statistic::rms;
    double weight = 1.0;
};
/// weight * the sum over the twelve intervals of max(0, beat rate - limit_hz), with the lower
/// note in octave 4 at the cost's reference pitch (as on the key comparison).
struct BeatPart {
    KeyInterval interval = KeyInterval::fifth;
    double limit_hz = 0.0;
    double weight = 1.0;
};
/// weight * the mean over the twelve roots of the resultant fit (fit.hpp) of one chord shape,
/// e.g. {0, 4, 7} for the major triads, with the root in octave 4; combination terms up to
/// `order`, pure tones.
struct FitPart {
    std::vector<int> shape{0, 4, 7};
    int order = 2;
    double weight = 1.0;
};

/// Limits a tuning must meet; a tuning that breaks one is not a result (exhaustive search) or
/// is marked infeasible (continuous search).
struct Constraints {
    bool no_wide_fifths = false;          ///< every fifth at most 3/2
    std::optional<double> max_fifth;      ///< every |fifth - 3/2| at most this many cents
    std::optional<double> max_major_third;///< every |major third - 5/4| at most this
    std::optional<double> max_minor_third;///< every |minor third - 6/5| at most this
};

struct Cost {
    std::vector<DeviationPart> deviations;
    std::vector<BeatPart> beats;
    std::vector<FitPart> fits;
    Constraints constraints;
    PitchReference reference;          ///< for beat rates and fits; A4 = 440 Hz
    std::optional<KeyWeights> weights; ///< key usage; none: every key weighs 1
};

/// Limits on a cost (checked by check_cost).
inline constexpr std::size_t max_cost_parts = 32;
inline constexpr double max_part_weight = 1e6;

/// Throws InputError naming `source` when the cost has no part, more than max_cost_parts,
/// a weight outside [0, max_part_weight] or no positive weight, a negative limit, or a chord
/// shape that is empty, unsorted, or spans an octave or more.
void check_cost(const Cost& cost, const std::string& source);

/// Parses one deviation part "INTERVAL:STATISTIC[:WEIGHT]", e.g. "major-third:rms" or
/// "fifth:worst:0.5". INTERVAL is fifth, major-third or minor-third.
DeviationPart parse_deviation_part(std::string_view text, const std::string& source);
/// Parses one beat part "INTERVAL:HZ[:WEIGHT]", e.g. "major-third:8" (beats above 8 Hz count).
BeatPart parse_beat_part(std::string_view text, const std::string& source);
/// Parses one fit part "SHAPE[:WEIGHT]" with SHAPE semitones joined by '+', e.g. "0+4+7:2".
FitPart parse_fit_part(std::string_view text, const std::string& source);

/// The deviations from pure, in cents, of the twelve intervals of each class, indexed by the
/// pitch class of the lower note (0 = C).
struct KeyDeviations {
    std::array<double, 12> fifth{}, major_third{}, minor_third{};
    const std::array<double, 12>& of(KeyInterval k) const;
};
/// Pitch classes C..B of a 12-note tuning as cents above C (positions[0] = 0), octave 2/1.
using Positions = std::array<double, 12>;

/// Deviations of a 12-note tuning given by its positions.
KeyDeviations key_deviations(const Positions& positions);
/// The positions of a 12-note scale's degrees (degree d on pitch class d).
Positions positions_of(const Scale& scale);

/// One part's share of a cost.
struct PartValue {
    std::string name;  ///< "major-third:rms", "beats:fifth>1.5", "fit:0+4+7"
    double value = 0;  ///< the statistic, before weighting (cents, Hz over the limit, cents)
    double weight = 0;
};
/// A cost broken down.
struct CostBreakdown {
    double total = 0;                ///< sum of weight * value
    std::vector<PartValue> parts;    ///< in the cost's order: deviations, beats, fits
    bool feasible = true;            ///< every constraint met
    std::string violation;           ///< the first constraint broken, in words
};

/// A cost made ready for many evaluations (weights per interval worked out once).
class CostModel {
public:
    /// Checks the cost (InputError at `source`, see check_cost).
    explicit CostModel(Cost cost, const std::string& source = "--part");

    const Cost& cost() const { return cost_; }
    /// Weight of the interval of class k whose lower note is pitch class pc: the sum of the
    /// weights of the keys whose triad contains it (2 each without key weights).
    double interval_weight(KeyInterval k, int pc) const { return weight_[static_cast<int>(k)][pc]; }
    /// Sum of interval_weight over the twelve pitch classes.
    double total_weight(KeyInterval k) const { return total_[static_cast<int>(k)]; }

    /// The full cost of a tuning, computed from scratch from its positions.
    CostBreakdown evaluate(const Positions& positions) const;
    /// The first constraint broken by these deviations, or empty.
    std::string violation(const KeyDeviations& d) const;
    /// The statistic of one class from its twelve deviations by pitch class.
    double statistic(KeyInterval k, Statistic s, const std::array<double, 12>& dev) const;
    /// Sum over the twelve intervals of max(0, beat - limit) (BeatPart).
    double beat_excess(const BeatPart& part, const Positions& positions, const KeyDeviations& d) const;
    /// Mean fit of a chord shape over the twelve roots (FitPart).
    double fit_value(const FitPart& part, const Positions& positions) const;
    /// Frequency of pitch class pc in octave 4 at the reference.
    double hz(const Positions& positions, int pc) const;

    /// True when every part and constraint treats all pitch classes alike, so transposing a
    /// tuning leaves its cost unchanged (no key weights, no beat rates, no fits: see search.cpp).
    bool transposition_invariant() const;
    /// True when also turning the tuning upside down (every interval mirrored) leaves the cost
    /// unchanged (additionally no chord fits, since a mirrored major triad is a minor one).
    bool inversion_invariant() const;

private:
    Cost cost_;
    std::array<std::array<double, 12>, 3> weight_{};
    std::array<double, 3> total_{};
};

/// Deviation from pure of each class's Pythagorean form (docs/references.md section 1): a major
/// third of four pure fifths is a syntonic comma wide, a minor third of three a comma narrow.
inline constexpr double syntonic_comma_cents = 21.50628959671478;
inline constexpr double pythagorean_comma_cents = 23.460010384649014;
inline constexpr double pure_fifth_cents = 701.9550008653874;

} // namespace terzo

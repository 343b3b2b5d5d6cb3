// Searching for tunings that minimise a cost (cost.hpp for 12-note tunings, TargetCost for
// equal divisions and rank-2 chains): every circulating temperament whose fifths are narrowed
// by fractions of the Pythagorean comma from a given set (exhaustive, on several threads,
// symmetric copies skipped where that is exact); the same with continuous fifth sizes (a local
// optimiser with analytic gradients, started from the best exhaustive results); the best
// generator of a rank-2 chain; every equal division up to a limit. Results are the same for
// the same input whatever the number of threads.
#pragma once

#include <array>
#include <atomic>
#include <cstdint>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "core/analysis/cost.hpp"
#include "core/arith/ratio.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// How far a long search has come, reported through SearchControl::progress.
struct SearchProgress {
    std::uint64_t done = 0;  ///< candidates enumerated so far
    std::uint64_t total = 0; ///< candidates in the whole space
};

/// Threads, cancelling and progress. The flag and the callback belong to the caller (the CLI
/// sets the flag from a signal handler); core only reads the flag. The callback is called
/// from the calling thread only, about every progress_interval_ms.
struct SearchControl {
    int threads = 1;                               ///< 1..max_search_threads
    const std::atomic<bool>* cancel = nullptr;     ///< stop soon after it becomes true
    std::function<void(const SearchProgress&)> progress;
    int progress_interval_ms = 200;
};

inline constexpr int max_search_threads = 64;
inline constexpr std::size_t max_results = 1000;          ///< --top
inline constexpr std::size_t max_fractions = 12;          ///< fractions in a circulating set
inline constexpr long long max_fraction_denominator = 1000;
inline constexpr std::uint64_t max_circulating_candidates = 20'000'000'000ULL;

// ---- 1. circulating temperaments, exhaustive ------------------------------------------

/// Twelve fifths C-G, G-D … F-C, each narrowed by one of `fractions` of the Pythagorean comma
/// (a negative fraction widens it), the fractions of all twelve adding up to exactly one so
/// that the circle closes on pure octaves.
struct CirculatingSpace {
    std::vector<Ratio> fractions; ///< distinct, sorted, each in -1..1 with denominator <= 1000
    bool use_symmetry = true;     ///< skip rotated (and mirrored) copies when the cost allows
    /// Skip a branch once the deviation parts of the fifths chosen so far already cost more
    /// than the worst result kept (exact: those sums only grow). The results are the same; how
    /// many candidates are evaluated then depends on the order threads meet them.
    bool prune = true;
};
/// Parses "0,1/6,1/4" (InputError at source); sorts and removes repeats.
std::vector<Ratio> parse_fractions(const std::string& text, const std::string& source);

/// One temperament of the space.
struct CirculatingResult {
    std::array<Ratio, 12> fractions;  ///< of the Pythagorean comma, fifth C-G first
    std::array<double, 12> narrowing{}; ///< cents each fifth is narrowed by
    double cost = 0;                  ///< as ranked
    CostBreakdown breakdown;
    int copies = 1; ///< temperaments of the space this one stands for (its transpositions and mirror images)
};
struct CirculatingSearch {
    std::vector<CirculatingResult> results; ///< best first; ties by fractions, larger first
    std::uint64_t total = 0;      ///< distributions adding up to one comma
    std::uint64_t enumerated = 0; ///< of those, visited (less than total when cancelled)
    std::uint64_t evaluated = 0;  ///< of those, canonical and within the constraints
    std::uint64_t rejected = 0;   ///< canonical but breaking a constraint (counted where seen)
    bool symmetry_rotations = false, symmetry_mirror = false;
    bool cancelled = false;
};

/// The number of distributions of the space (fractions of twelve fifths adding up to one).
std::uint64_t count_distributions(const CirculatingSpace& space);
/// Every distribution, best `top` kept. Throws InputError at "--fractions" for a bad set or
/// one with more than max_circulating_candidates distributions, at "--top" for top outside
/// 1..max_results, at "--threads" for a bad thread count.
CirculatingSearch search_circulating(const CirculatingSpace& space, const CostModel& cost,
                                     std::size_t top, const SearchControl& control);
/// The candidate's cost computed from nothing: positions from the twelve narrowings, then
/// CostModel::evaluate (the search itself updates its sums fifth by fifth).
CostBreakdown evaluate_narrowings(const CostModel& cost, const std::array<double, 12>& narrowing);
/// Positions C..B of the tuning with these fifth narrowings (cents), C = 0.
Positions positions_from_narrowings(const std::array<double, 12>& narrowing);
/// The exact tuning of a result, built by the fifth-circle recipe.
Scale circulating_scale(const std::array<Ratio, 12>& fractions, const std::string& description);

// ---- 2. circulating temperaments, continuous --------------------------------------------

struct ContinuousResult {
    std::array<double, 12> narrowing{}; ///< cents, adding up to one Pythagorean comma
    CostBreakdown breakdown;
    std::array<Ratio, 12> start;        ///< the exhaustive result it started from
    double start_cost = 0;
    int iterations = 0;
};
struct ContinuousSearch {
    std::vector<ContinuousResult> results; ///< best first
    CirculatingSearch exhaustive;          ///< the search that gave the starts
    bool cancelled = false;
};
/// Smoothed cost and its gradient with respect to the narrowings (cents): mean and worst are
/// made differentiable with smoothing `tau` cents (sqrt(d^2 + tau^2) for |d|, tau*log-sum-exp
/// for the largest), beat excess with a softplus of width tau Hz, and constraints on thirds
/// become a quadratic penalty. Exposed for the gradient test.
double smoothed_cost(const CostModel& cost, const std::array<double, 12>& narrowing, double tau,
                     std::array<double, 12>* gradient);
/// Local optimisation from one start: projected gradient descent with backtracking on the
/// smoothed cost for tau = 1, 0.1, 0.01, 0.001, 0.0001 cents, the narrowings kept adding up to
/// one comma and inside the fifth constraints. Throws InputError at "--part" for fit parts
/// (the resultant fit has no analytic gradient).
ContinuousResult optimise_circulating(const CostModel& cost, const std::array<double, 12>& start);
/// Exhaustive search first, then optimise_circulating from its best `starts` results.
ContinuousSearch search_continuous(const CirculatingSpace& space, const CostModel& cost, std::size_t top,
                                   std::size_t starts, const SearchControl& control);
/// The tuning (cents-only) of continuous narrowings.
Scale narrowings_scale(const std::array<double, 12>& narrowing, const std::string& description);

// ---- 3 and 4. target intervals: rank-2 chains and equal divisions -----------------------

/// One interval an equal division or a chain should approximate; `generators` pins how many
/// generators reach it in a chain (meantone: 3/2 is 1, 5/4 is 4), otherwise the best count
/// within the chain is taken.
struct TargetInterval {
    Ratio ratio{3, 2};
    std::optional<int> generators;
    double weight = 1.0;
};
/// Parses "5/4", "5/4=4" (pinned to 4 generators), "5/4*2" (weight 2) or "5/4=4*2".
TargetInterval parse_target(const std::string& text, const std::string& source);

/// weighted statistic of the targets' errors in cents.
struct TargetCost {
    std::vector<TargetInterval> targets;
    Statistic statistic = Statistic::rms;
};
inline constexpr std::size_t max_targets = 32;
inline constexpr int max_chain_generators = 200;
inline constexpr int max_equal_steps = 100000;

/// A target's best approximation.
struct TargetError {
    Ratio ratio;
    int steps = 0;       ///< generators (chain) or steps (equal division)
    int periods = 0;     ///< periods added (chain)
    double error = 0;    ///< approximation minus target, cents
};
struct Rank2Result {
    double generator = 0; ///< cents, within (0, period)
    double cost = 0;
    std::vector<TargetError> errors;
};
/// Best generators for a chain of `generators` generators upward from the tonic (notes 0..n)
/// in `period_cents`: intervals between chain notes use -n..n generators. Each local optimum
/// of the cost over the generator size is found exactly (the cost is convex between the
/// points where a target's best count or period changes), best `top` kept.
std::vector<Rank2Result> search_rank2(const TargetCost& cost, double period_cents, int generators,
                                      std::size_t top);
/// The errors and cost of one generator size.
Rank2Result evaluate_rank2(const TargetCost& cost, double period_cents, int generators, double generator);

struct EqualResult {
    int steps = 0;
    double cost = 0;
    std::vector<TargetError> errors;
};
/// Every division of the period into 1..max_steps equal steps, best `top` kept; each target
/// goes to its nearest step.
std::vector<EqualResult> search_equal(const TargetCost& cost, double period_cents, int max_steps, std::size_t top);
/// The errors and cost of one equal division.
EqualResult evaluate_equal(const TargetCost& cost, double period_cents, int steps);

/// Throws InputError at "--target" for no targets, too many, or bad weights.
void check_target_cost(const TargetCost& cost);

} // namespace terzo

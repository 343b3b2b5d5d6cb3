// Candidate notes for growing a scale (`terzo suggest --candidates SPEC`): a comma-separated
// SPEC of just ratios up to an odd limit (optionally also a prime limit), the steps of equal
// divisions of the octave, and explicit ratios or cents, turned into pitches inside one period.
#pragma once

#include <cstddef>
#include <string_view>
#include <vector>

#include "core/analysis/keyboard.hpp"
#include "core/error.hpp"

namespace terzo {

/// Limits of a SPEC (each named in its error message).
inline constexpr int max_candidate_odd_limit = 255;  ///< odd:N
inline constexpr int max_candidate_prime = 251;      ///< prime:N (the largest prime below 256)
inline constexpr int max_candidate_division = 1200;  ///< edo:N
inline constexpr std::size_t max_candidates = 20000; ///< pitches one SPEC may give
inline constexpr std::size_t max_candidate_spec_length = 10000; ///< bytes

/// What a SPEC asks for. Every part adds its pitches to the union.
struct CandidateSpec {
    int odd_limit = 0;   ///< odd:N, just ratios whose odd numbers are at most N (0: none)
    int prime_limit = 0; ///< prime:N, and whose primes are at most N (0: any); needs odd:N
    std::vector<int> divisions;  ///< edo:N, the steps 2^(k/N)
    std::vector<Pitch> explicit_pitches; ///< ratios "7/4", "3" and cents "350.0", as given
};

/// The default SPEC: just ratios of odd limit 15.
inline constexpr std::string_view default_candidate_spec = "odd:15";

/// Parses a SPEC; throws InputError at `pos` (column counted from pos.column when it is
/// non-zero, as for --chord) naming the bad item and the rule.
CandidateSpec parse_candidate_spec(std::string_view text, const SourcePos& pos);

/// The SPEC's pitches strictly between the unison and `period`, each reduced into the period
/// (explicit values by whole periods), ordered by size, without exact duplicates. Throws
/// InputError at `pos` when there would be more than max_candidates.
std::vector<Pitch> candidate_pitches(const CandidateSpec& spec, const Pitch& period,
                                     const SourcePos& pos);

/// period^n as a pitch: exact for exact periods, cents-only otherwise.
Pitch period_power(const Pitch& period, int n);

/// The candidates that are not in the keyboard's scale already: not exactly equal to a degree
/// (reduced into the period, unison and period included) and, when either pitch is
/// cents-only, not within `cents_only_tolerance` of one. Order is kept.
std::vector<Pitch> new_candidates(const Keyboard& keyboard, const std::vector<Pitch>& candidates,
                                  double cents_only_tolerance = 0.5);

} // namespace terzo

// Key-by-key comparison of tunings: for a 12-note tuning, every major and minor triad's fifth
// and thirds against pure (cents and beat rates at a reference), a summary per tuning with
// optional key-usage weights and a count of wolves; for a tuning of any size, the sizes each
// step span takes and how far each lies from the nearest simple ratio within an odd limit.
#pragma once

#include <array>
#include <cstdint>
#include <filesystem>
#include <istream>
#include <optional>
#include <string>
#include <vector>

#include "core/analysis/sheet.hpp"

namespace terzo {

/// One key: the triad on `root` (pitch class 0..11), major (root, +4, +7) or minor (+3, +7).
struct Key {
    int root = 0;
    bool minor = false;
    /// 0..23: the majors C..B, then the minors C..B.
    int index() const { return root + (minor ? 12 : 0); }
};
/// "C major", "F# minor" (black keys spelled as asked).
std::string key_name(const Key& k, Spelling spelling = Spelling::mixed);

/// How much each of the 24 keys is used; keys not listed weigh 0.
struct KeyWeights {
    std::array<double, 24> weight{}; ///< by Key::index()
};
/// Largest weight accepted in a weights file.
constexpr double max_key_weight = 1e6;

/// Reads a weights file: one key per line, "<note> major|minor <weight>" (note as C, F#, Bb;
/// weight a non-negative decimal up to max_key_weight); a field that starts with '#' begins
/// a comment to the end of the line (so "F#" is a note); blank lines are
/// ignored; a key may appear once; at least one weight must be positive. Throws InputError
/// naming the source, line and column.
KeyWeights parse_key_weights(std::istream& in, const std::string& source);
/// The same from a file.
/// Most bytes a weights file may have: 24 keys take a few hundred; the 10000 lines allowed
/// with comments fit many times over.
inline constexpr std::uintmax_t max_key_weights_bytes = 1u << 20;
KeyWeights read_key_weights(const std::filesystem::path& path);

/// The triad of one key in one tuning.
struct KeyReport {
    Key key;
    NoteName root, third, fifth; ///< the notes, root in the chosen octave
    Beat fifth_beat;             ///< root-fifth against 3/2
    Beat major_third;            ///< against 5/4: root-third (major), third-fifth (minor)
    Beat minor_third;            ///< against 6/5: third-fifth (major), root-third (minor)
    /// Resultant fit of the triad (fit.hpp: weighted RMS, in cents, of how far the
    /// combination tones of its three dyads land from the tuning's notes), when computed.
    std::optional<double> fit;
};

/// An interval far enough from pure to count as a wolf (see wolf thresholds below).
struct Wolf {
    std::string interval; ///< "fifth", "major third", "minor third"
    int from = 0;         ///< pitch class of the lower note
    double cents = 0;     ///< deviation from pure
};

// Wolf thresholds. A chain of twelve fifths closing on pure octaves must absorb a Pythagorean
// comma P (23.460 c) in total, so a fifth that carries more than half of it alone (|dev| >
// P/2 = 11.730 c) is the odd one out: the Pythagorean G#-Eb (-23.460) and the meantone wolves
// (+35.7 for 1/4 comma) are caught, the fifths of every meantone up to 1/3 comma (-7.2) and
// of the circulating temperaments are not. A third made of pure or narrow fifths is at most a
// syntonic comma (21.506 c, the Pythagorean third) from pure, so thirds beyond P (23.460 c)
// are wolves: the diminished fourths and augmented seconds of a meantone (about 41 and 46 c)
// are caught, the worst thirds of a well temperament are not. (Derivation; the thresholds
// themselves are our choice, stated here and in the README.)
constexpr double wolf_fifth_cents = 23.460010 / 2;
constexpr double wolf_third_cents = 23.460010;

/// Weighted figures over the keys of one tuning.
struct CompareSummary {
    double mean_fifth = 0, worst_fifth = 0;             ///< |cents from 3/2|
    double mean_major_third = 0, worst_major_third = 0; ///< |cents from 5/4|
    double mean_minor_third = 0, worst_minor_third = 0; ///< |cents from 6/5|
    int pure_fifths = 0, pure_major_thirds = 0,
        pure_minor_thirds = 0; ///< of the 12 each, exactly pure
    std::vector<Wolf> wolves;  ///< of the 12 fifths, 12 major and 12 minor thirds, in that order
    std::optional<double> mean_fit; ///< weighted, when fits are computed
    bool weighted = false;
};

struct CompareOptions {
    PitchReference reference;          ///< for beat rates; A4 = 440 Hz
    int tonic = 0;                     ///< pitch class of degree 0
    int octave = 4;                    ///< octave of the triads' roots
    std::optional<KeyWeights> weights; ///< none: every key weighs 1
    bool fit = true;                   ///< compute each triad's resultant fit
    int fit_order = 3;                 ///< highest combination order for the fit (2..12)
};

/// One 12-note tuning, key by key.
struct KeyComparison {
    std::string name; ///< the TUNING argument
    std::string description;
    std::vector<KeyReport> keys;     ///< 24, in Key::index() order
    std::vector<CircleFifth> circle; ///< the twelve fifths from the tonic
    CompareSummary summary;
};

/// Compares one 12-note tuning key by key; throws InputError at `name` when it is not 12 notes,
/// at "--octave" for an octave outside 0..8, at "--order" for a fit order outside 2..12.
KeyComparison compare_keys(const Scale& scale, const CompareOptions& options,
                           const std::string& name);

/// Recomputes the summary from the keys' values (also after fits are filled in).
CompareSummary summarize(const std::vector<KeyReport>& keys,
                         const std::optional<KeyWeights>& weights);

/// One size taken by a step span, and its nearest simple ratio.
struct IntervalSize {
    Pitch size;           ///< one representative
    int count = 0;        ///< how many degrees start an interval of this size
    Ratio nearest;        ///< nearest ratio whose odd parts are within the odd limit
    double deviation = 0; ///< size minus nearest, in cents
};
/// All intervals spanning `steps` degrees (degree i to degree i + steps, across the period).
struct IntervalClass {
    int steps = 1;
    std::vector<IntervalSize> sizes; ///< by size, smallest first
};

/// Limits of interval_classes.
constexpr std::size_t max_class_degrees = 256;
constexpr int max_odd_limit = 99;

/// Interval classes of a scale, steps 1..size-1. Sizes are grouped exactly when exact;
/// cents-only sizes within 1e-6 c of each other are one size. Throws InputError at `name`
/// for more than max_class_degrees degrees, at "--odd-limit" for a limit outside 1..99 or even.
std::vector<IntervalClass> interval_classes(const Scale& scale, int odd_limit,
                                            const std::string& name);

/// The ratio nearest to `cents` among n/d * 2^k with n, d odd, coprime and at most odd_limit.
Ratio nearest_simple_ratio(double cents, int odd_limit);

} // namespace terzo

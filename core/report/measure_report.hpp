// Reports of `terzo measure` (and the window's check): the notes found in a recording with
// their times, frequencies, inharmonicity and confidence; against a tuning, each note's name,
// target and deviation and the beat rates of the tuner's intervals as played and as targeted;
// otherwise the closest tunings of a library. Terminal tables, CSV and JSON.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "core/analysis/measure_match.hpp"
#include "core/report/table.hpp"
#include "core/sound/measure.hpp"

namespace terzo {

/// What a measurement found, gathered for the reports.
struct MeasureResult {
    std::string recording; ///< the file's name as given
    double seconds = 0;
    int sample_rate = 0, channels = 0;
    std::vector<MeasuredNote> notes;
    Spelling spelling = Spelling::mixed;

    /// With a tuning to check against.
    struct Against {
        std::string tuning; ///< its name as given
        std::string description;
        PitchReference reference;
        int tonic = 0;
        std::vector<NoteCheck> notes; ///< one per measured note, same order
        std::vector<IntervalCheck> intervals;
    };
    std::optional<Against> against;

    /// Without one: the library's tunings, best first.
    std::vector<TuningFit> closest;
    std::string library; ///< the folder searched
    std::size_t library_skipped = 0; ///< its tunings that are not 12 notes
};

/// The notes: number, start and end (s), Hz, B, confidence, partials; against a tuning also
/// note, target Hz, deviation in cents and Hz.
Table measure_notes_table(const MeasureResult& r);
/// The intervals (against a tuning): kind, notes, beats as played and as targeted.
Table measure_intervals_table(const MeasureResult& r);
/// The closest tunings: rank, tuning, pitch standard, RMS deviation.
Table measure_closest_table(const MeasureResult& r, std::size_t most);
/// The pitch standard as --pitch spells it, to 2 decimals: "A4=415.02".
std::string reference_text(const PitchReference& ref, Spelling spelling = Spelling::mixed);
/// {"notes": [{start_s, end_s, hz, inharmonicity, confidence[, note, target_hz,
/// deviation_cents]}], then "intervals" (against a tuning) or "closest" (without)}.
nlohmann::ordered_json measure_json(const MeasureResult& r);
/// The whole terminal report: a heading, the tables, and the advice that measurements are
/// advice. `closest_shown` limits the closest tunings listed.
std::string measure_text(const MeasureResult& r, std::size_t closest_shown = 5);

} // namespace terzo

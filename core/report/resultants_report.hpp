// The resultant engine's results as reports: a terminal table per dyad, one flat CSV table,
// and the JSON document of "terzo resultants" (keys documented in the README). Both front
// ends print resultants through these, so numbers read the same everywhere.
#pragma once

#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "core/analysis/chord.hpp"
#include "core/analysis/combination.hpp"
#include "core/analysis/fit.hpp"
#include "core/report/table.hpp"

namespace terzo {

/// What a resultants report covers: the request and its results.
struct ResultantsReport {
    const Keyboard* keyboard = nullptr;
    ToneOptions options;
    std::vector<DyadTones> dyads;
    Fit fit;
    std::optional<std::vector<Note>> chord; ///< set when a chord was analysed
    std::optional<CommonBass> bass;         ///< its common resultant bass
};

/// "degree 4, period -1": degree 4 one period below the keyboard's lowest period.
std::string note_label(int degree, int period);
/// The exact value of a tone as text ("1/4", "2^(1/3)"), or "-" when it is not exact.
std::string exact_text(const Tone& tone);

/// {"degree", "period", "hz", "ratio"} for one note.
nlohmann::ordered_json note_json(const Note& note);
/// {"a", "b", "order", "name", "low_partial", "high_partial", "hz", "ratio", "exact_value",
///  "landing": {"degree", "period", "deviation_cents", "exact"}, "audibility"}; the document
///  adds "helmholtz_level" (its dyad is needed to know it).
nlohmann::ordered_json tone_json(const Tone& tone);
/// The whole document (its keys are listed in docs/formats.md).
nlohmann::ordered_json resultants_json(const ResultantsReport& report);
/// The same document written dyad by dyad, text identical to resultants_json(r).dump(2), so
/// a million tones never sit in memory as one JSON tree.
void write_resultants_json(std::ostream& out, const ResultantsReport& report);

/// One dyad's tones: term, name, order, (partials), Hz, exact ratio, landing, deviation.
Table dyad_table(const DyadTones& dyad, bool with_partials);
/// Every tone of every dyad as CSV, one row per tone, written row by row (no field needs
/// quoting: numbers, fixed names and ratios).
void write_tones_csv(std::ostream& out, const std::vector<DyadTones>& dyads);
/// The human-readable report: a heading per dyad, its table, the chord's bass, the fit and
/// a legend, written dyad by dyad.
void write_resultants_text(std::ostream& out, const ResultantsReport& report);
/// The same report as one string.
std::string resultants_text(const ResultantsReport& report);

} // namespace terzo

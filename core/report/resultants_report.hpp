// The resultant engine's results as reports: a terminal table per dyad, one flat CSV table,
// and the JSON document of "terzo resultants" (keys listed in docs/formats.md). They stream:
// each dyad is written as the engine produces it, so memory does not grow with the number
// of tones. Both front ends print resultants through these, so numbers read the same
// everywhere.
#pragma once

#include <memory>
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "core/analysis/chord.hpp"
#include "core/analysis/combination.hpp"
#include "core/analysis/fit.hpp"
#include "core/report/table.hpp"

namespace terzo {

enum class ResultantsFormat {
    text,        ///< headings, a table per dyad, the fit and a legend
    json,        ///< one compact JSON document
    json_pretty, ///< the same document indented two spaces per level
    csv,         ///< one row per tone
};

/// Writes one resultants report while the tones are produced: call dyad() for each dyad in
/// order, then finish() with the fit. Nothing is written before the first dyad() or
/// finish(), so a request that fails before any tone is computed leaves the output empty.
class ResultantsWriter {
public:
    /// `chord` and `bass` (may be null) are reported when a chord was analysed.
    ResultantsWriter(std::ostream& out, ResultantsFormat format, const Keyboard& keyboard,
                     const ToneOptions& options, const std::vector<Note>* chord = nullptr,
                     const CommonBass* bass = nullptr);
    ~ResultantsWriter();
    ResultantsWriter(const ResultantsWriter&) = delete;
    ResultantsWriter& operator=(const ResultantsWriter&) = delete;

    /// One dyad's tones, in the order the report lists them.
    void dyad(const DyadTones& dyad);
    /// The end of the report: the chord, its bass and the fit; flushes the output.
    void finish(const Fit& fit);

private:
    struct State;
    std::unique_ptr<State> state_;
};

/// A report whose tones are all in memory (tests, small requests).
struct ResultantsReport {
    const Keyboard* keyboard = nullptr;
    ToneOptions options;
    std::vector<DyadTones> dyads;
    Fit fit;
    std::optional<std::vector<Note>> chord; ///< set when a chord was analysed
    std::optional<CommonBass> bass;         ///< its common resultant bass
};
/// Writes `report` through a ResultantsWriter.
void write_resultants(std::ostream& out, const ResultantsReport& report, ResultantsFormat format);

/// "degree 4, period -1": degree 4 one period below the keyboard's lowest period.
std::string note_label(int degree, int period);

/// One dyad's tones: term, name, order, (partials), Hz, exact ratio, landing, deviation.
Table dyad_table(const DyadTones& dyad, bool with_partials);

} // namespace terzo

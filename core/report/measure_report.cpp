#include "core/report/measure_report.hpp"

#include <sstream>

#include "core/format.hpp"
#include "core/report/sheet_report.hpp"

namespace terzo {

namespace {

using A = Table::Align;
using J = nlohmann::ordered_json;

std::string plural(std::size_t n, const char* word) {
    return std::to_string(n) + " " + word + (n == 1 ? "" : "s");
}

} // namespace

std::string reference_text(const PitchReference& ref, Spelling spelling) {
    return note_text(ref.note, spelling) + "=" + fixed(ref.hz, 2);
}

Table measure_notes_table(const MeasureResult& r) {
    Table t;
    t.header = {"#", "start s", "end s", "Hz", "B", "confidence", "partials"};
    t.align = {A::right, A::right, A::right, A::right, A::right, A::right, A::right};
    if (r.against) {
        for (const char* h : {"note", "target Hz", "cents", "Hz off"}) t.header.push_back(h);
        t.align.insert(t.align.end(), {A::left, A::right, A::right, A::right});
    }
    for (std::size_t i = 0; i < r.notes.size(); ++i) {
        const MeasuredNote& n = r.notes[i];
        std::vector<std::string> row = {std::to_string(i + 1),
                                        fixed(n.span.start_s, 3),
                                        fixed(n.span.end_s, 3),
                                        fixed(n.pitch.hz, 3),
                                        fixed(n.pitch.inharmonicity * 1e4, 3) + "e-4",
                                        fixed(n.pitch.confidence, 2),
                                        std::to_string(n.pitch.partials.size())};
        if (r.against) {
            const NoteCheck& c = r.against->notes.at(i);
            row.push_back(note_text(c.note, r.spelling));
            row.push_back(fixed(c.target_hz, 3));
            row.push_back(signed_fixed(c.deviation_cents, 2));
            row.push_back(signed_fixed(c.deviation_hz, 3));
        }
        t.add(std::move(row));
    }
    return t;
}

Table measure_intervals_table(const MeasureResult& r) {
    Table t;
    t.header = {"interval", "notes", "played beats/s", "target beats/s", "played cents", "target cents"};
    t.align = {A::left, A::left, A::right, A::right, A::right, A::right};
    if (!r.against) return t;
    for (const IntervalCheck& c : r.against->intervals)
        t.add({c.kind->name, note_text(c.low, r.spelling) + "-" + note_text(c.high, r.spelling),
               beat_cell(c.measured), beat_cell(c.target), signed_fixed(c.measured.cents, 2),
               signed_fixed(c.target.cents, 2)});
    return t;
}

Table measure_closest_table(const MeasureResult& r, std::size_t most) {
    Table t;
    t.header = {"rank", "tuning", "pitch standard", "RMS cents"};
    t.align = {A::right, A::left, A::left, A::right};
    for (std::size_t i = 0; i < r.closest.size() && i < most; ++i)
        t.add({std::to_string(i + 1), r.closest[i].name, reference_text(r.closest[i].reference, r.spelling),
               fixed(r.closest[i].rms_cents, 2)});
    return t;
}

J measure_json(const MeasureResult& r) {
    J notes = J::array();
    for (std::size_t i = 0; i < r.notes.size(); ++i) {
        const MeasuredNote& n = r.notes[i];
        J j = {{"start_s", n.span.start_s},
               {"end_s", n.span.end_s},
               {"hz", n.pitch.hz},
               {"inharmonicity", n.pitch.inharmonicity},
               {"confidence", n.pitch.confidence}};
        if (r.against) {
            const NoteCheck& c = r.against->notes.at(i);
            j["note"] = note_text(c.note, r.spelling);
            j["target_hz"] = c.target_hz;
            j["deviation_cents"] = c.deviation_cents;
        }
        notes.push_back(std::move(j));
    }
    J out = {{"notes", std::move(notes)}};
    if (r.against) {
        J intervals = J::array();
        auto beat_json = [](const Beat& b) {
            return J{{"beats_per_second", b.hz}, {"deviation_cents", b.cents}, {"tempering", tempering_name(b.tempering)}};
        };
        for (const IntervalCheck& c : r.against->intervals)
            intervals.push_back({{"interval", c.kind->name},
                                 {"low", note_text(c.low, r.spelling)},
                                 {"high", note_text(c.high, r.spelling)},
                                 {"played", beat_json(c.measured)},
                                 {"target", beat_json(c.target)}});
        out["intervals"] = std::move(intervals);
    } else {
        J closest = J::array();
        for (const TuningFit& f : r.closest)
            closest.push_back({{"tuning", f.name}, {"reference", reference_text(f.reference, r.spelling)},
                               {"rms_cents", f.rms_cents}});
        out["closest"] = std::move(closest);
    }
    return out;
}

std::string measure_text(const MeasureResult& r, std::size_t closest_shown) {
    std::ostringstream out;
    out << "Recording " << r.recording << ": " << fixed(r.seconds, 2) << " s, " << r.sample_rate << " Hz, "
        << plural(std::size_t(r.channels), "channel") << "; " << plural(r.notes.size(), "note") << " found\n";
    if (r.against)
        out << "Against " << r.against->tuning << " (" << r.against->description << ") at "
            << note_text(r.against->reference.note, r.spelling) << " = " << fixed(r.against->reference.hz, 3)
            << " Hz, degree 0 on " << pitch_class_name(r.against->tonic, r.spelling) << '\n';
    out << '\n';
    if (r.notes.empty()) {
        out << "No notes found: the recording holds no sound that rises clearly above its noise and "
               "has a pitch.\n\n";
    } else {
        out << "Notes: start and end in seconds, the first partial in Hz, inharmonicity B, confidence 0..1"
            << (r.against ? ", the note, its target and the deviation from it" : "") << '\n';
        write_text(out, measure_notes_table(r));
        out << '\n';
    }
    if (r.against && !r.against->intervals.empty()) {
        out << "Intervals between measured notes: beats per second as played and as the tuning has them\n";
        write_text(out, measure_intervals_table(r));
        out << '\n';
    }
    if (!r.against && !r.notes.empty()) {
        out << "Closest tunings in " << r.library << " (" << plural(r.closest.size(), "12-note tuning")
            << (r.library_skipped ? ", " + std::to_string(r.library_skipped) + " of other sizes left out" : std::string())
            << "), each at the pitch standard that fits best\n";
        write_text(out, measure_closest_table(r, closest_shown));
        out << '\n';
    }
    out << "Measurements are advice. " << tuning_advice << '\n';
    return out.str();
}

} // namespace terzo

#include "core/report/suggest_report.hpp"

#include <algorithm>

#include "core/format.hpp"
#include "core/report/table.hpp"

namespace terzo {

namespace {

using json = nlohmann::ordered_json;

std::size_t shown(std::size_t size, std::size_t top) { return std::min(size, top); }

std::string what_is_fitted(const SuggestReport& r) {
    if (r.options.chord) {
        std::string s = "the chord";
        for (const Note& n : *r.options.chord) s += " " + candidate_label(n.pitch);
        return s;
    }
    return "every dyad";
}

} // namespace

std::string candidate_label(const Pitch& pitch) {
    if (!pitch.is_exact()) return fixed(pitch.cents(), 3) + " c";
    return pitch.str();
}

json suggest_json(const SuggestReport& r) {
    const Suggestions& s = r.results;
    json add = json::array();
    for (std::size_t i = 0; i < shown(s.add.size(), r.top); ++i) {
        const Addition& a = s.add[i];
        auto ratio = a.pitch.ratio();
        add.push_back({{"ratio", ratio ? json(ratio->str()) : json(nullptr)},
                       {"exact_value", a.pitch.is_exact() ? json(a.pitch.str()) : json(nullptr)},
                       {"cents", a.pitch.cents()},
                       {"fit", a.fit},
                       {"gain", a.gain},
                       {"exact_landings", a.exact_landings},
                       {"near_landings", a.near_landings},
                       {"infrasonic_landings", a.infrasonic_landings},
                       {"gain_is_infrasonic", a.gain_is_infrasonic}});
    }
    json remove = json::array();
    for (std::size_t i = 0; i < shown(s.remove.size(), r.top); ++i) {
        const Removal& m = s.remove[i];
        remove.push_back({{"degree", m.degree}, {"fit", m.fit}, {"gain", m.gain}});
    }
    return {{"fit", s.base_fit},
            {"order", r.options.tones.order},
            {"span", r.keyboard->span()},
            {"partials", r.options.tones.partials},
            {"ref_hz", r.keyboard->ref_hz()},
            {"pitch_floor_hz", r.options.fit.pitch_floor_hz},
            {"near_cents", r.options.near_cents},
            {"candidates", s.add.size()},
            {"add", std::move(add)},
            {"remove", std::move(remove)}};
}

void write_suggest_text(std::ostream& out, const SuggestReport& r) {
    const Suggestions& s = r.results;
    const double floor = r.options.fit.pitch_floor_hz;
    out << "fit of the scale: " << fixed(s.base_fit, 3) << " c over " << s.base_tones
        << " tones (" << what_is_fitted(r) << ", order " << r.options.tones.order << ", span "
        << r.keyboard->span() << (r.options.tones.partials > 1 ? ", partials " + std::to_string(r.options.tones.partials) : "")
        << ")\n";
    if (floor > 0.0)
        out << "tones below " << number_text(floor)
            << " Hz are left out of the fit (--pitch-floor 0 counts them, as terzo resultants does by default)\n";

    out << "\nnotes to add (" << r.candidates << ", " << s.add.size() << " not in the scale), best first";
    if (s.add.size() > r.top) out << ", top " << r.top;
    out << ":\n";
    bool infrasonic = false;
    if (s.add.empty()) {
        out << "  (no candidate left: every one is in the scale already)\n";
    } else {
        Table t;
        t.header = {"note", "cents", "fit", "gain", "exact", "near", ""};
        t.align = {Table::Align::left, Table::Align::right, Table::Align::right, Table::Align::right,
                   Table::Align::right, Table::Align::right, Table::Align::left};
        for (std::size_t i = 0; i < shown(s.add.size(), r.top); ++i) {
            const Addition& a = s.add[i];
            std::string note;
            if (a.gain_is_infrasonic) {
                note = "* below " + number_text(pitch_perception_floor_hz) + " Hz";
                infrasonic = true;
            }
            t.add({candidate_label(a.pitch), fixed(a.pitch.cents(), 3), fixed(a.fit, 3),
                   signed_fixed(a.gain, 3), std::to_string(a.exact_landings),
                   std::to_string(a.near_landings), note});
        }
        write_text(out, t);
    }

    if (r.removals) {
        out << "\ndegrees to remove, best first";
        if (s.remove.size() > r.top) out << ", top " << r.top;
        out << ":\n";
        if (s.remove.empty()) {
            out << "  (none: the scale has only its unison)\n";
        } else {
            Table t;
            t.header = {"degree", "pitch", "fit", "gain"};
            t.align = {Table::Align::right, Table::Align::left, Table::Align::right, Table::Align::right};
            for (std::size_t i = 0; i < shown(s.remove.size(), r.top); ++i) {
                const Removal& m = s.remove[i];
                t.add({std::to_string(m.degree), candidate_label(r.keyboard->scale().degree(std::size_t(m.degree))),
                       fixed(m.fit, 3), signed_fixed(m.gain, 3)});
            }
            write_text(out, t);
        }
    }

    out << "\nlegend: fit is what terzo resultants reports for the scale with the note added (or the\n"
           "  degree removed) and the same options: the weighted RMS of landing deviations in cents,\n"
           "  lower is better. gain: the scale's fit minus that fit. exact: resultants that coincide\n"
           "  with the new note (proven with exact arithmetic); near: resultants landing on it within\n"
        << "  " << fixed(r.options.near_cents, 1) << " c, exact ones included.";
    if (infrasonic)
        out << " *: the gain comes from resultants below\n  " << number_text(pitch_perception_floor_hz)
            << " Hz, which are heard as beating rather than as a pitch (--pitch-floor 20 leaves\n"
               "  them out).";
    out << "\n";
}

} // namespace terzo

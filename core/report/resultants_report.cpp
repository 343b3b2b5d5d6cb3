#include "core/report/resultants_report.hpp"

#include <sstream>

#include "core/format.hpp"

namespace terzo {

namespace {

using json = nlohmann::ordered_json;

json ratio_or_null(const std::optional<Ratio>& r) { return r ? json(r->str()) : json(nullptr); }

// "degree 2, period 0 (327.032 Hz, 5/4)".
std::string note_text(const Note& n) {
    std::string s = note_label(n.degree, n.period) + " (" + fixed(n.hz, 3) + " Hz, " +
                    (n.pitch.is_exact() ? n.pitch.str() : fixed(n.cents, 3) + " c");
    if (!n.on_scale) s += ", off the scale";
    return s + ")";
}

// Helmholtz level of each pure-tone term of a dyad (0 when the term is not on the ladder).
int helmholtz_level(const std::vector<HelmholtzTone>& ladder, const Tone& t) {
    if (t.low_partial != 1 || t.high_partial != 1) return 0;
    for (const auto& h : ladder)
        if (h.term == t.term) return h.level;
    return 0;
}

json landing_json(const Landing& l) {
    return {{"degree", l.degree},
            {"period", l.period},
            {"deviation_cents", l.deviation_cents},
            {"exact", l.exact}};
}

} // namespace

std::string note_label(int degree, int period) {
    return "degree " + std::to_string(degree) + ", period " + std::to_string(period);
}

std::string exact_text(const Tone& tone) {
    if (tone.ratio) return tone.ratio->str();
    if (tone.vector) return tone.vector->str();
    return "-";
}

json note_json(const Note& note) {
    return {{"degree", note.degree},
            {"period", note.period},
            {"hz", note.hz},
            {"ratio", ratio_or_null(note.ratio())}};
}

json tone_json(const Tone& t) {
    return {{"a", t.term.a},
            {"b", t.term.b},
            {"order", t.term.order()},
            {"name", t.term.name()},
            {"low_partial", t.low_partial},
            {"high_partial", t.high_partial},
            {"hz", t.hz},
            {"ratio", ratio_or_null(t.ratio)},
            {"exact_value", t.ratio || t.vector ? json(exact_text(t)) : json(nullptr)},
            {"landing", landing_json(t.landing)},
            {"audibility", t.audibility}};
}

namespace {

json dyad_json(const DyadTones& d) {
    json tones = json::array();
    const auto ladder = helmholtz_ladder(d.low.hz, d.high.hz, max_order);
    for (const auto& t : d.tones) {
        json j = tone_json(t);
        int level = helmholtz_level(ladder, t);
        j["helmholtz_level"] = level ? json(level) : json(nullptr);
        tones.push_back(std::move(j));
    }
    return {{"low", note_json(d.low)}, {"high", note_json(d.high)}, {"tones", std::move(tones)}};
}

// Everything but the dyads, with `dyads` standing in for them.
json document(const ResultantsReport& r, json dyads) {
    TERZO_ASSERT(r.keyboard);
    json doc = {{"tuning", r.keyboard->scale().description()},
                {"ref_hz", r.keyboard->ref_hz()},
                {"span", r.keyboard->span()},
                {"order", r.options.order},
                {"partials", r.options.partials},
                {"dyads", std::move(dyads)}};
    if (r.chord) {
        json notes = json::array();
        for (const auto& n : *r.chord) {
            json j = note_json(n);
            j["on_scale"] = n.on_scale;
            notes.push_back(std::move(j));
        }
        json chord = {{"notes", std::move(notes)}};
        if (r.bass) {
            const CommonBass& b = *r.bass;
            json mult = json::array();
            for (const auto& m : b.multiples) mult.push_back(m);
            chord["common_bass"] = {
                {"found", b.found},
                {"approximate", b.approximate},
                {"hz", b.found ? json(b.hz) : json(nullptr)},
                {"ratio", ratio_or_null(b.ratio)},
                {"exact_value", b.ratio ? json(b.ratio->str()) : b.vector ? json(b.vector->str()) : json(nullptr)},
                {"multiples", std::move(mult)},
                {"max_error_cents", b.max_error_cents},
                {"landing", b.found ? landing_json(b.landing) : json(nullptr)}};
        }
        doc["chord"] = std::move(chord);
    }
    doc["fit"] = {{"rms_cents", r.fit.rms_cents},
                  {"total_weight", r.fit.total_weight},
                  {"tones", r.fit.tones},
                  {"exact", r.fit.exact}};
    return doc;
}

} // namespace

json resultants_json(const ResultantsReport& r) {
    json dyads = json::array();
    for (const auto& d : r.dyads) dyads.push_back(dyad_json(d));
    return document(r, std::move(dyads));
}

void write_resultants_json(std::ostream& out, const ResultantsReport& r) {
    if (r.dyads.empty()) {
        out << document(r, json::array()).dump(2) << '\n';
        return;
    }
    // The document with a marker where the dyads go; each dyad is dumped on its own and
    // indented by the two levels it sits at, which is exactly what dump(2) would print.
    const std::string marker = "\"@dyads@\"";
    const std::string text = document(r, json("@dyads@")).dump(2);
    const std::size_t at = text.find(marker);
    TERZO_ASSERT(at != std::string::npos);
    out << text.substr(0, at) << "[\n";
    for (std::size_t i = 0; i < r.dyads.size(); ++i) {
        const std::string d = dyad_json(r.dyads[i]).dump(2);
        out << "    ";
        for (char c : d) {
            out << c;
            if (c == '\n') out << "    ";
        }
        out << (i + 1 < r.dyads.size() ? ",\n" : "\n");
    }
    out << "  ]" << text.substr(at + marker.size()) << '\n';
}

Table dyad_table(const DyadTones& dyad, bool with_partials) {
    using A = Table::Align;
    Table t;
    t.header = {"term", "name", "order"};
    t.align = {A::left, A::left, A::right};
    if (with_partials) {
        t.header.push_back("partials");
        t.align.push_back(A::right);
    }
    for (const char* h : {"Hz", "exact ratio", "lands on degree", "in period", "deviation c", "exact",
                          "audibility", "Helmholtz"})
        t.header.push_back(h);
    for (A a : {A::right, A::left, A::right, A::right, A::right, A::left, A::right, A::right})
        t.align.push_back(a);
    const auto ladder = helmholtz_ladder(dyad.low.hz, dyad.high.hz, max_order);
    for (const Tone& x : dyad.tones) {
        std::vector<std::string> row = {"(" + std::to_string(x.term.a) + "," + std::to_string(x.term.b) + ")",
                                        x.term.name(), std::to_string(x.term.order())};
        if (with_partials) row.push_back(std::to_string(x.low_partial) + "x" + std::to_string(x.high_partial));
        row.push_back(fixed(x.hz, 3));
        row.push_back(exact_text(x));
        row.push_back(std::to_string(x.landing.degree));
        row.push_back(std::to_string(x.landing.period));
        row.push_back(signed_fixed(x.landing.deviation_cents, 3));
        row.push_back(x.landing.exact ? "=" : "");
        row.push_back(fixed(x.audibility, 2));
        int level = helmholtz_level(ladder, x);
        row.push_back(level ? std::to_string(level) : "");
        t.add(std::move(row));
    }
    return t;
}

void write_tones_csv(std::ostream& out, const std::vector<DyadTones>& dyads) {
    out << "low_degree,low_period,low_hz,high_degree,high_period,high_hz,a,b,order,name,"
           "low_partial,high_partial,hz,ratio,landing_degree,landing_period,deviation_cents,"
           "exact,audibility\r\n";
    for (const auto& d : dyads) {
        const std::string dyad = std::to_string(d.low.degree) + ',' + std::to_string(d.low.period) + ',' +
                                 fixed(d.low.hz, 6) + ',' + std::to_string(d.high.degree) + ',' +
                                 std::to_string(d.high.period) + ',' + fixed(d.high.hz, 6) + ',';
        for (const Tone& x : d.tones)
            out << dyad << x.term.a << ',' << x.term.b << ',' << x.term.order() << ',' << x.term.name()
                << ',' << x.low_partial << ',' << x.high_partial << ',' << fixed(x.hz, 6) << ','
                << (x.ratio ? x.ratio->str() : "") << ',' << x.landing.degree << ',' << x.landing.period
                << ',' << fixed(x.landing.deviation_cents, 6) << ',' << (x.landing.exact ? "true" : "false")
                << ',' << fixed(x.audibility, 4) << "\r\n";
    }
}

std::string resultants_text(const ResultantsReport& r) {
    std::ostringstream out;
    write_resultants_text(out, r);
    return out.str();
}

void write_resultants_text(std::ostream& out, const ResultantsReport& r) {
    TERZO_ASSERT(r.keyboard);
    const Keyboard& kb = *r.keyboard;
    out << kb.scale().description() << '\n'
        << "reference " << fixed(kb.ref_hz(), 4) << " Hz = degree 0 of period 0; span "
        << kb.span() << (kb.span() == 1 ? " period" : " periods") << "; order up to "
        << r.options.order;
    if (r.options.partials > 1) out << "; partials 1.." << r.options.partials;
    out << "\n";
    if (r.chord) {
        out << "chord:";
        for (std::size_t i = 0; i < r.chord->size(); ++i)
            out << (i ? "; " : " ") << note_text((*r.chord)[i]);
        out << "\n";
    }
    for (const auto& d : r.dyads) {
        out << "\n" << note_text(d.low) << "  +  " << note_text(d.high) << "\n";
        if (d.tones.empty())
            out << "  (no combination tone of this order is positive)\n";
        else
            write_text(out, dyad_table(d, r.options.partials > 1));
    }
    if (r.bass) {
        const CommonBass& b = *r.bass;
        out << "\ncommon resultant bass: ";
        if (!b.found) {
            out << "none within the tolerance of " << fixed(default_bass_tolerance_cents, 1) << " cents\n";
        } else {
            out << fixed(b.hz, 3) << " Hz";
            if (b.ratio) out << " (" << b.ratio->str() << ")";
            else if (b.vector) out << " (" << b.vector->str() << ")";
            out << (b.approximate ? ", approximate (worst note " + fixed(b.max_error_cents, 3) + " c off)" : ", exact");
            out << "; notes are its multiples";
            for (const auto& m : b.multiples) out << ' ' << m;
            out << "; lands on " << note_label(b.landing.degree, b.landing.period) << ", "
                << signed_fixed(b.landing.deviation_cents, 3) << " c" << (b.landing.exact ? " =" : "") << "\n";
        }
    }
    out << "\nfit: " << fixed(r.fit.rms_cents, 3) << " cents (weighted RMS of landing deviations over "
        << r.fit.tones << " tones, " << r.fit.exact << " exact)\n";
    out << "\nlegend: term (a,b) is the tone a*f_low + b*f_high";
    if (r.options.partials > 1) out << " of partials i x j (a*i*f_low + b*j*f_high)";
    out << "; L and H name the low and high note.\n"
           "  lands on degree, in period: the nearest note (period 0 is the keyboard's lowest period,\n"
           "  -1 the one below it). deviation: tone minus that note in cents. '=' the tone coincides\n"
           "  with the note exactly (proven with exact arithmetic, never by a tolerance).\n"
           "  exact ratio: tone / reference; '-' when not exact. audibility: a rough estimate in\n"
           "  [0, 1] from published psychoacoustic findings (see docs/model.md), not a measurement.\n"
           "  Helmholtz: the tone's place in Helmholtz's ordering of difference tones (1: f_high - f_low,\n"
           "  2: its difference with a primary, and so on). fit weights each tone by\n"
           "  audibility / (order - 1).\n";
}

} // namespace terzo

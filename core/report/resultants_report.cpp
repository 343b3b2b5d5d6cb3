#include "core/report/resultants_report.hpp"

#include <iterator>

#include <fmt/compile.h>
#include <fmt/format.h>

#include "core/format.hpp"
#include "core/report/json_stream.hpp"

namespace terzo {

namespace {

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

// Appends value with `decimals` decimals, as fixed() in core/io/format.hpp prints it (no
// "-0.000"), without a temporary string.
void append_fixed(std::string& buf, double value, int decimals) {
    const std::size_t start = buf.size();
    fmt::format_to(std::back_inserter(buf), "{:.{}f}", value, decimals);
    if (buf[start] == '-' && buf.find_first_not_of("0.", start + 1) == std::string::npos)
        buf.erase(start, 1);
}

// The exact ratio of a tone as text into `buf` (cleared first); false when not rational.
bool ratio_text(const DyadExact& exact, const Tone& tone, std::string& buf) {
    buf.clear();
    if (tone.exact != ExactKind::ratio) return false;
    const Ratio r = *exact.ratio(tone);
    if (r.is_small())
        fmt::format_to(std::back_inserter(buf), FMT_COMPILE("{}/{}"), r.num(), r.den());
    else
        buf = r.str();
    return true;
}

// Names of combination terms, made once per writer (a tone's name is a fixed text).
class TermNames {
public:
    const std::string& operator()(const CombinationTerm& t) {
        const std::size_t i = std::size_t(t.a + max_order) * (2 * max_order + 1) + std::size_t(t.b + max_order);
        if (names_.empty()) names_.resize((2 * max_order + 1) * (2 * max_order + 1));
        if (names_[i].empty()) names_[i] = t.name();
        return names_[i];
    }

private:
    std::vector<std::string> names_;
};

void landing_json(JsonStream& j, const Landing& l) {
    j.begin_object();
    j.key("degree"), j.value(l.degree);
    j.key("period"), j.value(l.period);
    j.key("deviation_cents"), j.value(l.deviation_cents);
    j.key("exact"), j.value(l.exact);
    j.end_object();
}

void note_json(JsonStream& j, const Note& n, bool with_on_scale) {
    j.begin_object();
    j.key("degree"), j.value(n.degree);
    j.key("period"), j.value(n.period);
    j.key("hz"), j.value(n.hz);
    j.key("ratio");
    if (auto r = n.ratio())
        j.value(r->str());
    else
        j.null();
    if (with_on_scale) j.key("on_scale"), j.value(n.on_scale);
    j.end_object();
}

void bass_json(JsonStream& j, const CommonBass& b) {
    j.begin_object();
    j.key("found"), j.value(b.found);
    j.key("approximate"), j.value(b.approximate);
    j.key("hz");
    if (b.found)
        j.value(b.hz);
    else
        j.null();
    j.key("ratio");
    if (b.ratio)
        j.value(b.ratio->str());
    else
        j.null();
    j.key("exact_value");
    if (b.ratio)
        j.value(b.ratio->str());
    else if (b.vector)
        j.value(b.vector->str());
    else
        j.null();
    j.key("multiples");
    j.begin_array();
    for (const auto& m : b.multiples) j.value(m);
    j.end_array();
    j.key("max_error_cents"), j.value(b.max_error_cents);
    j.key("landing");
    if (b.found)
        landing_json(j, b.landing);
    else
        j.null();
    j.end_object();
}

constexpr const char* csv_header =
    "low_degree,low_period,low_hz,high_degree,high_period,high_hz,a,b,order,name,"
    "low_partial,high_partial,hz,ratio,landing_degree,landing_period,deviation_cents,"
    "exact,audibility\r\n";

void write_legend(std::ostream& out, const ToneOptions& options) {
    out << "\nlegend: term (a,b) is the tone a*f_low + b*f_high";
    if (options.partials > 1) out << " of partials i x j (a*i*f_low + b*j*f_high)";
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

void write_bass_text(std::ostream& out, const CommonBass& b) {
    out << "\ncommon resultant bass: ";
    if (!b.found) {
        out << "none within the tolerance of " << fixed(default_bass_tolerance_cents, 1) << " cents\n";
        return;
    }
    out << fixed(b.hz, 3) << " Hz";
    if (b.ratio)
        out << " (" << b.ratio->str() << ")";
    else if (b.vector)
        out << " (" << b.vector->str() << ")";
    out << (b.approximate ? ", approximate (worst note " + fixed(b.max_error_cents, 3) + " c off)" : ", exact");
    out << "; notes are its multiples";
    for (const auto& m : b.multiples) out << ' ' << m;
    out << "; lands on " << note_label(b.landing.degree, b.landing.period) << ", "
        << signed_fixed(b.landing.deviation_cents, 3) << " c" << (b.landing.exact ? " =" : "") << "\n";
}

// Bytes gathered before each write to the stream (as JsonStream does).
constexpr std::size_t flush_bytes = 1 << 16;

} // namespace

struct ResultantsWriter::State {
    std::ostream& out;
    ResultantsFormat format;
    const Keyboard& keyboard;
    ToneOptions options;
    const std::vector<Note>* chord;
    const CommonBass* bass;
    bool started = false;
    std::optional<JsonStream> json; // json formats
    std::string buf;                // csv
    std::string ratio;              // one tone's ratio text
    TermNames names;

    void start();
    void json_dyad(const DyadTones& d);
    void csv_dyad(const DyadTones& d);
    void flush_csv() {
        out.write(buf.data(), std::streamsize(buf.size()));
        buf.clear();
    }
};

void ResultantsWriter::State::start() {
    if (started) return;
    started = true;
    const Keyboard& kb = keyboard;
    switch (format) {
    case ResultantsFormat::text:
        out << kb.scale().description() << '\n'
            << "reference " << fixed(kb.ref_hz(), 4) << " Hz = degree 0 of period 0; span " << kb.span()
            << (kb.span() == 1 ? " period" : " periods") << "; order up to " << options.order;
        if (options.partials > 1) out << "; partials 1.." << options.partials;
        out << "\n";
        if (chord) {
            out << "chord:";
            for (std::size_t i = 0; i < chord->size(); ++i) out << (i ? "; " : " ") << note_text((*chord)[i]);
            out << "\n";
        }
        break;
    case ResultantsFormat::json:
    case ResultantsFormat::json_pretty: {
        json.emplace(out, format == ResultantsFormat::json_pretty);
        JsonStream& j = *json;
        j.begin_object();
        j.key("tuning"), j.value(kb.scale().description());
        j.key("ref_hz"), j.value(kb.ref_hz());
        j.key("span"), j.value(kb.span());
        j.key("order"), j.value(options.order);
        j.key("partials"), j.value(options.partials);
        j.key("dyads");
        j.begin_array();
        break;
    }
    case ResultantsFormat::csv:
        buf.reserve(flush_bytes + 4096);
        buf += csv_header;
        break;
    }
}

void ResultantsWriter::State::json_dyad(const DyadTones& d) {
    JsonStream& j = *json;
    const DyadExact exact(d.low, d.high, options.exact);
    const auto ladder = helmholtz_ladder(d.low.hz, d.high.hz, max_order);
    j.begin_object();
    j.key("low"), note_json(j, d.low, false);
    j.key("high"), note_json(j, d.high, false);
    j.key("tones");
    j.begin_array();
    for (const Tone& t : d.tones) {
        j.begin_object();
        j.key("a"), j.value(t.term.a);
        j.key("b"), j.value(t.term.b);
        j.key("order"), j.value(t.term.order());
        j.key("name"), j.value(names(t.term));
        j.key("low_partial"), j.value(t.low_partial);
        j.key("high_partial"), j.value(t.high_partial);
        j.key("hz"), j.value(t.hz);
        j.key("ratio");
        const bool rational = ratio_text(exact, t, ratio);
        if (rational)
            j.value(ratio);
        else
            j.null();
        j.key("exact_value");
        if (rational)
            j.value(ratio);
        else if (t.exact == ExactKind::vector)
            j.value(exact.text(t));
        else
            j.null();
        j.key("landing"), landing_json(j, t.landing);
        j.key("audibility"), j.value(t.audibility);
        j.key("helmholtz_level");
        if (int level = helmholtz_level(ladder, t))
            j.value(level);
        else
            j.null();
        j.end_object();
    }
    j.end_array();
    j.end_object();
}

void ResultantsWriter::State::csv_dyad(const DyadTones& d) {
    const DyadExact exact(d.low, d.high, options.exact);
    std::string dyad;
    fmt::format_to(std::back_inserter(dyad), "{},{},", d.low.degree, d.low.period);
    append_fixed(dyad, d.low.hz, 6);
    fmt::format_to(std::back_inserter(dyad), ",{},{},", d.high.degree, d.high.period);
    append_fixed(dyad, d.high.hz, 6);
    dyad += ',';
    for (const Tone& x : d.tones) {
        buf += dyad;
        fmt::format_to(std::back_inserter(buf), "{},{},{},{},{},{},", x.term.a, x.term.b, x.term.order(),
                       names(x.term), x.low_partial, x.high_partial);
        append_fixed(buf, x.hz, 6);
        buf += ',';
        if (ratio_text(exact, x, ratio)) buf += ratio;
        fmt::format_to(std::back_inserter(buf), ",{},{},", x.landing.degree, x.landing.period);
        append_fixed(buf, x.landing.deviation_cents, 6);
        buf += x.landing.exact ? ",true," : ",false,";
        append_fixed(buf, x.audibility, 4);
        buf += "\r\n";
        if (buf.size() >= flush_bytes) flush_csv();
    }
}

ResultantsWriter::ResultantsWriter(std::ostream& out, ResultantsFormat format, const Keyboard& keyboard,
                                   const ToneOptions& options, const std::vector<Note>* chord,
                                   const CommonBass* bass)
    : state_(new State{out, format, keyboard, options, chord, bass, false, std::nullopt, {}, {}, {}}) {}

ResultantsWriter::~ResultantsWriter() = default;

void ResultantsWriter::dyad(const DyadTones& d) {
    State& s = *state_;
    s.start();
    switch (s.format) {
    case ResultantsFormat::text:
        s.out << "\n" << note_text(d.low) << "  +  " << note_text(d.high) << "\n";
        if (d.tones.empty())
            s.out << "  (no combination tone of this order is positive)\n";
        else
            write_text(s.out, dyad_table(d, s.options.partials > 1));
        break;
    case ResultantsFormat::json:
    case ResultantsFormat::json_pretty: s.json_dyad(d); break;
    case ResultantsFormat::csv: s.csv_dyad(d); break;
    }
}

void ResultantsWriter::finish(const Fit& fit) {
    State& s = *state_;
    s.start();
    switch (s.format) {
    case ResultantsFormat::text:
        if (s.bass) write_bass_text(s.out, *s.bass);
        s.out << "\nfit: " << fixed(fit.rms_cents, 3) << " cents (weighted RMS of landing deviations over "
              << fit.tones << " tones, " << fit.exact << " exact)\n";
        write_legend(s.out, s.options);
        break;
    case ResultantsFormat::json:
    case ResultantsFormat::json_pretty: {
        JsonStream& j = *s.json;
        j.end_array();
        if (s.chord) {
            j.key("chord");
            j.begin_object();
            j.key("notes");
            j.begin_array();
            for (const auto& n : *s.chord) note_json(j, n, true);
            j.end_array();
            if (s.bass) j.key("common_bass"), bass_json(j, *s.bass);
            j.end_object();
        }
        j.key("fit");
        j.begin_object();
        j.key("rms_cents"), j.value(fit.rms_cents);
        j.key("total_weight"), j.value(fit.total_weight);
        j.key("tones"), j.value(fit.tones);
        j.key("exact"), j.value(fit.exact);
        j.end_object();
        j.end_object();
        break;
    }
    case ResultantsFormat::csv: s.flush_csv(); break;
    }
    s.out.flush();
}

void write_resultants(std::ostream& out, const ResultantsReport& r, ResultantsFormat format) {
    TERZO_ASSERT(r.keyboard);
    ResultantsWriter w(out, format, *r.keyboard, r.options, r.chord ? &*r.chord : nullptr,
                       r.bass ? &*r.bass : nullptr);
    for (const auto& d : r.dyads) w.dyad(d);
    w.finish(r.fit);
}

std::string note_label(int degree, int period) {
    return "degree " + std::to_string(degree) + ", period " + std::to_string(period);
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
    const DyadExact exact(dyad.low, dyad.high);
    for (const Tone& x : dyad.tones) {
        std::vector<std::string> row = {"(" + std::to_string(x.term.a) + "," + std::to_string(x.term.b) + ")",
                                        x.term.name(), std::to_string(x.term.order())};
        if (with_partials) row.push_back(std::to_string(x.low_partial) + "x" + std::to_string(x.high_partial));
        row.push_back(fixed(x.hz, 3));
        row.push_back(exact.text(x));
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

} // namespace terzo

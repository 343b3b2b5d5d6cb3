#include "core/io/session.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <iterator>
#include <sstream>

#include <nlohmann/json.hpp>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"
#include "core/format.hpp"
#include "core/tuning/scl.hpp"
#include "core/tuning/note_names.hpp"

namespace terzo {

namespace {

using Json = nlohmann::json;
using OJson = nlohmann::ordered_json;

constexpr const char* format_name = "terzo-session";
constexpr int format_version = 1;

// Line and column (1-based) of a byte offset into text.
std::pair<int, int> line_column(const std::string& text, std::size_t byte) {
    int line = 1, column = 1;
    for (std::size_t i = 0; i < byte && i < text.size(); ++i) {
        if (text[i] == '\n') {
            ++line;
            column = 1;
        } else {
            ++column;
        }
    }
    return {line, column};
}

// Checked access to one JSON object, naming keys by their path ("settings.max_order").
class Reader {
public:
    Reader(const Json& object, std::string path, const std::string& source)
        : object_(object), path_(std::move(path)), source_(source) {
        if (!object_.is_object()) fail_here(where() + " must be a JSON object");
    }

    const Json& get(const std::string& key) {
        seen_.push_back(key);
        auto it = object_.find(key);
        if (it == object_.end()) fail_here("missing key " + excerpt(key) + in());
        return *it;
    }
    std::string name(const std::string& key) const {
        return excerpt(path_.empty() ? key : path_ + "." + key);
    }
    double number(const std::string& key, double lo, double hi, bool lo_open = false) {
        const Json& v = get(key);
        double x = v.is_number() ? v.get<double>() : NAN;
        if (!v.is_number() || !std::isfinite(x) || x > hi || (lo_open ? x <= lo : x < lo))
            fail_here(name(key) + " must be a number " + (lo_open ? "above " : "from ") +
                      plain(lo) + (lo_open ? " up to " : " to ") + plain(hi) + ", found " +
                      v.dump());
        return x;
    }
    int integer(const std::string& key, int lo, int hi) {
        const Json& v = get(key);
        if (!v.is_number_integer() || v.get<long long>() < lo || v.get<long long>() > hi)
            fail_here(name(key) + " must be an integer from " + std::to_string(lo) + " to " +
                      std::to_string(hi) + ", found " + v.dump());
        return static_cast<int>(v.get<long long>());
    }
    std::string string(const std::string& key) {
        const Json& v = get(key);
        if (!v.is_string()) fail_here(name(key) + " must be a string, found " + v.dump());
        return v.get<std::string>();
    }
    const Json& array(const std::string& key, std::size_t max) {
        const Json& v = get(key);
        if (!v.is_array()) fail_here(name(key) + " must be an array, found " + v.dump());
        if (v.size() > max)
            fail_here(name(key) + " has " + std::to_string(v.size()) + " entries; at most " +
                      std::to_string(max) + " are allowed");
        return v;
    }
    void no_other_keys() const {
        for (auto it = object_.begin(); it != object_.end(); ++it)
            if (std::find(seen_.begin(), seen_.end(), it.key()) == seen_.end())
                fail_here("unknown key " + excerpt(it.key()) + in());
    }
    [[noreturn]] void fail_here(const std::string& message) const {
        fail({source_, 0, 0}, message);
    }

private:
    static std::string excerpt(const std::string& s) { return "\"" + s + "\""; }
    static std::string plain(double x) {
        std::string s = fixed(x, 3);
        while (s.back() == '0') s.pop_back();
        if (s.back() == '.') s.pop_back();
        return s;
    }
    std::string where() const { return path_.empty() ? "the session" : excerpt(path_); }
    std::string in() const { return path_.empty() ? "" : " in " + excerpt(path_); }

    const Json& object_;
    std::string path_;
    const std::string& source_;
    std::vector<std::string> seen_;
};

SessionSettings read_settings(const Json& j, const std::string& source) {
    Reader r(j, "settings", source);
    SessionSettings s;
    s.reference_hz = r.number("reference_hz", min_ref_hz, max_ref_hz);
    s.span = r.integer("span", 1, max_span);
    s.max_order = r.integer("max_order", 2, terzo::max_order);
    s.partials = r.integer("partials", 1, max_partials);
    s.landing_tolerance_cents = r.number("landing_tolerance_cents", 0.0, 600.0, true);
    s.lattice_tolerance_cents = r.number("lattice_tolerance_cents", 0.0, 600.0, true);
    s.odd_limit = r.integer("odd_limit", 1, 243);
    s.grid_measure = r.string("grid_measure");
    s.pitch_reference = r.string("pitch_reference");
    r.no_other_keys();
    check_settings(s, source);
    return s;
}

OJson settings_json(const SessionSettings& s) {
    return {{"reference_hz", s.reference_hz},
            {"span", s.span},
            {"max_order", s.max_order},
            {"partials", s.partials},
            {"landing_tolerance_cents", s.landing_tolerance_cents},
            {"lattice_tolerance_cents", s.lattice_tolerance_cents},
            {"odd_limit", s.odd_limit},
            {"grid_measure", s.grid_measure},
            {"pitch_reference", s.pitch_reference}};
}

} // namespace

void check_settings(const SessionSettings& s, const std::string& source) {
    auto bad = [&](const std::string& m) { fail({source, 0, 0}, m); };
    if (!(s.reference_hz >= min_ref_hz && s.reference_hz <= max_ref_hz))
        bad("reference pitch " + fixed(s.reference_hz, 3) + " Hz is outside 0.001 to 100000 Hz");
    if (s.span < 1 || s.span > max_span)
        bad("span " + std::to_string(s.span) + " is outside 1 to " + std::to_string(max_span) +
            " periods");
    if (s.max_order < 2 || s.max_order > terzo::max_order)
        bad("combination-tone order " + std::to_string(s.max_order) + " is outside 2 to " +
            std::to_string(terzo::max_order));
    if (s.partials < 1 || s.partials > max_partials)
        bad("partials " + std::to_string(s.partials) + " is outside 1 to " +
            std::to_string(max_partials));
    if (!(s.landing_tolerance_cents > 0.0 && s.landing_tolerance_cents <= 600.0))
        bad("landing tolerance " + fixed(s.landing_tolerance_cents, 3) +
            " cents is outside (0, 600]");
    if (!(s.lattice_tolerance_cents > 0.0 && s.lattice_tolerance_cents <= 600.0))
        bad("lattice tolerance " + fixed(s.lattice_tolerance_cents, 3) +
            " cents is outside (0, 600]");
    if (s.odd_limit < 1 || s.odd_limit > 243)
        bad("odd limit " + std::to_string(s.odd_limit) + " is outside 1 to 243");
    parse_pitch_reference(s.pitch_reference, {source, 0, 0});
    if (s.grid_measure != "worst" && s.grid_measure != "fit")
        bad("grid measure \"" + s.grid_measure + "\" is neither \"worst\" nor \"fit\"");
}

void write_session(std::ostream& out, const Session& session) {
    OJson tunings = OJson::array();
    for (const auto& t : session.tunings) {
        std::ostringstream scl;
        write_scl(scl, t.scale, std::filesystem::path(t.source).filename().string());
        tunings.push_back({{"source", t.source}, {"scl", scl.str()}});
    }
    OJson j = {{"format", format_name},
               {"version", format_version},
               {"tunings", std::move(tunings)},
               {"current", session.current},
               {"settings", settings_json(session.settings)},
               {"selection", session.selection},
               {"view", session.view},
               {"volume", session.volume}};
    out << j.dump(2) << '\n';
}

Session read_session(std::istream& in, const std::string& source) {
    std::string text;
    char buf[65536];
    while (in.read(buf, sizeof buf) || in.gcount() > 0) {
        text.append(buf, static_cast<std::size_t>(in.gcount()));
        if (text.size() > max_session_bytes)
            fail({source, 0, 0}, "the session file is larger than " +
                                     std::to_string(max_session_bytes >> 20) + " MiB");
    }
    Json j;
    try {
        j = Json::parse(text);
    } catch (const Json::parse_error& e) {
        auto [line, column] = line_column(text, e.byte == 0 ? 0 : e.byte - 1);
        std::string what = e.what();
        // nlohmann's text is "[json.exception.parse_error.101] parse error at line 1, column
        // 2: syntax error while parsing value - invalid literal; last read: 'x'"; keep the part
        // after the position, which says what was wrong.
        auto colon = what.find(": ", what.find("column"));
        std::string detail = colon == std::string::npos ? what : what.substr(colon + 2);
        fail({source, line, column}, "not valid JSON: " + detail);
    } catch (const Json::out_of_range& e) {
        // A number too large for a double ("1e999"): nlohmann reports it as out_of_range, with
        // no position (found by fuzzing; the exception used to escape).
        std::string what = e.what();
        auto quote = what.find("parsing '");
        std::string number = quote == std::string::npos ? "" : what.substr(quote + 9, what.size() - quote - 10);
        fail({source, 0, 0}, "not valid JSON: the number " + excerpt(number) + " is too large");
    }

    Reader r(j, "", source);
    if (r.get("format") != format_name)
        r.fail_here("not a terzo session: \"format\" must be \"terzo-session\"");
    if (r.get("version") != format_version)
        r.fail_here("session version " + r.get("version").dump() +
                    " is not supported; this terzo reads version 1");

    Session s;
    const Json& tunings = r.array("tunings", max_session_tunings);
    for (std::size_t i = 0; i < tunings.size(); ++i) {
        std::string path = "tunings[" + std::to_string(i) + "]";
        Reader t(tunings[i], path, source);
        std::string from = t.string("source");
        std::istringstream scl(t.string("scl"));
        t.no_other_keys();
        s.tunings.push_back({from, read_scl(scl, source + " " + path)});
    }
    int last = std::max<int>(0, static_cast<int>(s.tunings.size()) - 1);
    s.current = r.integer("current", 0, last);
    s.settings = read_settings(r.get("settings"), source);

    // Notes of the current tuning's keyboard: span periods of its degrees, plus the
    // closing note.
    int notes = s.tunings.empty()
                    ? 0
                    : s.settings.span * static_cast<int>(s.tunings[s.current].scale.size()) + 1;
    const Json& sel = r.array("selection", max_selection);
    for (const Json& k : sel) {
        if (!k.is_number_integer() || k.get<long long>() < 0 || k.get<long long>() >= notes)
            r.fail_here("\"selection\" must hold note numbers from 0 to " +
                        std::to_string(notes - 1) + " of the current keyboard, found " + k.dump());
        int note = static_cast<int>(k.get<long long>());
        if (!s.selection.empty() && note <= s.selection.back())
            r.fail_here("\"selection\" must be ascending without repeats, found " + sel.dump());
        s.selection.push_back(note);
    }
    s.view = r.string("view");
    if (std::find(session_views.begin(), session_views.end(), s.view) == session_views.end())
        r.fail_here("\"view\" must be one of lattice, grid, keys, sheet; found \"" + s.view + "\"");
    s.volume = r.number("volume", 0.0, 1.0);
    r.no_other_keys();
    return s;
}

Session load_session_file(const std::filesystem::path& path) {
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec))
        fail({path.string(), 0, 0}, "is a folder, not a session file");
    std::ifstream in(path, std::ios::binary);
    if (!in) fail({path.string(), 0, 0}, "cannot open the session file for reading");
    return read_session(in, path.string());
}

void save_session_file(const std::filesystem::path& path, const Session& session) {
    write_file_atomically(path, [&](std::ostream& out) { write_session(out, session); },
                          Overwrite::allow);
}

} // namespace terzo

#include "core/io/key_map_file.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <vector>

#include "core/io/atomic_file.hpp"
#include "core/format.hpp"

namespace terzo {

namespace {

using Json = nlohmann::json;
using OJson = nlohmann::ordered_json;

constexpr const char* format_name = "terzo-key-map";
constexpr int format_version = 1;

// Checked access to the members of one object, each message at the member's position.
class Members {
  public:
    Members(const Json& j, const std::string& source, std::string path, const JsonPositions* at)
        : j_(j), source_(source), path_(std::move(path)), at_(at) {
        if (!j_.is_object())
            fail(value_pos(path_), (path_.empty() ? std::string("a key map") : quoted(path_)) +
                                       " must be a JSON object, found " + shown(j_));
    }
    std::string path(const std::string& key) const { return path_.empty() ? key : path_ + "." + key; }
    SourcePos value_pos(const std::string& p) const {
        return at_ ? at_->value(p) : SourcePos{source_, 0, 0};
    }
    SourcePos key_pos(const std::string& p) const {
        return at_ ? at_->key(p) : SourcePos{source_, 0, 0};
    }
    const Json* find(const std::string& key) {
        seen_.push_back(key);
        auto it = j_.find(key);
        return it == j_.end() ? nullptr : &*it;
    }
    const Json& get(const std::string& key) {
        const Json* v = find(key);
        if (!v) fail(value_pos(path_), "missing key " + quoted(path(key)));
        return *v;
    }
    int integer(const std::string& key, const Json& v, int lo, int hi) const {
        if (!v.is_number_integer() || v.get<long long>() < lo || v.get<long long>() > hi)
            fail(value_pos(path(key)), quoted(path(key)) + " must be a whole number from " +
                                           std::to_string(lo) + " to " + std::to_string(hi) +
                                           ", found " + shown(v));
        return static_cast<int>(v.get<long long>());
    }
    std::string string(const std::string& key, const Json& v) const {
        if (!v.is_string())
            fail(value_pos(path(key)), quoted(path(key)) + " must be a string, found " + shown(v));
        return v.get<std::string>();
    }
    // Keys that are not allowed here, with the reason.
    void refuse(const std::string& key, const std::string& why) {
        if (j_.find(key) != j_.end()) fail(key_pos(path(key)), quoted(path(key)) + " " + why);
    }
    void no_other_keys() const {
        for (auto it = j_.begin(); it != j_.end(); ++it)
            if (std::find(seen_.begin(), seen_.end(), it.key()) == seen_.end())
                fail(key_pos(path(it.key())), "unknown key " + quoted(path(it.key())));
    }
    static std::string quoted(const std::string& s) { return "\"" + s + "\""; }
    static std::string shown(const Json& v) {
        std::string s = v.dump();
        return s.size() > 60 ? s.substr(0, 60) + "..." : s;
    }

  private:
    const Json& j_;
    const std::string& source_;
    std::string path_;
    const JsonPositions* at_;
    std::vector<std::string> seen_;
};

KeyReference read_reference(Members& m, const Json& v, const std::string& source,
                            const JsonPositions* at) {
    const std::string p = m.path("reference");
    if (v.is_string()) {
        const KeyReference ref =
            key_reference(parse_pitch_reference(v.get<std::string>(), m.value_pos(p)));
        if (ref.key < lowest_key || ref.key > highest_key)
            fail(m.value_pos(p), "the reference note " + Members::shown(v) +
                                     " is not on a MIDI key (0..127, C-1 to G9)");
        return ref;
    }
    Members r(v, source, p, at);
    KeyReference ref;
    ref.key = r.integer("key", r.get("key"), lowest_key, highest_key);
    const Json& hz = r.get("hz");
    if (!hz.is_number() || !(hz.get<double>() > 0 && hz.get<double>() <= 20000))
        fail(r.value_pos(r.path("hz")), "\"" + r.path("hz") +
                                            "\" must be a frequency above 0 and at most 20000 "
                                            "Hz, found " + Members::shown(hz));
    ref.hz = hz.get<double>();
    r.no_other_keys();
    return ref;
}

std::vector<int> read_pattern(Members& m, const Json& v) {
    const std::string p = m.path("pattern");
    if (!v.is_array() || v.empty() || v.size() > static_cast<std::size_t>(max_pattern_keys))
        fail(m.value_pos(p), "\"" + p + "\" must be an array of 1 to " +
                                 std::to_string(max_pattern_keys) +
                                 " degree numbers and \"x\" (silent), found " + Members::shown(v));
    std::vector<int> keys;
    for (std::size_t i = 0; i < v.size(); ++i) {
        const Json& e = v[i];
        const std::string ep = p + "[" + std::to_string(i) + "]";
        if (e.is_string() && e.get<std::string>() == "x") {
            keys.push_back(silent_key);
        } else if (e.is_number_integer() && e.get<long long>() >= 0 &&
                   e.get<long long>() <= max_pattern_degree) {
            keys.push_back(static_cast<int>(e.get<long long>()));
        } else {
            fail(m.value_pos(ep), "\"" + ep + "\" must be a degree number from 0 to " +
                                      std::to_string(max_pattern_degree) +
                                      " or \"x\" (silent), found " + Members::shown(e));
        }
    }
    return keys;
}

} // namespace

OJson key_map_json(const KeyMapSpec& spec) {
    OJson j = {{"format", format_name}, {"version", format_version}, {"root_key", spec.root_key}};
    j["reference"] = spec.reference ? OJson{{"key", spec.reference->key}, {"hz", spec.reference->hz}}
                                    : OJson(nullptr);
    j["layout"] = key_layout_name(spec.layout);
    if (spec.layout == KeyLayout::every_key && spec.keys_per_period > 0)
        j["keys_per_period"] = spec.keys_per_period;
    if (spec.layout == KeyLayout::pattern) {
        OJson keys = OJson::array();
        for (int k : spec.pattern.keys) keys.push_back(k == silent_key ? OJson("x") : OJson(k));
        j["pattern"] = std::move(keys);
        if (spec.pattern.degrees_per_repeat > 0)
            j["degrees_per_repeat"] = spec.pattern.degrees_per_repeat;
    }
    j["degree_order"] = spec.keep_file_order ? "file" : "pitch";
    return j;
}

void write_key_map(std::ostream& out, const KeyMapSpec& spec) {
    // One member a line, each value compact, so a 31-key pattern stays on one line.
    const OJson j = key_map_json(spec);
    out << "{\n";
    std::size_t i = 0;
    for (auto it = j.begin(); it != j.end(); ++it, ++i) {
        std::string value = it.value().dump();
        if (it.value().is_structured()) {
            // [0,"x",1] -> [0, "x", 1]; {"key":69,"hz":440.0} -> {"key": 69, "hz": 440.0}
            std::string spaced;
            bool in_string = false;
            for (char c : value) {
                spaced += c;
                if (c == '"') in_string = !in_string;
                if (!in_string && (c == ',' || c == ':')) spaced += ' ';
            }
            value = spaced;
        }
        out << "  \"" << it.key() << "\": " << value << (i + 1 < j.size() ? ",\n" : "\n");
    }
    out << "}\n";
}

KeyMapSpec key_map_from_json(const Json& j, const std::string& source, const std::string& path,
                             const JsonPositions* at) {
    Members m(j, source, path, at);
    const Json& format = m.get("format");
    if (format != format_name)
        fail(m.value_pos(m.path("format")), "not a terzo key map: \"format\" must be \"" +
                                                std::string(format_name) + "\", found " +
                                                Members::shown(format));
    const Json& version = m.get("version");
    if (version != format_version)
        fail(m.value_pos(m.path("version")), "key-map version " + Members::shown(version) +
                                                 " is not supported; this terzo reads version 1");
    KeyMapSpec spec;
    spec.root_key = m.integer("root_key", m.get("root_key"), lowest_key, highest_key);
    if (const Json* ref = m.find("reference"); ref && !ref->is_null())
        spec.reference = read_reference(m, *ref, source, at);
    const std::string layout = m.string("layout", m.get("layout"));
    spec.layout = parse_key_layout(layout, m.value_pos(m.path("layout")));
    if (spec.layout == KeyLayout::every_key) {
        if (const Json* k = m.find("keys_per_period"))
            spec.keys_per_period = m.integer("keys_per_period", *k, 1, max_pattern_keys);
    } else {
        m.refuse("keys_per_period", "belongs to the every-key layout only; this one is " + layout);
    }
    if (spec.layout == KeyLayout::pattern) {
        spec.pattern.keys = read_pattern(m, m.get("pattern"));
        if (const Json* d = m.find("degrees_per_repeat"))
            spec.pattern.degrees_per_repeat =
                m.integer("degrees_per_repeat", *d, 1, max_pattern_degree);
        if (spec.pattern.keys[0] != 0)
            fail(m.value_pos(m.path("pattern") + "[0]"),
                 "the pattern's first key is the root key and must play degree 0");
    } else {
        m.refuse("pattern", "belongs to the pattern layout only; this one is " + layout);
        m.refuse("degrees_per_repeat", "belongs to the pattern layout only; this one is " + layout);
    }
    const std::string order = m.string("degree_order", m.get("degree_order"));
    if (order != "pitch" && order != "file")
        fail(m.value_pos(m.path("degree_order")),
             "\"degree_order\" must be \"pitch\" (sort the degrees) or \"file\" (keep the "
             "tuning's order), found " + Members::shown(m.get("degree_order")));
    spec.keep_file_order = order == "file";
    m.no_other_keys();
    return spec;
}

KeyMapSpec read_key_map(std::istream& in, const std::string& source) {
    const std::string text = read_limited(in, max_key_map_bytes, source, "key-map file");
    const Json j = parse_json(text, source);
    const JsonPositions at(text, source);
    return key_map_from_json(j, source, "", &at);
}

KeyMapSpec load_key_map_file(const std::filesystem::path& path) {
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec))
        fail({path.string(), 0, 0}, "is a folder, not a key-map file");
    std::ifstream in(path, std::ios::binary);
    if (!in) fail({path.string(), 0, 0}, "cannot open the key-map file for reading");
    return read_key_map(in, path.string());
}

} // namespace terzo

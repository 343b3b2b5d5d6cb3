#include "cli/key_map_options.hpp"

#include <filesystem>
#include <fstream>

#include "core/io/key_map_file.hpp"
#include "core/tuning/scl.hpp"
#include "core/tuning/degree_order.hpp"

namespace terzo::cli {

void add_key_map_options(CLI::App* cmd, KeyMapOptions& o) {
    cmd->add_option("--key-map", o.file,
                    "Read the key map from a key-map file (options below override it)")
        ->type_name("FILE.json");
    cmd->add_option("--layout", o.layout,
                    "How keys play degrees: every-key (default), white-keys, twelve-by-pitch "
                    "(5 to 12 degrees), pattern (with --pattern)")
        ->type_name("NAME");
    o.keys_per_period_opt =
        cmd->add_option("--keys-per-period", o.keys_per_period,
                        "every-key: keys per period (default: the tuning's size; extra keys "
                        "are silent)")
            ->type_name("N");
    cmd->add_option("--pattern", o.pattern,
                    "The keys of one repeat from the root key: degree numbers and x (silent), "
                    "such as \"0 x 1 2 x 3\" (implies --layout pattern)")
        ->type_name("TEXT");
    o.degrees_per_repeat_opt =
        cmd->add_option("--degrees-per-repeat", o.degrees_per_repeat,
                        "pattern: degrees the next repeat moves up (default: the tuning's size)")
            ->type_name("N");
    cmd->add_flag("--keep-order", o.keep_order,
                  "Lay the degrees in the tuning's written order (default: sorted by pitch)");
}

SourcePos key_map_source(const KeyMapOptions& o) {
    if (!o.pattern.empty()) return {"--pattern", 0, 0};
    if (!o.layout.empty()) return {"--layout", 0, 0};
    if (!o.file.empty()) return {o.file, 0, 0};
    return {"--layout", 0, 0};
}

KeyMapSpec key_map_spec(const KeyMapOptions& o, std::optional<int> root_key,
                        std::optional<KeyReference> reference) {
    KeyMapSpec spec;
    if (!o.file.empty()) spec = load_key_map_file(o.file);
    if (!o.layout.empty()) spec.layout = parse_key_layout(o.layout, {"--layout", 0, 0});
    if (!o.pattern.empty()) {
        if (!o.layout.empty() && spec.layout != KeyLayout::pattern)
            fail({"--pattern", 0, 0}, "a pattern is its own layout; leave out --layout " + o.layout);
        spec.layout = KeyLayout::pattern;
        spec.pattern.keys = parse_pattern_keys(o.pattern, {"--pattern", 0, 0});
        if (spec.pattern.keys[0] != 0)
            fail({"--pattern", 0, 0}, "the pattern's first key is the root key and must play "
                                      "degree 0, such as \"0 x 1 2 x 3\"");
    }
    if (spec.layout == KeyLayout::pattern && spec.pattern.keys.empty())
        fail({"--layout", 0, 0}, "the pattern layout needs --pattern, such as \"0 x 1 2 x 3\"");
    if (o.keys_per_period_opt->count() > 0) {
        if (spec.layout != KeyLayout::every_key)
            fail({"--keys-per-period", 0, 0}, "belongs to the every-key layout; this key map is " +
                                                  key_layout_name(spec.layout));
        if (o.keys_per_period < 1 || o.keys_per_period > max_pattern_keys)
            fail({"--keys-per-period", 0, 0}, std::to_string(o.keys_per_period) +
                                                  " is outside 1.." + std::to_string(max_pattern_keys));
        spec.keys_per_period = o.keys_per_period;
    }
    if (o.degrees_per_repeat_opt->count() > 0) {
        if (spec.layout != KeyLayout::pattern)
            fail({"--degrees-per-repeat", 0, 0},
                 "belongs to the pattern layout; this key map is " + key_layout_name(spec.layout));
        if (o.degrees_per_repeat < 1 || o.degrees_per_repeat > max_pattern_degree)
            fail({"--degrees-per-repeat", 0, 0}, std::to_string(o.degrees_per_repeat) +
                                                     " is outside 1.." +
                                                     std::to_string(max_pattern_degree));
        spec.pattern.degrees_per_repeat = o.degrees_per_repeat;
    }
    if (o.keep_order) spec.keep_file_order = true;
    if (root_key) spec.root_key = *root_key;
    if (reference) spec.reference = reference;
    return spec;
}

void warn_degree_order(const std::string& argument, const Scale& scale, bool keep_order,
                       std::ostream& err) {
    const auto problems = degree_order_problems(scale);
    if (problems.empty()) return;
    std::vector<int> lines;
    std::error_code ec;
    if (std::filesystem::is_regular_file(argument, ec)) {
        std::ifstream in(argument, std::ios::binary);
        lines = scl_pitch_lines(in);
    }
    for (const auto& p : problems) {
        std::string where = argument;
        if (p.degree >= 1 && p.degree <= lines.size())
            where += ":" + std::to_string(lines[p.degree - 1]);
        err << where << ": warning: " << p.message << "\n";
    }
    err << argument << ": note: "
        << (keep_order ? "--keep-order lays the degrees in the order written"
                       : "the key map sorts the degrees by pitch inside the period "
                         "(--keep-order keeps the order written)")
        << "\n";
}

void warn_key_order(const KeyMap& map, std::ostream& err) {
    const auto key = first_falling_key(map);
    if (!key) return;
    int below = *key - 1;
    while (!map.step_of(below)) --below;
    err << "key map: warning: key " << *key << " (degree " << map.at(*key).degree << ", "
        << map.at(*key).hz << " Hz) is not above key " << below << " (degree "
        << map.at(below).degree << ", " << map.at(below).hz
        << " Hz); the pattern does not rise with the keys\n";
}

std::string layout_summary(const KeyMap& map, const KeyMapSpec& spec) {
    const KeyPattern& p = map.pattern();
    // A long pattern (every key of a big scale) is summarised, not listed key by key.
    const std::string keys = p.keys.size() <= 128 ? "\"" + pattern_keys_text(p.keys) + "\"" : "keys in degree order";
    return key_layout_name(spec.layout) + ", " + keys + " (" +
           std::to_string(p.keys.size()) + (p.keys.size() == 1 ? " key, " : " keys, ") +
           std::to_string(p.degrees_per_repeat) + " degrees a repeat)";
}

} // namespace terzo::cli

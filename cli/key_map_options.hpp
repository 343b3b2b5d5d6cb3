// The options that choose a key map, shared by export and render: a key-map file, a layout,
// keys per period, a pattern of one's own, the degree order. Options given on the command line
// override the file's values. Also the warnings about degrees out of order.
#pragma once

#include <memory>
#include <optional>
#include <ostream>
#include <string>

#include <CLI/CLI.hpp>

#include "core/tuning/key_map.hpp"

namespace terzo::cli {

struct KeyMapOptions {
    std::string file, layout, pattern;
    int keys_per_period = 0, degrees_per_repeat = 0;
    bool keep_order = false;
    CLI::Option *keys_per_period_opt = nullptr, *degrees_per_repeat_opt = nullptr;
};

/// Adds --key-map, --layout, --keys-per-period, --pattern, --degrees-per-repeat, --keep-order.
void add_key_map_options(CLI::App* cmd, KeyMapOptions& o);

/// The spec the options give (the file's, then each option given on top); root_key and
/// reference override it when set. Throws InputError naming the option or the file.
KeyMapSpec key_map_spec(const KeyMapOptions& o, std::optional<int> root_key,
                        std::optional<KeyReference> reference);
/// Where a key map's problems are reported: the file, or the option that chose the layout.
SourcePos key_map_source(const KeyMapOptions& o);

/// Writes "tuning.scl:12: warning: degree 5 (11/8) is lower than degree 4 (3/2)" for each
/// degree out of order in the tuning named by argument, and what the key map does about it.
void warn_degree_order(const std::string& argument, const Scale& scale, bool keep_order,
                       std::ostream& err);

/// Writes a warning when some key sounds lower than or level with the sounding key below it.
void warn_key_order(const KeyMap& map, std::ostream& err);

/// "0 x 1 x 2 3 x 4 x 5 x 6 (12 keys, 7 degrees a repeat)"
std::string layout_summary(const KeyMap& map, const KeyMapSpec& spec);

} // namespace terzo::cli

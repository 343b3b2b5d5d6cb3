// The subcommands of `terzo`. Each file cmd_<name>.cpp registers one: its options, help
// text and the call into core. Nothing here computes; output is produced in full before
// anything is printed, so an error leaves stdout empty.
#pragma once

#include <CLI/CLI.hpp>

namespace terzo::cli {

/// Thrown by a command that has printed its output in full and ends with another exit status
/// (terzo rank: 1 when some files could not be read; search and rank: 130 after Ctrl-C).
struct ExitStatus {
    int code;
};

/// Help text of every TUNING argument.
inline constexpr const char* tuning_help = "A .scl file or an inline recipe such as \"meantone 1/4\" (quote it)";

void add_inspect(CLI::App& app);
void add_search(CLI::App& app);
void add_rank(CLI::App& app);
void add_resultants(CLI::App& app);
void add_sheet(CLI::App& app);
void add_compare(CLI::App& app);
void add_render(CLI::App& app);
void add_export(CLI::App& app);
void add_measure(CLI::App& app);
void add_suggest(CLI::App& app);

} // namespace terzo::cli

// Output choices shared by the report commands (sheet, compare): one of terminal text,
// --csv, --md or --json on stdout, and an optional --svg FILE written atomically (an existing
// file is kept unless --force).
#pragma once

#include <CLI/CLI.hpp>
#include <filesystem>
#include <functional>
#include <memory>
#include <ostream>
#include <string>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"
#include "core/report/table.hpp"
#include "cli/output_file.hpp"

namespace terzo::cli {

struct ReportOutput {
    bool json = false, csv = false, md = false, force = false;
    std::string svg;  ///< file to write, empty for none
    std::string part; ///< which table --csv prints (also narrows text and Markdown)
};

/// Adds --json, --csv, --md (mutually exclusive), --svg FILE, --force and --part.
inline std::shared_ptr<ReportOutput> add_report_options(CLI::App* cmd,
                                                        const std::string& parts_help) {
    auto o = std::make_shared<ReportOutput>();
    auto* json =
        cmd->add_flag("--json", o->json, "Print one JSON object (keys listed in docs/formats.md)");
    auto* csv = cmd->add_flag("--csv", o->csv, "Print one table as CSV (choose it with --part)");
    auto* md = cmd->add_flag("--md", o->md, "Print Markdown tables");
    json->excludes(csv)->excludes(md);
    csv->excludes(md);
    cmd->add_option("--svg", o->svg, "Also write an SVG drawing to FILE")->type_name("FILE");
    cmd->add_flag("--force", o->force, "Let --svg replace an existing file");
    cmd->add_option("--part", o->part, parts_help)->type_name("PART");
    return o;
}

/// Writes one titled table in the chosen text form.
inline void write_part(std::ostream& out, const ReportOutput& o, const std::string& title,
                       const Table& t) {
    if (o.md) {
        out << "### " << title << "\n\n";
        write_markdown(out, t);
        out << '\n';
    } else {
        out << title << '\n';
        write_text(out, t);
        out << '\n';
    }
}

/// Refuses early, before any work, an --svg file that exists when --force is not given (the
/// atomic write checks again when it replaces the file).
inline void check_svg_target(const ReportOutput& o) {
    if (!o.svg.empty()) check_output_file(o.svg, o.force);
}

/// Writes the SVG file when one was asked for.
inline void write_svg_file(const ReportOutput& o, const std::string& content) {
    if (o.svg.empty()) return;
    write_file_atomically(
        o.svg, [&](std::ostream& out) { out << content; },
        o.force ? Overwrite::allow : Overwrite::refuse);
}

} // namespace terzo::cli

#include <iostream>
#include <sstream>

#include "cli/commands.hpp"
#include "core/report/scale_report.hpp"
#include "core/tuning/load.hpp"

namespace terzo::cli {

void add_inspect(CLI::App& app) {
    auto* cmd = app.add_subcommand("inspect", "Show the degrees of a tuning: exact value, cents, steps");
    auto tuning = std::make_shared<std::string>();
    auto json = std::make_shared<bool>(false);
    cmd->add_option("TUNING", *tuning, tuning_help)->required();
    cmd->add_flag("--json", *json, "Print one JSON object (keys listed in docs/formats.md)");
    cmd->callback([=] {
        Scale scale = load_tuning(*tuning);
        std::ostringstream out;
        if (*json) {
            out << scale_json(scale).dump(2) << '\n';
        } else {
            out << scale.description() << '\n'
                << scale.size() << " degrees, period " << scale.period().str()
                << (scale.is_exact() ? "" : " (some degrees are cents-only, inexact)") << "\n\n";
            write_text(out, degree_table(scale));
        }
        std::cout << out.str();
    });
}

} // namespace terzo::cli

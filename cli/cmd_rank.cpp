#include <iostream>
#include <sstream>
#include <thread>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/interrupt.hpp"
#include "core/analysis/rank.hpp"
#include "core/format.hpp"
#include "core/report/table.hpp"

namespace terzo::cli {

void add_rank(CLI::App& app) {
    auto* cmd = app.add_subcommand("rank", "Rank .scl files (folders are read recursively) by one metric, best first; "
                                           "files that cannot be read are reported on stderr");
    struct Args {
        std::vector<std::string> inputs;
        std::string by = "worst-major-third";
        int threads = 0;
        bool json = false, quiet = false, list_skipped = false;
    };
    auto a = std::make_shared<Args>();
    cmd->add_option("FILES", a->inputs, ".scl files or folders")->required();
    cmd->add_option("--by", a->by, "metric: " + rank_metric_names() + " (default worst-major-third)");
    cmd->add_option("--threads", a->threads, "threads (default: one per core)");
    cmd->add_flag("--json", a->json, "print one JSON object (keys in docs/formats.md)");
    cmd->add_flag("--quiet", a->quiet, "no progress on stderr");
    cmd->add_flag("--list-skipped", a->list_skipped, "name each tuning the metric does not apply to (e.g. not 12 notes)");
    cmd->callback([a] {
        RankMetric metric = parse_rank_metric(a->by, "--by");
        InterruptScope interrupt;
        ProgressPrinter progress("rank", a->quiet);
        SearchControl control;
        unsigned hw = std::thread::hardware_concurrency();
        control.threads = a->threads > 0 ? a->threads : static_cast<int>(std::clamp(hw == 0 ? 1u : hw, 1u, 64u));
        control.cancel = interrupt.flag();
        control.progress = [&](const SearchProgress& p) { progress(p); };
        Ranking r = rank_tunings(a->inputs, metric, control);
        progress.finish();
        std::ostringstream out;
        if (a->json) {
            nlohmann::ordered_json j;
            j["metric"] = rank_metric_name(metric);
            j["files"] = r.files;
            j["ranked"] = nlohmann::ordered_json::array();
            for (std::size_t i = 0; i < r.entries.size(); ++i)
                j["ranked"].push_back({{"rank", i + 1}, {"value", r.entries[i].value}, {"path", r.entries[i].path},
                                       {"notes", r.entries[i].notes}, {"description", r.entries[i].description}});
            j["failed"] = nlohmann::ordered_json::array();
            for (const auto& f : r.failures) j["failed"].push_back({{"path", f.path}, {"error", f.message}});
            j["skipped"] = nlohmann::ordered_json::array();
            for (const auto& f : r.skipped) j["skipped"].push_back({{"path", f.path}, {"reason", f.message}});
            j["cancelled"] = r.cancelled;
            out << j.dump(2) << '\n';
        } else if (!r.entries.empty()) {
            Table t;
            t.header = {"rank", rank_metric_name(metric), "notes", "file", "description"};
            t.align = {Table::Align::right, Table::Align::right, Table::Align::right, Table::Align::left, Table::Align::left};
            for (std::size_t i = 0; i < r.entries.size(); ++i) {
                const auto& e = r.entries[i];
                t.add({std::to_string(i + 1), metric == RankMetric::wolves ? std::to_string(static_cast<int>(e.value)) : fixed(e.value, 3),
                       std::to_string(e.notes), e.path, e.description});
            }
            write_text(out, t);
        }
        std::cout << out.str() << std::flush;
        if (!a->json) {
            for (const auto& f : r.failures) std::cerr << f.message << '\n';
            if (a->list_skipped)
                for (const auto& f : r.skipped) std::cerr << f.message << '\n';
            if (!r.skipped.empty())
                std::cerr << "terzo rank: " << r.skipped.size() << " tuning" << (r.skipped.size() == 1 ? "" : "s")
                          << " skipped: " << rank_metric_name(metric) << " does not apply to "
                          << (r.skipped.size() == 1 ? "it" : "them")
                          << (metric == RankMetric::fit ? "" : " (key metrics need 12 notes; --by fit ranks any size)")
                          << (a->list_skipped ? "" : "; --list-skipped names them") << "\n";
        }
        if (r.cancelled) std::cerr << "terzo rank: interrupted; the ranking above covers the files read before stopping\n";
        if (!r.failures.empty())
            std::cerr << "terzo rank: " << r.failures.size() << " could not be ranked, " << r.entries.size() << " ranked\n";
        if (r.cancelled) throw ExitStatus{130};
        if (!r.failures.empty()) throw ExitStatus{1};
    });
}

} // namespace terzo::cli

#include <iostream>

#include "cli/commands.hpp"
#include "cli/counts.hpp"
#include "cli/interrupt.hpp"
#include "cli/text_output.hpp"
#include "core/analysis/rank.hpp"
#include "core/text.hpp"
#include "core/report/rank_report.hpp"

namespace terzo::cli {

void add_rank(CLI::App& app) {
    auto* cmd = app.add_subcommand("rank", "Rank .scl files (folders are read recursively) by one metric, best first; "
                                           "files that cannot be read are reported on stderr");
    struct Args {
        std::vector<std::string> inputs;
        std::string by = "worst-major-third";
        long long threads = 0;
        double time_limit = default_time_limit_minutes;
        bool json = false, quiet = false, list_skipped = false;
    };
    auto a = std::make_shared<Args>();
    cmd->add_option("FILES", a->inputs, ".scl files or folders")->required();
    cmd->add_option("--by", a->by, "metric: " + rank_metric_names() + " (default worst-major-third)");
    auto* threads = cmd->add_option("--threads", a->threads, "threads (default: one per core)");
    cmd->add_flag("--json", a->json, "print one JSON object (keys in docs/formats.md)");
    cmd->add_flag("--quiet", a->quiet, "no progress on stderr");
    cmd->add_option("--time-limit", a->time_limit, "stop after this many minutes, ranking the files read by then, exit "
                                                   "status 3 (default 60; 0: no limit)");
    cmd->add_flag("--list-skipped", a->list_skipped, "name each tuning the metric does not apply to (e.g. not 12 notes)");
    cmd->callback([a, threads] {
        RankMetric metric = parse_rank_metric(a->by, "--by");
        SearchControl control;
        control.threads = thread_count(threads->count() > 0, a->threads);
        StopControl stop(a->time_limit);
        ProgressPrinter progress("rank", a->quiet, a->time_limit);
        control.cancel = stop.flag();
        control.progress = [&](const SearchProgress& p) {
            stop.poll();
            progress(p);
        };
        Ranking r = rank_tunings(a->inputs, metric, control);
        progress.finish();
        print_text(a->json ? json_text(ranking_json(r, metric)) + '\n' : ranking_text(r, metric));
        std::cerr << printable(ranking_messages(r, metric, a->list_skipped, a->json, stop.timed_out())) << std::flush;
        if (r.cancelled) throw ExitStatus{stop.timed_out() ? 3 : 130};
        if (!r.failures.empty()) throw ExitStatus{1};
    });
}

} // namespace terzo::cli

#include <filesystem>
#include <functional>
#include <iostream>
#include <optional>
#include <sstream>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/counts.hpp"
#include "cli/interrupt.hpp"
#include "cli/output_file.hpp"
#include "cli/text_output.hpp"
#include "core/analysis/search.hpp"
#include "core/io/atomic_file.hpp"
#include "core/format.hpp"
#include "core/text.hpp"
#include "core/report/search_report.hpp"

namespace terzo::cli {

namespace {

struct SearchArgs {
    std::string space;
    std::string fractions = "0,1/6,1/4";
    std::vector<std::string> parts, beats, fits, targets;
    std::string reference = "A4=440", weights, period = "2/1", statistic = "rms";
    bool no_wide = false, all_copies = false, no_pruning = false, json = false, force = false, quiet = false;
    std::optional<double> max_fifth, max_major_third, max_minor_third;
    std::size_t top = 10, starts = 3;
    int threads = 0, generators = 11, max_steps = 72;
    long long top_given = 10, starts_given = 3, threads_given = 0;
    double time_limit = default_time_limit_minutes;
    std::string write_dir;
};

Pitch parse_period(const std::string& text) {
    if (text.find('.') != std::string::npos) {
        char* end = nullptr;
        double c = std::strtod(text.c_str(), &end);
        if (*end != '\0' || !(c > 0) || c > 1e5)
            fail({"--period", 0, 0}, "expected a ratio such as 2/1 or cents from 0 to 100000 such as 1901.955, found " + terzo::excerpt(text));
        return Pitch::from_cents(c);
    }
    Ratio r = parse_ratio(text, {"--period", 1, 1});
    if (r <= Ratio(1)) fail({"--period", 0, 0}, "the period must be larger than 1/1, found " + r.str());
    return Pitch::from_ratio(r);
}

Statistic parse_statistic(const std::string& text) {
    if (text == "rms") return Statistic::rms;
    if (text == "mean") return Statistic::mean;
    if (text == "worst") return Statistic::worst;
    fail({"--statistic", 0, 0}, "expected rms, mean or worst, found " + terzo::excerpt(text));
}

Cost build_cost(const SearchArgs& a) {
    Cost c;
    for (const auto& p : a.parts) c.deviations.push_back(parse_deviation_part(p, "--part"));
    for (const auto& p : a.beats) c.beats.push_back(parse_beat_part(p, "--beats"));
    for (const auto& p : a.fits) c.fits.push_back(parse_fit_part(p, "--fit"));
    if (c.deviations.empty() && c.beats.empty() && c.fits.empty())
        c.deviations.push_back({KeyInterval::major_third, Statistic::rms, 1.0});
    c.reference = parse_pitch_reference(a.reference, {"--reference", 0, 0});
    if (!a.weights.empty()) c.weights = read_key_weights(a.weights);
    c.constraints.no_wide_fifths = a.no_wide;
    c.constraints.max_fifth = a.max_fifth;
    c.constraints.max_major_third = a.max_major_third;
    c.constraints.max_minor_third = a.max_minor_third;
    return c;
}

/// The search as given, every setting spelled out (defaults too), for the comments of the
/// .scl files it writes.
std::string search_parameters(const SearchArgs& a) {
    std::string s = "terzo search " + a.space;
    auto opt = [&](const std::string& name, const std::string& value) { s += " " + name + " " + value; };
    if (a.space == "circulating" || a.space == "continuous") {
        opt("--fractions", a.fractions);
        for (const auto& p : a.parts) opt("--part", p);
        for (const auto& p : a.beats) opt("--beats", p);
        for (const auto& p : a.fits) opt("--fit", p);
        opt("--reference", a.reference);
        if (!a.weights.empty()) opt("--weights", a.weights);
        if (a.no_wide) s += " --no-wide-fifths";
        if (a.max_fifth) opt("--max-fifth", number_text(*a.max_fifth));
        if (a.max_major_third) opt("--max-major-third", number_text(*a.max_major_third));
        if (a.max_minor_third) opt("--max-minor-third", number_text(*a.max_minor_third));
        if (a.all_copies) s += " --all-copies";
        if (a.no_pruning) s += " --no-pruning";
        if (a.space == "continuous") opt("--starts", std::to_string(a.starts));
    } else {
        for (const auto& t : a.targets) opt("--target", t);
        opt("--statistic", a.statistic);
        opt("--period", a.period);
        if (a.space == "rank2") opt("--generators", std::to_string(a.generators));
        else opt("--max-steps", std::to_string(a.max_steps));
    }
    opt("--top", std::to_string(a.top));
    return s;
}

/// The comment lines of each written .scl: the parameters, then the report's header (up to
/// its first blank line).
std::vector<std::string> scl_comments(const SearchArgs& a, const std::string& report_text) {
    std::vector<std::string> lines{"Made by: " + search_parameters(a)};
    std::istringstream in(report_text);
    for (std::string line; std::getline(in, line) && !line.empty();) lines.push_back(line);
    return lines;
}

/// Writes the scales when asked (before anything is printed, so a refusal leaves stdout
/// empty), all or none, and returns the paths written.
std::optional<std::vector<std::string>> write_scales(const SearchArgs& a, const std::string& stem,
                                                     const std::function<std::vector<Scale>()>& scales,
                                                     const std::string& report_text) {
    if (a.write_dir.empty()) return std::nullopt;
    std::vector<FileContent> files;
    for (auto& f : search_scl_files(stem, scales(), scl_comments(a, report_text))) files.push_back({f.name, f.text});
    // Every target is checked before anything is written, with the message of every command.
    std::error_code ec;
    if (std::filesystem::is_directory(a.write_dir, ec))
        for (const FileContent& f : files) check_output_file(std::filesystem::path(a.write_dir) / f.name, a.force);
    std::vector<std::string> written;
    for (const auto& p : write_file_set(a.write_dir, files, a.force ? Overwrite::allow : Overwrite::refuse, "--write-scl"))
        written.push_back(p.string());
    return written;
}

/// Prints the report: JSON (with the files written), or the text and a line naming them.
void print_report(const SearchArgs& a, const std::string& text, const std::optional<std::vector<std::string>>& written,
                  const std::function<nlohmann::ordered_json(const std::vector<std::string>*)>& json) {
    std::string out;
    if (a.json) {
        out = json_text(json(written ? &*written : nullptr)) + '\n';
    } else {
        out = text;
        if (written)
            out += "wrote " + std::to_string(written->size()) + " .scl file" + (written->size() == 1 ? "" : "s") + " to " +
                   a.write_dir + "\n";
    }
    print_text(out);
}

void run_circulating(const SearchArgs& a, bool continuous) {
    CostModel model(build_cost(a), "--part");
    CirculatingSpace space{parse_fractions(a.fractions, "--fractions"), !a.all_copies, !a.no_pruning};
    StopControl stop(a.time_limit);
    ProgressPrinter progress(continuous ? "search continuous" : "search circulating", a.quiet, a.time_limit);
    SearchControl control;
    control.threads = a.threads;
    control.cancel = stop.flag();
    control.progress = [&](const SearchProgress& p) {
        stop.poll();
        progress(p);
    };
    CirculatingSearch ex;
    ContinuousSearch co;
    if (continuous) {
        co = search_continuous(space, model, a.top, a.starts, control);
        ex = co.exhaustive;
    } else {
        ex = search_circulating(space, model, a.top, control);
    }
    progress.finish();
    CirculatingReport report{space, model, ex, continuous ? &co : nullptr};
    const std::string text = circulating_text(report);
    auto written = write_scales(a, continuous ? "continuous" : "circulating", [&] { return circulating_scales(report); }, text);
    print_report(a, text, written, [&](const std::vector<std::string>* w) { return circulating_json(report, w); });
    if (report.cancelled() && stop.timed_out()) {
        std::cerr << "terzo search: stopped at the time limit of " << number_text(stop.minutes())
                  << " min (--time-limit); the results above are the best found by then\n";
        throw ExitStatus{3};
    }
    if (report.cancelled()) {
        std::cerr << "terzo search: interrupted; the results above are the best found before stopping\n";
        throw ExitStatus{130};
    }
}

TargetCost build_targets(const SearchArgs& a, const std::vector<std::string>& defaults) {
    TargetCost c;
    for (const auto& t : a.targets.empty() ? defaults : a.targets) c.targets.push_back(parse_target(t, "--target"));
    c.statistic = parse_statistic(a.statistic);
    check_target_cost(c);
    return c;
}

void run_rank2(const SearchArgs& a) {
    TargetCost cost = build_targets(a, {"3/2", "5/4"});
    Pitch period = parse_period(a.period);
    auto results = search_rank2(cost, period.cents(), a.generators, a.top);
    Rank2Report report{cost, period, a.generators, results};
    const std::string text = rank2_text(report);
    auto written = write_scales(a, "rank2", [&] { return rank2_scales(report); }, text);
    print_report(a, text, written, [&](const std::vector<std::string>* w) { return rank2_json(report, w); });
}

void run_equal(const SearchArgs& a) {
    TargetCost cost = build_targets(a, {"3/2", "5/4", "6/5"});
    Pitch period = parse_period(a.period);
    auto results = search_equal(cost, period.cents(), a.max_steps, a.top);
    EqualReport report{cost, period, a.max_steps, results};
    const std::string text = equal_text(report);
    auto written = write_scales(a, "equal", [&] { return equal_scales(report); }, text);
    print_report(a, text, written, [&](const std::vector<std::string>* w) { return equal_json(report, w); });
}

} // namespace

void add_search(CLI::App& app) {
    auto* cmd = app.add_subcommand("search", "Search for tunings that minimise a cost: circulating temperaments "
                                             "(exhaustive or continuous), rank-2 chains, equal divisions");
    auto a = std::make_shared<SearchArgs>();
    cmd->add_option("SPACE", a->space, "circulating, continuous, rank2 or equal")->required();
    cmd->add_option("--fractions", a->fractions, "circulating/continuous: fractions of the Pythagorean comma a fifth may be narrowed by (default 0,1/6,1/4)");
    cmd->add_option("--part", a->parts, "cost part INTERVAL:STATISTIC[:WEIGHT], e.g. major-third:rms or fifth:worst:0.5 (default major-third:rms)");
    cmd->add_option("--beats", a->beats, "cost part INTERVAL:HZ[:WEIGHT]: beats above HZ count, e.g. major-third:8");
    cmd->add_option("--fit", a->fits, "cost part SHAPE[:WEIGHT]: resultant fit of a chord on every root, e.g. 0+4+7 (circulating only)");
    cmd->add_option("--reference", a->reference, "reference pitch for beat rates and fits (default A4=440)");
    cmd->add_option("--weights", a->weights, "key weights file (one \"<note> major|minor <weight>\" a line)");
    cmd->add_flag("--no-wide-fifths", a->no_wide, "constraint: no fifth wider than pure");
    cmd->add_option("--max-fifth", a->max_fifth, "constraint: every fifth within this many cents of pure");
    cmd->add_option("--max-major-third", a->max_major_third, "constraint: every major third within this many cents of pure");
    cmd->add_option("--max-minor-third", a->max_minor_third, "constraint: every minor third within this many cents of pure");
    cmd->add_flag("--all-copies", a->all_copies, "circulating: also evaluate rotated and mirrored copies");
    cmd->add_flag("--no-pruning", a->no_pruning, "circulating: evaluate every candidate, even where the fifths chosen so far already cost too much");
    cmd->add_option("--starts", a->starts_given, "continuous: exhaustive results to start the optimiser from (default 3)");
    cmd->add_option("--target", a->targets, "rank2/equal: target interval RATIO[=GENERATORS][*WEIGHT], e.g. 5/4=4 (defaults: 3/2 5/4 for rank2, 3/2 5/4 6/5 for equal)");
    cmd->add_option("--statistic", a->statistic, "rank2/equal: rms, mean or worst of the targets' errors (default rms)");
    cmd->add_option("--period", a->period, "rank2/equal: the period, a ratio or cents with a '.' (default 2/1)");
    cmd->add_option("--generators", a->generators, "rank2: generators in the chain (default 11, so 12 notes)");
    cmd->add_option("--max-steps", a->max_steps, "equal: largest number of steps (default 72)");
    cmd->add_option("--top", a->top_given, "results to show (default 10, at most 1000)");
    auto* threads = cmd->add_option("--threads", a->threads_given, "threads (default: one per core)");
    cmd->add_flag("--json", a->json, "print one JSON object (keys in docs/formats.md)");
    cmd->add_option("--write-scl", a->write_dir, "also write each result as a .scl file into this folder");
    cmd->add_flag("--force", a->force, "replace existing .scl files");
    cmd->add_flag("--quiet", a->quiet, "no progress on stderr");
    cmd->add_option("--time-limit", a->time_limit, "circulating/continuous: stop after this many minutes with the best found "
                                                   "so far, exit status 3 (default 60; 0: no limit)");
    cmd->callback([a, threads] {
        a->top = static_cast<std::size_t>(checked_count(a->top_given, "--top", "result count", 1, static_cast<long long>(max_results)));
        a->starts = static_cast<std::size_t>(checked_count(a->starts_given, "--starts", "start count", 1, 100));
        a->threads = thread_count(threads->count() > 0, a->threads_given);
        if (a->space == "circulating") run_circulating(*a, false);
        else if (a->space == "continuous") run_circulating(*a, true);
        else if (a->space == "rank2") run_rank2(*a);
        else if (a->space == "equal") run_equal(*a);
        else fail({"SPACE", 0, 0}, "unknown search space " + terzo::excerpt(a->space) + "; use circulating, continuous, rank2 or equal");
    });
}

} // namespace terzo::cli

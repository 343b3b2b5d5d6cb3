#include <filesystem>
#include <iostream>
#include <sstream>
#include <thread>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/output_file.hpp"
#include "cli/interrupt.hpp"
#include "core/analysis/search.hpp"
#include "core/io/atomic_file.hpp"
#include "core/format.hpp"
#include "core/tuning/scl.hpp"
#include "core/report/table.hpp"
#include "core/tuning/temperament.hpp"

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
    std::string write_dir;
};

int default_threads() {
    unsigned n = std::thread::hardware_concurrency();
    return static_cast<int>(std::clamp(n == 0 ? 1u : n, 1u, 64u));
}

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

std::string describe_cost(const Cost& c) {
    std::string s;
    auto add = [&](const std::string& t) { s += (s.empty() ? "" : " + ") + t; };
    for (const auto& p : c.deviations)
        add(fixed(p.weight, 2) + " x " + statistic_name(p.statistic) + " of the " + key_interval_name(p.interval) + "s' deviations");
    for (const auto& p : c.beats)
        add(fixed(p.weight, 2) + " x Hz of " + key_interval_name(p.interval) + " beats above " + fixed(p.limit_hz, 2) + " Hz");
    for (const auto& p : c.fits) {
        std::string shape;
        for (int x : p.shape) shape += (shape.empty() ? "" : "+") + std::to_string(x);
        add(fixed(p.weight, 2) + " x resultant fit of " + shape + " on every root");
    }
    std::string k;
    auto con = [&](const std::string& t) { k += (k.empty() ? "" : ", ") + t; };
    if (c.constraints.no_wide_fifths) con("no fifth wider than pure");
    if (c.constraints.max_fifth) con("every fifth within " + fixed(*c.constraints.max_fifth, 3) + " c");
    if (c.constraints.max_major_third) con("every major third within " + fixed(*c.constraints.max_major_third, 3) + " c");
    if (c.constraints.max_minor_third) con("every minor third within " + fixed(*c.constraints.max_minor_third, 3) + " c");
    return "cost: " + s + (k.empty() ? "" : "\nconstraints: " + k) + "\n";
}

/// "1/4", and "0" or "-1" rather than "0/1".
std::string fraction_text(const Ratio& r) { return r.den() == 1 ? std::to_string(r.num()) : r.str(); }

std::string fifth_name(int i) {
    return pitch_class_name(7 * i % 12) + "-" + pitch_class_name(7 * (i + 1) % 12);
}

nlohmann::ordered_json parts_json(const CostBreakdown& b) {
    nlohmann::ordered_json j = nlohmann::ordered_json::array();
    for (const auto& p : b.parts) j.push_back({{"name", p.name}, {"value", p.value}, {"weight", p.weight}});
    return j;
}

/// Writes each scale as DIR/<stem>-<rank>.scl; checks every target first so that a refused
/// overwrite leaves nothing written.
std::vector<std::string> write_scales(const std::string& dir, const std::string& stem, const std::vector<Scale>& scales, bool force) {
    namespace fs = std::filesystem;
    std::error_code ec;
    fs::create_directories(dir, ec);
    if (ec) fail({"--write-scl", 0, 0}, "cannot create the folder " + dir + ": " + ec.message());
    std::vector<fs::path> paths;
    for (std::size_t i = 0; i < scales.size(); ++i) {
        std::string n = std::to_string(i + 1);
        paths.push_back(fs::path(dir) / (stem + "-" + std::string(n.size() < 2 ? 2 - n.size() : 0, '0') + n + ".scl"));
        check_output_file(paths.back(), force);
    }
    std::vector<std::string> written;
    for (std::size_t i = 0; i < scales.size(); ++i) {
        write_file_atomically(paths[i], [&](std::ostream& o) { write_scl(o, scales[i], paths[i].filename().string()); },
                              force ? Overwrite::allow : Overwrite::refuse);
        written.push_back(paths[i].string());
    }
    return written;
}

/// Writes the scales when asked (before anything is printed, so a refusal leaves stdout
/// empty) and returns the line or JSON entry that reports them.
void write_and_report(const SearchArgs& a, const std::string& stem, const std::vector<Scale>& scales,
                      nlohmann::ordered_json* json, std::string& text) {
    if (a.write_dir.empty()) return;
    std::vector<std::string> written = write_scales(a.write_dir, stem, scales, a.force);
    if (json) {
        (*json)["scl_files"] = written;
        return;
    }
    text = "wrote " + std::to_string(written.size()) + " .scl file" + (written.size() == 1 ? "" : "s") + " to " + a.write_dir + "\n";
}

void run_circulating(const SearchArgs& a, bool continuous) {
    CostModel model(build_cost(a), "--part");
    CirculatingSpace space{parse_fractions(a.fractions, "--fractions"), !a.all_copies, !a.no_pruning};
    InterruptScope interrupt;
    ProgressPrinter progress(continuous ? "search continuous" : "search circulating", a.quiet);
    SearchControl control;
    control.threads = a.threads > 0 ? a.threads : default_threads();
    control.cancel = interrupt.flag();
    control.progress = [&](const SearchProgress& p) { progress(p); };
    CirculatingSearch ex;
    ContinuousSearch co;
    if (continuous) {
        co = search_continuous(space, model, a.top, a.starts, control);
        ex = co.exhaustive;
    } else {
        ex = search_circulating(space, model, a.top, control);
    }
    progress.finish();
    bool cancelled = ex.cancelled || (continuous && co.cancelled);
    std::string fr;
    for (const Ratio& f : space.fractions) fr += (fr.empty() ? "" : ", ") + fraction_text(f);
    std::ostringstream out;
    std::vector<Scale> scales;
    if (!continuous)
        for (std::size_t i = 0; i < ex.results.size(); ++i)
            scales.push_back(circulating_scale(ex.results[i].fractions, "terzo search circulating, rank " + std::to_string(i + 1)));
    else
        for (std::size_t i = 0; i < co.results.size(); ++i)
            scales.push_back(narrowings_scale(co.results[i].narrowing, "terzo search continuous, rank " + std::to_string(i + 1)));
    std::string written;
    if (a.json) {
        nlohmann::ordered_json j;
        write_and_report(a, continuous ? "continuous" : "circulating", scales, &j, written);
        j["space"] = continuous ? "continuous" : "circulating";
        j["fractions"] = nlohmann::ordered_json::array();
        for (const Ratio& f : space.fractions) j["fractions"].push_back(fraction_text(f));
        j["distributions"] = ex.total;
        j["enumerated"] = ex.enumerated;
        j["evaluated"] = ex.evaluated;
        j["symmetry"] = {{"rotations", ex.symmetry_rotations}, {"mirror", ex.symmetry_mirror}};
        j["cancelled"] = cancelled;
        j["results"] = nlohmann::ordered_json::array();
        if (!continuous) {
            for (std::size_t i = 0; i < ex.results.size(); ++i) {
                const auto& r = ex.results[i];
                nlohmann::ordered_json x;
                x["rank"] = i + 1;
                x["cost"] = r.cost;
                x["parts"] = parts_json(r.breakdown);
                x["copies"] = r.copies;
                x["fractions"] = nlohmann::ordered_json::array();
                for (const Ratio& f : r.fractions) x["fractions"].push_back(fraction_text(f));
                x["narrowing_cents"] = r.narrowing;
                x["positions_cents"] = positions_from_narrowings(r.narrowing);
                j["results"].push_back(x);
            }
        } else {
            for (std::size_t i = 0; i < co.results.size(); ++i) {
                const auto& r = co.results[i];
                nlohmann::ordered_json x;
                x["rank"] = i + 1;
                x["cost"] = r.breakdown.total;
                x["parts"] = parts_json(r.breakdown);
                x["feasible"] = r.breakdown.feasible;
                x["narrowing_cents"] = r.narrowing;
                x["positions_cents"] = positions_from_narrowings(r.narrowing);
                x["start_cost"] = r.start_cost;
                j["results"].push_back(x);
            }
        }
        out << j.dump(2) << '\n';
    } else {
        write_and_report(a, continuous ? "continuous" : "circulating", scales, nullptr, written);
        out << "circulating temperaments: the fifths C-G, G-D … F-C each narrowed by " << fr
            << " of the Pythagorean comma, together one comma\n"
            << describe_cost(model.cost()) << ex.total << " distributions, ";
        if (ex.evaluated == ex.total) {
            out << "all evaluated\n";
        } else {
            out << ex.evaluated << " evaluated; the others ";
            if (ex.symmetry_rotations)
                out << (ex.symmetry_mirror ? "are rotations or mirror images" : "are rotations")
                    << " of these (same cost)" << (space.prune ? ", or were cut off" : "");
            else
                out << "were cut off";
            if (space.prune) out << " when their first fifths already cost more than the results kept";
            if (ex.rejected > 0 || model.cost().constraints.no_wide_fifths || model.cost().constraints.max_fifth ||
                model.cost().constraints.max_major_third || model.cost().constraints.max_minor_third)
                out << ", or break a constraint";
            out << "\n";
        }
        if (cancelled) out << "cancelled after " << ex.enumerated << " of " << ex.total << "; the best found so far:\n";
        out << "\n";
        Table t;
        t.header = {"rank", "cost"};
        std::vector<PartValue> parts;
        if (!continuous && !ex.results.empty()) parts = ex.results[0].breakdown.parts;
        if (continuous && !co.results.empty()) parts = co.results[0].breakdown.parts;
        for (const auto& p : parts) t.header.push_back(p.name);
        if (!continuous) t.header.push_back("copies");
        for (int i = 0; i < 12; ++i) t.header.push_back(fifth_name(i));
        if (continuous) t.header.push_back("start");
        t.align.assign(t.header.size(), Table::Align::right);
        if (!continuous) {
            for (std::size_t i = 0; i < ex.results.size(); ++i) {
                const auto& r = ex.results[i];
                std::vector<std::string> row{std::to_string(i + 1), fixed(r.cost, 4)};
                for (const auto& p : r.breakdown.parts) row.push_back(fixed(p.value, 4));
                row.push_back(std::to_string(r.copies));
                for (const Ratio& f : r.fractions) row.push_back(fraction_text(f));
                t.add(row);
            }
            write_text(out, t);
            out << "\ncells under the fifths: fraction of the Pythagorean comma by which that fifth is narrowed;\n"
                   "copies: temperaments of the space this one stands for (itself started on other notes, or upside down)\n";
        } else {
            for (std::size_t i = 0; i < co.results.size(); ++i) {
                const auto& r = co.results[i];
                std::vector<std::string> row{std::to_string(i + 1), fixed(r.breakdown.total, 4) + (r.breakdown.feasible ? "" : "!")};
                for (const auto& p : r.breakdown.parts) row.push_back(fixed(p.value, 4));
                for (double n : r.narrowing) row.push_back(fixed(n, 3));
                row.push_back(fixed(r.start_cost, 4));
                t.add(row);
            }
            write_text(out, t);
            out << "\ncells under the fifths: cents by which that fifth is narrowed; start: cost of the exhaustive\n"
                   "result the optimiser started from; ! marks a result that breaks a constraint\n";
        }
    }
    out << written;
    std::cout << out.str() << std::flush;
    if (cancelled) {
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

std::string target_header(const TargetCost& c) {
    std::string s;
    for (const auto& t : c.targets) {
        s += (s.empty() ? "" : ", ") + t.ratio.str();
        if (t.generators) s += " (" + std::to_string(*t.generators) + (std::abs(*t.generators) == 1 ? " generator)" : " generators)");
        if (t.weight != 1.0) s += " x" + fixed(t.weight, 2);
    }
    return s;
}

void run_rank2(const SearchArgs& a) {
    TargetCost cost = build_targets(a, {"3/2", "5/4"});
    Pitch period = parse_period(a.period);
    auto results = search_rank2(cost, period.cents(), a.generators, a.top);
    std::ostringstream out;
    std::vector<Scale> scales;
    for (std::size_t i = 0; i < results.size(); ++i)
        scales.push_back(generator_chain(Pitch::from_cents(results[i].generator), a.generators, 0, period,
                                         "terzo search rank2, rank " + std::to_string(i + 1) + ": generator " +
                                             fixed(results[i].generator, 6) + " c"));
    std::string written;
    if (a.json) {
        nlohmann::ordered_json j;
        write_and_report(a, "rank2", scales, &j, written);
        j["space"] = "rank2";
        j["period_cents"] = period.cents();
        j["generators"] = a.generators;
        j["statistic"] = statistic_name(cost.statistic);
        j["results"] = nlohmann::ordered_json::array();
        for (std::size_t i = 0; i < results.size(); ++i) {
            nlohmann::ordered_json x{{"rank", i + 1}, {"generator_cents", results[i].generator}, {"cost", results[i].cost}};
            x["targets"] = nlohmann::ordered_json::array();
            for (const auto& e : results[i].errors)
                x["targets"].push_back({{"ratio", e.ratio.str()}, {"generators", e.steps}, {"periods", e.periods}, {"error_cents", e.error}});
            j["results"].push_back(x);
        }
        out << j.dump(2) << '\n';
    } else {
        write_and_report(a, "rank2", scales, nullptr, written);
        out << "rank-2 chains: " << a.generators << " generators up from the tonic, period " << period.str() << " ("
            << fixed(period.cents(), 3) << " c)\ncost: " << statistic_name(cost.statistic) << " of the errors of "
            << target_header(cost) << "\n\n";
        Table t;
        t.header = {"rank", "generator", "cost"};
        for (const auto& x : cost.targets) t.header.push_back(x.ratio.str());
        t.align.assign(t.header.size(), Table::Align::right);
        for (std::size_t i = 0; i < results.size(); ++i) {
            std::vector<std::string> row{std::to_string(i + 1), fixed(results[i].generator, 4), fixed(results[i].cost, 4)};
            for (const auto& e : results[i].errors)
                row.push_back(signed_fixed(e.error, 3) + " (" + std::to_string(e.steps) + "g" +
                              (e.periods >= 0 ? "+" : "") + std::to_string(e.periods) + "p)");
            t.add(row);
        }
        write_text(out, t);
        out << "\ncells: error in cents of the best approximation in the chain (generators g, periods p)\n";
    }
    out << written;
    std::cout << out.str();
}

void run_equal(const SearchArgs& a) {
    TargetCost cost = build_targets(a, {"3/2", "5/4", "6/5"});
    Pitch period = parse_period(a.period);
    auto results = search_equal(cost, period.cents(), a.max_steps, a.top);
    std::ostringstream out;
    std::vector<Scale> scales;
    for (std::size_t i = 0; i < results.size(); ++i)
        scales.push_back(equal_division(results[i].steps, period,
                                        "terzo search equal, rank " + std::to_string(i + 1) + ": " +
                                            std::to_string(results[i].steps) + " equal divisions of " + period.str()));
    std::string written;
    if (a.json) {
        nlohmann::ordered_json j;
        write_and_report(a, "equal", scales, &j, written);
        j["space"] = "equal";
        j["period_cents"] = period.cents();
        j["max_steps"] = a.max_steps;
        j["statistic"] = statistic_name(cost.statistic);
        j["results"] = nlohmann::ordered_json::array();
        for (std::size_t i = 0; i < results.size(); ++i) {
            nlohmann::ordered_json x{{"rank", i + 1}, {"steps", results[i].steps}, {"cost", results[i].cost}};
            x["targets"] = nlohmann::ordered_json::array();
            for (const auto& e : results[i].errors)
                x["targets"].push_back({{"ratio", e.ratio.str()}, {"step", e.steps}, {"error_cents", e.error}});
            j["results"].push_back(x);
        }
        out << j.dump(2) << '\n';
    } else {
        write_and_report(a, "equal", scales, nullptr, written);
        out << "equal divisions of " << period.str() << " into 1 to " << a.max_steps << " steps\ncost: "
            << statistic_name(cost.statistic) << " of the errors of " << target_header(cost) << "\n\n";
        Table t;
        t.header = {"rank", "steps", "step", "cost"};
        for (const auto& x : cost.targets) t.header.push_back(x.ratio.str());
        t.align.assign(t.header.size(), Table::Align::right);
        for (std::size_t i = 0; i < results.size(); ++i) {
            std::vector<std::string> row{std::to_string(i + 1), std::to_string(results[i].steps),
                                         fixed(period.cents() / results[i].steps, 3), fixed(results[i].cost, 4)};
            for (const auto& e : results[i].errors) row.push_back(signed_fixed(e.error, 3) + " (" + std::to_string(e.steps) + ")");
            t.add(row);
        }
        write_text(out, t);
        out << "\ncells: error in cents of the nearest step (its number)\n";
    }
    out << written;
    std::cout << out.str();
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
    cmd->add_option("--starts", a->starts, "continuous: exhaustive results to start the optimiser from (default 3)");
    cmd->add_option("--target", a->targets, "rank2/equal: target interval RATIO[=GENERATORS][*WEIGHT], e.g. 5/4=4 (defaults: 3/2 5/4 for rank2, 3/2 5/4 6/5 for equal)");
    cmd->add_option("--statistic", a->statistic, "rank2/equal: rms, mean or worst of the targets' errors (default rms)");
    cmd->add_option("--period", a->period, "rank2/equal: the period, a ratio or cents with a '.' (default 2/1)");
    cmd->add_option("--generators", a->generators, "rank2: generators in the chain (default 11, so 12 notes)");
    cmd->add_option("--max-steps", a->max_steps, "equal: largest number of steps (default 72)");
    cmd->add_option("--top", a->top, "results to show (default 10, at most 1000)");
    cmd->add_option("--threads", a->threads, "threads (default: one per core)");
    cmd->add_flag("--json", a->json, "print one JSON object (keys in docs/formats.md)");
    cmd->add_option("--write-scl", a->write_dir, "also write each result as a .scl file into this folder");
    cmd->add_flag("--force", a->force, "replace existing .scl files");
    cmd->add_flag("--quiet", a->quiet, "no progress on stderr");
    cmd->callback([a] {
        if (a->space == "circulating") run_circulating(*a, false);
        else if (a->space == "continuous") run_circulating(*a, true);
        else if (a->space == "rank2") run_rank2(*a);
        else if (a->space == "equal") run_equal(*a);
        else fail({"SPACE", 0, 0}, "unknown search space " + terzo::excerpt(a->space) + "; use circulating, continuous, rank2 or equal");
    });
}

} // namespace terzo::cli

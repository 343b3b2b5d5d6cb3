#include "core/report/search_report.hpp"

#include <cstdlib>
#include <sstream>

#include "core/error.hpp"
#include "core/format.hpp"
#include "core/tuning/scl.hpp"
#include "core/report/table.hpp"
#include "core/tuning/note_names.hpp"
#include "core/tuning/temperament.hpp"

namespace terzo {

namespace {

using OJson = nlohmann::ordered_json;

/// "1/4", and "0" or "-1" rather than "0/1".
std::string fraction_text(const Ratio& r) { return r.den() == 1 ? std::to_string(r.num()) : r.str(); }

std::string fifth_name(int i) {
    return pitch_class_name(7 * i % 12) + "-" + pitch_class_name(7 * (i + 1) % 12);
}

OJson parts_json(const CostBreakdown& b) {
    OJson j = OJson::array();
    for (const auto& p : b.parts) j.push_back({{"name", p.name}, {"value", p.value}, {"weight", p.weight}});
    return j;
}

OJson start_json(const std::vector<std::string>* scl_files) {
    OJson j;
    if (scl_files) j["scl_files"] = *scl_files;
    return j;
}

} // namespace

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

std::string target_header(const TargetCost& c) {
    std::string s;
    for (const auto& t : c.targets) {
        s += (s.empty() ? "" : ", ") + t.ratio.str();
        if (t.generators) s += " (" + std::to_string(*t.generators) + (std::abs(*t.generators) == 1 ? " generator)" : " generators)");
        if (t.weight != 1.0) s += " x" + fixed(t.weight, 2);
    }
    return s;
}

// ---- circulating and continuous ----------------------------------------------------------

bool CirculatingReport::cancelled() const { return exhaustive.cancelled || (continuous && continuous->cancelled); }

std::string circulating_text(const CirculatingReport& r) {
    const CirculatingSearch& ex = r.exhaustive;
    const bool continuous = r.continuous != nullptr;
    const Cost& cost = r.model.cost();
    std::string fr;
    for (const Ratio& f : r.space.fractions) fr += (fr.empty() ? "" : ", ") + fraction_text(f);
    std::ostringstream out;
    out << "circulating temperaments: the fifths C-G, G-D … F-C each narrowed by " << fr
        << " of the Pythagorean comma, together one comma\n"
        << describe_cost(cost) << ex.total << " distributions, ";
    if (ex.evaluated == ex.total) {
        out << "all evaluated\n";
    } else {
        out << ex.evaluated << " evaluated; the others ";
        if (ex.symmetry_rotations)
            out << (ex.symmetry_mirror ? "are rotations or mirror images" : "are rotations")
                << " of these (same cost)" << (r.space.prune ? ", or were cut off" : "");
        else
            out << "were cut off";
        if (r.space.prune) out << " when their first fifths already cost more than the results kept";
        if (ex.rejected > 0 || cost.constraints.no_wide_fifths || cost.constraints.max_fifth ||
            cost.constraints.max_major_third || cost.constraints.max_minor_third)
            out << ", or break a constraint";
        out << "\n";
    }
    if (r.cancelled()) out << "cancelled after " << ex.enumerated << " of " << ex.total << "; the best found so far:\n";
    out << "\n";
    Table t;
    t.header = {"rank", "cost"};
    std::vector<PartValue> parts;
    if (!continuous && !ex.results.empty()) parts = ex.results[0].breakdown.parts;
    if (continuous && !r.continuous->results.empty()) parts = r.continuous->results[0].breakdown.parts;
    for (const auto& p : parts) t.header.push_back(p.name);
    if (!continuous) t.header.push_back("copies");
    for (int i = 0; i < 12; ++i) t.header.push_back(fifth_name(i));
    if (continuous) t.header.push_back("start");
    t.align.assign(t.header.size(), Table::Align::right);
    if (!continuous) {
        for (std::size_t i = 0; i < ex.results.size(); ++i) {
            const auto& x = ex.results[i];
            std::vector<std::string> row{std::to_string(i + 1), fixed(x.cost, 4)};
            for (const auto& p : x.breakdown.parts) row.push_back(fixed(p.value, 4));
            row.push_back(std::to_string(x.copies));
            for (const Ratio& f : x.fractions) row.push_back(fraction_text(f));
            t.add(row);
        }
        write_text(out, t);
        out << "\ncells under the fifths: fraction of the Pythagorean comma by which that fifth is narrowed;\n"
               "copies: temperaments of the space this one stands for (itself started on other notes, or upside down)\n";
    } else {
        for (std::size_t i = 0; i < r.continuous->results.size(); ++i) {
            const auto& x = r.continuous->results[i];
            std::vector<std::string> row{std::to_string(i + 1), fixed(x.breakdown.total, 4) + (x.breakdown.feasible ? "" : "!")};
            for (const auto& p : x.breakdown.parts) row.push_back(fixed(p.value, 4));
            for (double n : x.narrowing) row.push_back(fixed(n, 3));
            row.push_back(fixed(x.start_cost, 4));
            t.add(row);
        }
        write_text(out, t);
        out << "\ncells under the fifths: cents by which that fifth is narrowed; start: cost of the exhaustive\n"
               "result the optimiser started from; ! marks a result that breaks a constraint\n";
    }
    return out.str();
}

OJson circulating_json(const CirculatingReport& r, const std::vector<std::string>* scl_files) {
    const CirculatingSearch& ex = r.exhaustive;
    const bool continuous = r.continuous != nullptr;
    OJson j = start_json(scl_files);
    j["space"] = continuous ? "continuous" : "circulating";
    j["fractions"] = OJson::array();
    for (const Ratio& f : r.space.fractions) j["fractions"].push_back(fraction_text(f));
    j["distributions"] = ex.total;
    j["enumerated"] = ex.enumerated;
    j["evaluated"] = ex.evaluated;
    j["symmetry"] = {{"rotations", ex.symmetry_rotations}, {"mirror", ex.symmetry_mirror}};
    j["cancelled"] = r.cancelled();
    j["results"] = OJson::array();
    if (!continuous) {
        for (std::size_t i = 0; i < ex.results.size(); ++i) {
            const auto& x = ex.results[i];
            OJson e;
            e["rank"] = i + 1;
            e["cost"] = x.cost;
            e["parts"] = parts_json(x.breakdown);
            e["copies"] = x.copies;
            e["fractions"] = OJson::array();
            for (const Ratio& f : x.fractions) e["fractions"].push_back(fraction_text(f));
            e["narrowing_cents"] = x.narrowing;
            e["positions_cents"] = positions_from_narrowings(x.narrowing);
            j["results"].push_back(e);
        }
    } else {
        for (std::size_t i = 0; i < r.continuous->results.size(); ++i) {
            const auto& x = r.continuous->results[i];
            OJson e;
            e["rank"] = i + 1;
            e["cost"] = x.breakdown.total;
            e["parts"] = parts_json(x.breakdown);
            e["feasible"] = x.breakdown.feasible;
            e["narrowing_cents"] = x.narrowing;
            e["positions_cents"] = positions_from_narrowings(x.narrowing);
            e["start_cost"] = x.start_cost;
            j["results"].push_back(e);
        }
    }
    return j;
}

std::vector<Scale> circulating_scales(const CirculatingReport& r) {
    std::vector<Scale> scales;
    if (!r.continuous)
        for (std::size_t i = 0; i < r.exhaustive.results.size(); ++i)
            scales.push_back(circulating_scale(r.exhaustive.results[i].fractions, "terzo search circulating, rank " + std::to_string(i + 1)));
    else
        for (std::size_t i = 0; i < r.continuous->results.size(); ++i)
            scales.push_back(narrowings_scale(r.continuous->results[i].narrowing, "terzo search continuous, rank " + std::to_string(i + 1)));
    return scales;
}

// ---- rank-2 chains -------------------------------------------------------------------------

std::string rank2_text(const Rank2Report& r) {
    std::ostringstream out;
    out << "rank-2 chains: " << r.generators << " generators up from the tonic, period " << r.period.str() << " ("
        << fixed(r.period.cents(), 3) << " c)\ncost: " << statistic_name(r.cost.statistic) << " of the errors of "
        << target_header(r.cost) << "\n\n";
    Table t;
    t.header = {"rank", "generator", "cost"};
    for (const auto& x : r.cost.targets) t.header.push_back(x.ratio.str());
    t.align.assign(t.header.size(), Table::Align::right);
    for (std::size_t i = 0; i < r.results.size(); ++i) {
        std::vector<std::string> row{std::to_string(i + 1), fixed(r.results[i].generator, 4), fixed(r.results[i].cost, 4)};
        for (const auto& e : r.results[i].errors)
            row.push_back(signed_fixed(e.error, 3) + " (" + std::to_string(e.steps) + "g" +
                          (e.periods >= 0 ? "+" : "") + std::to_string(e.periods) + "p)");
        t.add(row);
    }
    write_text(out, t);
    out << "\ncells: error in cents of the best approximation in the chain (generators g, periods p)\n";
    return out.str();
}

OJson rank2_json(const Rank2Report& r, const std::vector<std::string>* scl_files) {
    OJson j = start_json(scl_files);
    j["space"] = "rank2";
    j["period_cents"] = r.period.cents();
    j["generators"] = r.generators;
    j["statistic"] = statistic_name(r.cost.statistic);
    j["results"] = OJson::array();
    for (std::size_t i = 0; i < r.results.size(); ++i) {
        OJson x{{"rank", i + 1}, {"generator_cents", r.results[i].generator}, {"cost", r.results[i].cost}};
        x["targets"] = OJson::array();
        for (const auto& e : r.results[i].errors)
            x["targets"].push_back({{"ratio", e.ratio.str()}, {"generators", e.steps}, {"periods", e.periods}, {"error_cents", e.error}});
        j["results"].push_back(x);
    }
    return j;
}

std::vector<Scale> rank2_scales(const Rank2Report& r) {
    std::vector<Scale> scales;
    for (std::size_t i = 0; i < r.results.size(); ++i)
        scales.push_back(generator_chain(Pitch::from_cents(r.results[i].generator), r.generators, 0, r.period,
                                         "terzo search rank2, rank " + std::to_string(i + 1) + ": generator " +
                                             fixed(r.results[i].generator, 6) + " c"));
    return scales;
}

// ---- equal divisions -----------------------------------------------------------------------

std::string equal_text(const EqualReport& r) {
    std::ostringstream out;
    out << "equal divisions of " << r.period.str() << " into 1 to " << r.max_steps << " steps\ncost: "
        << statistic_name(r.cost.statistic) << " of the errors of " << target_header(r.cost) << "\n\n";
    Table t;
    t.header = {"rank", "steps", "step", "cost"};
    for (const auto& x : r.cost.targets) t.header.push_back(x.ratio.str());
    t.align.assign(t.header.size(), Table::Align::right);
    for (std::size_t i = 0; i < r.results.size(); ++i) {
        std::vector<std::string> row{std::to_string(i + 1), std::to_string(r.results[i].steps),
                                     fixed(r.period.cents() / r.results[i].steps, 3), fixed(r.results[i].cost, 4)};
        for (const auto& e : r.results[i].errors) row.push_back(signed_fixed(e.error, 3) + " (" + std::to_string(e.steps) + ")");
        t.add(row);
    }
    write_text(out, t);
    out << "\ncells: error in cents of the nearest step (its number)\n";
    return out.str();
}

OJson equal_json(const EqualReport& r, const std::vector<std::string>* scl_files) {
    OJson j = start_json(scl_files);
    j["space"] = "equal";
    j["period_cents"] = r.period.cents();
    j["max_steps"] = r.max_steps;
    j["statistic"] = statistic_name(r.cost.statistic);
    j["results"] = OJson::array();
    for (std::size_t i = 0; i < r.results.size(); ++i) {
        OJson x{{"rank", i + 1}, {"steps", r.results[i].steps}, {"cost", r.results[i].cost}};
        x["targets"] = OJson::array();
        for (const auto& e : r.results[i].errors)
            x["targets"].push_back({{"ratio", e.ratio.str()}, {"step", e.steps}, {"error_cents", e.error}});
        j["results"].push_back(x);
    }
    return j;
}

std::vector<Scale> equal_scales(const EqualReport& r) {
    for (std::size_t i = 0; i < r.results.size(); ++i)
        if (static_cast<std::size_t>(r.results[i].steps) > max_scale_size)
            fail({"--write-scl", 0, 0}, "result " + std::to_string(i + 1) + " has " + std::to_string(r.results[i].steps) +
                                            " steps, more than " + std::to_string(max_scale_size) +
                                            ", the largest scale terzo writes; give --max-steps " +
                                            std::to_string(max_scale_size) + " or leave out --write-scl (no file was written)");
    std::vector<Scale> scales;
    for (std::size_t i = 0; i < r.results.size(); ++i)
        scales.push_back(equal_division(r.results[i].steps, r.period,
                                        "terzo search equal, rank " + std::to_string(i + 1) + ": " +
                                            std::to_string(r.results[i].steps) + " equal divisions of " + r.period.str()));
    return scales;
}

std::vector<NamedText> search_scl_files(const std::string& stem, const std::vector<Scale>& scales,
                                        const std::vector<std::string>& comments) {
    std::vector<NamedText> files;
    for (std::size_t i = 0; i < scales.size(); ++i) {
        std::string n = std::to_string(i + 1);
        std::string name = stem + "-" + std::string(n.size() < 2 ? 2 - n.size() : 0, '0') + n + ".scl";
        std::vector<std::string> lines = comments;
        lines.push_back("Rank " + n + " of " + std::to_string(scales.size()) + ".");
        std::ostringstream out;
        write_scl(out, scales[i], name, lines);
        files.push_back({std::move(name), out.str()});
    }
    return files;
}

} // namespace terzo

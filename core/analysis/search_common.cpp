#include "core/analysis/search_detail.hpp"

#include <algorithm>
#include <cmath>

#include "core/format.hpp"

namespace terzo {

namespace detail {

void check_control(const SearchControl& control, std::size_t top) {
    if (control.threads < 1 || control.threads > max_search_threads)
        fail({"--threads", 0, 0}, "thread count " + std::to_string(control.threads) + " is outside 1..64");
    if (top < 1 || top > max_results)
        fail({"--top", 0, 0}, "result count " + std::to_string(top) + " is outside 1..1000");
}

double target_statistic(const TargetCost& cost, const std::vector<TargetError>& errors) {
    double total = 0, acc = 0;
    for (std::size_t i = 0; i < errors.size(); ++i) {
        double w = cost.targets[i].weight, e = errors[i].error;
        if (w <= 0) continue;
        total += w;
        if (cost.statistic == Statistic::mean) acc += w * std::fabs(e);
        else if (cost.statistic == Statistic::rms) acc += w * e * e;
        else acc = std::max(acc, std::fabs(e));
    }
    if (cost.statistic == Statistic::mean) return acc / total;
    if (cost.statistic == Statistic::rms) return std::sqrt(acc / total);
    return acc;
}


} // namespace detail

// ---- target intervals ------------------------------------------------------------------

TargetInterval parse_target(const std::string& text, const std::string& source) {
    TargetInterval t;
    std::string rest = text;
    std::size_t star = rest.find('*');
    if (star != std::string::npos) {
        std::string w = rest.substr(star + 1);
        char* end = nullptr;
        double v = std::strtod(w.c_str(), &end);
        if (w.empty() || *end != '\0' || !std::isfinite(v) || v < 0 || v > max_part_weight)
            fail({source, 1, static_cast<int>(star) + 2}, "expected a weight from 0 to 1000000 after '*', found " + terzo::excerpt(w));
        t.weight = v;
        rest = rest.substr(0, star);
    }
    std::size_t eq = rest.find('=');
    if (eq != std::string::npos) {
        std::string g = rest.substr(eq + 1);
        char* end = nullptr;
        long v = std::strtol(g.c_str(), &end, 10);
        if (g.empty() || *end != '\0' || v < -max_chain_generators || v > max_chain_generators)
            fail({source, 1, static_cast<int>(eq) + 2}, "expected a generator count from -200 to 200 after '=', found " + terzo::excerpt(g));
        t.generators = static_cast<int>(v);
        rest = rest.substr(0, eq);
    }
    t.ratio = parse_ratio(rest, {source, 1, 1});
    if (t.ratio <= Ratio(0)) fail({source, 1, 1}, "a target interval must be a positive ratio, found " + terzo::excerpt(rest));
    return t;
}

void check_target_cost(const TargetCost& cost) {
    if (cost.targets.empty()) fail({"--target", 0, 0}, "give at least one target interval");
    if (cost.targets.size() > max_targets)
        fail({"--target", 0, 0}, std::to_string(cost.targets.size()) + " targets given; at most 32 are allowed");
    bool positive = false;
    for (const auto& t : cost.targets) positive = positive || t.weight > 0;
    if (!positive) fail({"--target", 0, 0}, "no target has a positive weight");
}

} // namespace terzo

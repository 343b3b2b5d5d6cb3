// Search 4: every equal division of a period up to a limit, for target intervals (search.hpp).
#include "core/analysis/search.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "core/format.hpp"

#include "core/analysis/search_detail.hpp"

namespace terzo {

using namespace detail; // the shared constants and checks of search_detail.hpp

EqualResult evaluate_equal(const TargetCost& cost, double period, int steps) {
    EqualResult r;
    r.steps = steps;
    double step = period / steps;
    for (const auto& t : cost.targets) {
        double c = cents(t.ratio);
        double j = std::nearbyint(c / step);
        r.errors.push_back({t.ratio, static_cast<int>(j), 0, j * step - c});
    }
    r.cost = target_statistic(cost, r.errors);
    return r;
}

std::vector<EqualResult> search_equal(const TargetCost& cost, double period, int max_steps, std::size_t top) {
    check_target_cost(cost);
    if (!(period > 0) || period > 1e5) fail({"--period", 0, 0}, "the period must be above 1/1 and at most 100000 c");
    if (max_steps < 1 || max_steps > max_equal_steps)
        fail({"--max-steps", 0, 0}, "largest division " + std::to_string(max_steps) + " is outside 1..100000");
    if (top < 1 || top > max_results) fail({"--top", 0, 0}, "result count " + std::to_string(top) + " is outside 1..1000");
    std::vector<EqualResult> all;
    for (int n = 1; n <= max_steps; ++n) all.push_back(evaluate_equal(cost, period, n));
    std::stable_sort(all.begin(), all.end(), [](const EqualResult& a, const EqualResult& b) { return a.cost < b.cost; });
    if (all.size() > top) all.resize(top);
    return all;
}

} // namespace terzo

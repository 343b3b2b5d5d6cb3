// Search 3: the best generator of a rank-2 chain for target intervals (search.hpp).
#include "core/analysis/search.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <boost/math/tools/minima.hpp>

#include "core/format.hpp"

#include "core/analysis/search_detail.hpp"

namespace terzo {

using namespace detail; // the shared constants and checks of search_detail.hpp

namespace {

/// The best (generators, periods) for one target and generator size.
TargetError chain_error(const TargetInterval& t, double c, double period, int n, double g) {
    TargetError best;
    best.ratio = t.ratio;
    double best_abs = kInf;
    int lo = t.generators ? *t.generators : -n, hi = t.generators ? *t.generators : n;
    for (int k = lo; k <= hi; ++k) {
        double m = std::nearbyint((c - k * g) / period);
        double e = k * g + m * period - c;
        double a = std::fabs(e);
        // ties: fewer generators, then upward
        if (a < best_abs - 1e-12 || (std::fabs(a - best_abs) <= 1e-12 && std::abs(k) < std::abs(best.steps))) {
            best_abs = a;
            best.steps = k;
            best.periods = static_cast<int>(m);
            best.error = e;
        }
    }
    return best;
}

} // namespace

Rank2Result evaluate_rank2(const TargetCost& cost, double period, int n, double g) {
    Rank2Result r;
    r.generator = g;
    for (const auto& t : cost.targets) r.errors.push_back(chain_error(t, cents(t.ratio), period, n, g));
    r.cost = target_statistic(cost, r.errors);
    return r;
}

std::vector<Rank2Result> search_rank2(const TargetCost& cost, double period, int n, std::size_t top) {
    check_target_cost(cost);
    if (!(period > 0) || period > 1e5) fail({"--period", 0, 0}, "the period must be above 1/1 and at most 100000 c");
    if (n < 1 || n > max_chain_generators)
        fail({"--generators", 0, 0}, "chain length " + std::to_string(n) + " is outside 1..200");
    if (top < 1 || top > max_results) fail({"--top", 0, 0}, "result count " + std::to_string(top) + " is outside 1..1000");
    for (const auto& t : cost.targets)
        if (t.generators && std::abs(*t.generators) > n)
            fail({"--target", 0, 0}, t.ratio.str() + "=" + std::to_string(*t.generators) +
                                         " needs more generators than the chain has (" + std::to_string(n) + ")");
    // Scan the generator over (0, period) on a grid; where every target keeps its (generators,
    // periods) the errors are affine in g, so the cost (a mean, rms or maximum of their sizes)
    // is convex there and its minimum over the run, widened by one grid step each way, is
    // found by Brent's method (in closed form for rms). Runs narrower than one grid
    // step (period/20000) can be missed.
    const int grid = 20000;
    const double h = period / grid;
    std::vector<double> c;
    for (const auto& t : cost.targets) c.push_back(cents(t.ratio));
    auto assignment = [&](double g) {
        std::vector<std::pair<int, int>> a;
        for (std::size_t i = 0; i < cost.targets.size(); ++i) {
            TargetError e = chain_error(cost.targets[i], c[i], period, n, g);
            a.push_back({e.steps, e.periods});
        }
        return a;
    };
    auto fixed_cost = [&](const std::vector<std::pair<int, int>>& a, double g) {
        std::vector<TargetError> errs;
        for (std::size_t i = 0; i < a.size(); ++i)
            errs.push_back({cost.targets[i].ratio, a[i].first, a[i].second, a[i].first * g + a[i].second * period - c[i]});
        return target_statistic(cost, errs);
    };
    std::vector<Rank2Result> found;
    auto minimise = [&](const std::vector<std::pair<int, int>>& a, double lo, double hi) {
        lo = std::max(lo, h * 1e-6);
        hi = std::min(hi, period - h * 1e-6);
        double g = 0.5 * (lo + hi);
        if (cost.statistic == Statistic::rms) {
            // d/dg sum w (k g + m P - c)^2 = 0  =>  g = sum w k (c - m P) / sum w k^2
            double num = 0, den = 0;
            for (std::size_t i = 0; i < a.size(); ++i) {
                double w = cost.targets[i].weight;
                num += w * a[i].first * (c[i] - a[i].second * period);
                den += w * a[i].first * a[i].first;
            }
            if (den > 0) g = std::clamp(num / den, lo, hi);
        } else {
            // Boost.Math's Brent minimiser (golden section with parabolic steps), to the
            // precision it allows for a double: about 3e-8 of the generator's size.
            g = boost::math::tools::brent_find_minima([&](double x) { return fixed_cost(a, x); },
                                                      lo, hi, std::numeric_limits<double>::digits / 2)
                    .first;
        }
        found.push_back(evaluate_rank2(cost, period, n, g));
    };
    std::vector<std::pair<int, int>> run = assignment(h * 0.5);
    double run_start = h * 0.5;
    for (int i = 1; i <= grid; ++i) {
        double g = (i + 0.5) * h;
        auto a = i < grid ? assignment(g) : std::vector<std::pair<int, int>>{};
        if (a != run) {
            minimise(run, run_start - h, g);
            run = a;
            run_start = g;
        }
    }
    std::sort(found.begin(), found.end(), [](const Rank2Result& a, const Rank2Result& b) {
        if (a.cost != b.cost) return a.cost < b.cost;
        return a.generator < b.generator;
    });
    std::vector<Rank2Result> out;
    for (auto& r : found) {
        bool dup = false;
        // Brent stops within about 3e-8 of g, so one minimum found from two neighbouring runs
        // can differ by 1e-5 c; generators closer than 1e-3 c count as one.
        for (const auto& q : out) dup = dup || std::fabs(q.generator - r.generator) < 1e-3;
        if (!dup) out.push_back(std::move(r));
        if (out.size() == top) break;
    }
    return out;
}

} // namespace terzo

// Search 2: circulating temperaments with continuous fifth sizes (search.hpp).
#include "core/analysis/search.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <condition_variable>
#include <limits>
#include <mutex>
#include <numeric>
#include <queue>
#include <thread>

#include "core/analysis/parallel.hpp"
#include "core/format.hpp"
#include "core/tuning/temperament.hpp"

#include "core/analysis/search_detail.hpp"

namespace terzo {

using namespace detail; // the shared constants and checks of search_detail.hpp

// ---- continuous ----------------------------------------------------------------------

namespace {

/// Smoothed |d| and its derivative.
struct Smooth {
    double v, dv;
};
Smooth smooth_abs(double d, double tau) {
    double a = std::sqrt(d * d + tau * tau);
    return {a, d / a};
}

/// Value and derivatives by instance of one statistic over twelve deviations.
double smooth_statistic(Statistic s, const std::array<double, 12>& d, const std::array<double, 12>& w,
                        double total, double tau, std::array<double, 12>& g) {
    g.fill(0);
    if (total <= 0) return 0;
    if (s == Statistic::mean) {
        double v = 0;
        for (std::size_t i = 0; i < 12; ++i) {
            if (w[i] <= 0) continue;
            Smooth a = smooth_abs(d[i], tau);
            v += w[i] * a.v / total;
            g[i] = w[i] * a.dv / total;
        }
        return v;
    }
    if (s == Statistic::rms) {
        double q = tau * tau;
        for (std::size_t i = 0; i < 12; ++i) q += w[i] > 0 ? w[i] * d[i] * d[i] / total : 0;
        double v = std::sqrt(q);
        for (std::size_t i = 0; i < 12; ++i) g[i] = w[i] > 0 ? w[i] * d[i] / total / v : 0;
        return v;
    }
    // worst: tau * log(sum exp(|d_i| / tau)), computed around the largest term.
    std::array<Smooth, 12> a{};
    double top = -kInf;
    for (std::size_t i = 0; i < 12; ++i) {
        if (w[i] <= 0) continue;
        a[i] = smooth_abs(d[i], tau);
        top = std::max(top, a[i].v);
    }
    double z = 0;
    std::array<double, 12> e{};
    for (std::size_t i = 0; i < 12; ++i) {
        if (w[i] <= 0) continue;
        e[i] = std::exp((a[i].v - top) / tau);
        z += e[i];
    }
    for (std::size_t i = 0; i < 12; ++i)
        if (w[i] > 0) g[i] = e[i] / z * a[i].dv;
    return top + tau * std::log(z);
}

/// For the deviations by circle index of each class: which narrowings each one sums, with
/// the sign. Fifth i: -t_i; major third i: -(t_i..t_{i+3}); minor third c: +(t_{c-3}..t_{c-1}).
template <class Fn>
void for_each_term(int k, int i, Fn fn) {
    if (k == 0) fn(i, -1.0);
    else if (k == 1)
        for (int j = 0; j < 4; ++j) fn((i + j) % 12, -1.0);
    else
        for (int j = 1; j <= 3; ++j) fn((i - j + 12) % 12, 1.0);
}

std::array<std::array<double, 12>, 3> circle_deviations(const std::array<double, 12>& t) {
    std::array<std::array<double, 12>, 3> d{};
    const double base[3] = {0.0, S, -S};
    for (int k = 0; k < 3; ++k)
        for (int i = 0; i < 12; ++i) {
            double v = base[k];
            for_each_term(k, i, [&](int j, double sign) { v += sign * t[static_cast<std::size_t>(j)]; });
            d[static_cast<std::size_t>(k)][static_cast<std::size_t>(i)] = v;
        }
    return d;
}

struct Bounds {
    double lo = -kInf, hi = kInf;
};
Bounds fifth_bounds(const CostModel& cost) {
    const Constraints& c = cost.cost().constraints;
    Bounds b;
    if (c.no_wide_fifths) b.lo = 0;
    if (c.max_fifth) {
        b.lo = std::max(b.lo, -*c.max_fifth);
        b.hi = *c.max_fifth;
    }
    return b;
}

/// The nearest point to y (Euclidean) with lo <= t_i <= hi and sum t_i = P: t_i = clamp(y_i -
/// lambda), with lambda found by bisection (the sum falls as lambda grows).
std::array<double, 12> project(const std::array<double, 12>& y, const Bounds& b) {
    std::array<double, 12> t{};
    if (!std::isfinite(b.lo) && !std::isfinite(b.hi)) {
        double shift = (std::accumulate(y.begin(), y.end(), 0.0) - P) / 12.0;
        for (std::size_t i = 0; i < 12; ++i) t[i] = y[i] - shift;
        return t;
    }
    auto sum_at = [&](double lambda) {
        double s = 0;
        for (std::size_t i = 0; i < 12; ++i) s += std::clamp(y[i] - lambda, b.lo, b.hi);
        return s;
    };
    double lo = *std::min_element(y.begin(), y.end()) - (std::isfinite(b.hi) ? b.hi : 0) - P - 1;
    double hi = *std::max_element(y.begin(), y.end()) - (std::isfinite(b.lo) ? b.lo : 0) + P + 1;
    for (int it = 0; it < 200 && hi - lo > 1e-15 * std::max(1.0, std::fabs(hi)); ++it) {
        double mid = 0.5 * (lo + hi);
        if (sum_at(mid) > P) lo = mid;
        else hi = mid;
    }
    double lambda = 0.5 * (lo + hi);
    for (std::size_t i = 0; i < 12; ++i) t[i] = std::clamp(y[i] - lambda, b.lo, b.hi);
    return t;
}

} // namespace

double smoothed_cost(const CostModel& cost, const std::array<double, 12>& t, double tau,
                     std::array<double, 12>* gradient) {
    std::array<double, 12> grad{};
    auto d = circle_deviations(t);
    std::array<std::array<double, 12>, 3> w{};
    for (int k = 0; k < 3; ++k)
        for (int i = 0; i < 12; ++i)
            w[static_cast<std::size_t>(k)][static_cast<std::size_t>(i)] = cost.interval_weight(static_cast<KeyInterval>(k), pc_of(i));
    double total = 0;
    std::array<double, 12> g{};
    auto spread = [&](int k, const std::array<double, 12>& gi, double scale) {
        for (int i = 0; i < 12; ++i) {
            double gv = gi[static_cast<std::size_t>(i)] * scale;
            if (gv == 0) continue;
            for_each_term(k, i, [&](int j, double sign) { grad[static_cast<std::size_t>(j)] += sign * gv; });
        }
    };
    for (const auto& p : cost.cost().deviations) {
        int k = static_cast<int>(p.interval);
        total += p.weight * smooth_statistic(p.statistic, d[static_cast<std::size_t>(k)], w[static_cast<std::size_t>(k)],
                                             cost.total_weight(p.interval), tau, g);
        spread(k, g, p.weight);
    }
    if (!cost.cost().beats.empty()) {
        // Beat of the interval of class k from pc(i): p * f_i * |expm1(c d)|, c = ln 2 / 1200,
        // f_i the frequency of pc(i) in octave 4. f_i = ref * 2^((u_i - u_ref)/1200) up to
        // whole octaves, u_i = i*F - (t_0 + … + t_{i-1}), so d ln f_i / d t_j = c*([j < r] - [j < i])
        // with r the circle index of the reference's pitch class.
        const double c = std::log(2.0) / 1200.0;
        static constexpr int partial[3] = {3, 5, 6};
        Positions pos = positions_from_narrowings(t);
        int r = pc_of(cost.cost().reference.note.pitch_class); // 7 is its own inverse mod 12
        for (const auto& part : cost.cost().beats) {
            int k = static_cast<int>(part.interval);
            for (int i = 0; i < 12; ++i) {
                if (w[static_cast<std::size_t>(k)][static_cast<std::size_t>(i)] <= 0) continue;
                double f = cost.hz(pos, pc_of(i));
                double dv = d[static_cast<std::size_t>(k)][static_cast<std::size_t>(i)];
                double e = std::expm1(c * dv);
                Smooth s = smooth_abs(e, c * tau);
                double b = partial[k] * f * s.v;
                double x = (b - part.limit_hz) / tau;
                double soft = x > 30 ? x * tau : tau * std::log1p(std::exp(x));
                double sig = x > 30 ? 1.0 : 1.0 / (1.0 + std::exp(-x));
                total += part.weight * soft;
                double scale = part.weight * sig;
                // through the deviation
                double db_dd = partial[k] * f * s.dv * c * (1.0 + e);
                for_each_term(k, i, [&](int j, double sign) { grad[static_cast<std::size_t>(j)] += scale * db_dd * sign; });
                // through the frequency
                for (int j = 0; j < 12; ++j) {
                    double dl = c * ((j < r ? 1.0 : 0.0) - (j < i ? 1.0 : 0.0));
                    grad[static_cast<std::size_t>(j)] += scale * b * dl;
                }
            }
        }
    }
    // Constraints on thirds: 1e4 * sum of squared excess (smoothed) beyond the limit.
    const Constraints& con = cost.cost().constraints;
    const std::optional<double> limits[3] = {std::nullopt, con.max_major_third, con.max_minor_third};
    for (int k = 1; k < 3; ++k) {
        if (!limits[k]) continue;
        for (int i = 0; i < 12; ++i) {
            Smooth a = smooth_abs(d[static_cast<std::size_t>(k)][static_cast<std::size_t>(i)], tau);
            double ex = a.v - *limits[k];
            if (ex <= 0) continue;
            total += 1e4 * ex * ex;
            double gv = 2e4 * ex * a.dv;
            for_each_term(k, i, [&](int j, double sign) { grad[static_cast<std::size_t>(j)] += sign * gv; });
        }
    }
    if (gradient) *gradient = grad;
    return total;
}

ContinuousResult optimise_circulating(const CostModel& cost, const std::array<double, 12>& start) {
    if (!cost.cost().fits.empty())
        fail({"--fit", 0, 0}, "the continuous search needs analytic gradients, which the resultant fit does not "
                              "have; use the circulating search for fits");
    Bounds bounds = fifth_bounds(cost);
    if (12 * bounds.lo > P + 1e-12 || 12 * bounds.hi < P - 1e-12)
        fail({"--max-fifth", 0, 0}, "no circle closes with every fifth within " + fixed(bounds.hi, 3) +
                                        " c of pure: it needs at least P/12 = 1.955 c");
    ContinuousResult result;
    std::array<double, 12> x = project(start, bounds);
    int iterations = 0;
    for (double tau : {1.0, 0.1, 0.01, 1e-3, 1e-4}) {
        std::array<double, 12> g{};
        double f = smoothed_cost(cost, x, tau, &g);
        double step = 1.0;
        for (int it = 0; it < 3000; ++it) {
            bool accepted = false;
            std::array<double, 12> y{}, gy{};
            double fy = 0, moved = 0;
            while (step > 1e-16) {
                std::array<double, 12> trial{};
                for (std::size_t i = 0; i < 12; ++i) trial[i] = x[i] - step * g[i];
                y = project(trial, bounds);
                double decrease = 0;
                moved = 0;
                for (std::size_t i = 0; i < 12; ++i) {
                    decrease += g[i] * (x[i] - y[i]);
                    moved += (x[i] - y[i]) * (x[i] - y[i]);
                }
                fy = smoothed_cost(cost, y, tau, &gy);
                if (fy <= f - 1e-4 * decrease) {
                    accepted = true;
                    break;
                }
                step *= 0.5;
            }
            ++iterations;
            if (!accepted) break;
            x = y;
            f = fy;
            g = gy;
            step *= 2;
            if (moved < 1e-24) break;
        }
    }
    result.narrowing = x;
    result.breakdown = evaluate_narrowings(cost, x);
    result.iterations = iterations;
    return result;
}

Scale narrowings_scale(const std::array<double, 12>& narrowing, const std::string& description) {
    Positions pos = positions_from_narrowings(narrowing);
    std::vector<Pitch> degrees;
    for (std::size_t i = 1; i < 12; ++i) degrees.push_back(Pitch::from_cents(pos[i]));
    return Scale(description, degrees, Pitch::from_ratio(Ratio(2)));
}

ContinuousSearch search_continuous(const CirculatingSpace& space, const CostModel& cost, std::size_t top,
                                   std::size_t starts, const SearchControl& control) {
    check_control(control, top);
    if (starts < 1 || starts > 100)
        fail({"--starts", 0, 0}, "start count " + std::to_string(starts) + " is outside 1..100");
    if (!cost.cost().fits.empty())
        fail({"--fit", 0, 0}, "the continuous search needs analytic gradients, which the resultant fit does not "
                              "have; use the circulating search for fits");
    ContinuousSearch out;
    out.exhaustive = search_circulating(space, cost, starts, control);
    out.cancelled = out.exhaustive.cancelled;
    const auto& ex = out.exhaustive.results;
    std::vector<ContinuousResult> results(ex.size());
    std::atomic<std::uint64_t> done{0};
    SearchControl quiet = control;
    quiet.progress = nullptr;
    detail::run_parallel(std::min<int>(control.threads, static_cast<int>(std::max<std::size_t>(1, ex.size()))), ex.size(),
                 quiet, done, ex.size(), [&](int, std::size_t i) {
                     ContinuousResult r = optimise_circulating(cost, ex[i].narrowing);
                     // Keep the start when the optimiser could not beat it (e.g. it left the
                     // constraints to lower the smoothed cost).
                     bool worse = (!r.breakdown.feasible && ex[i].breakdown.feasible) ||
                                  (r.breakdown.feasible == ex[i].breakdown.feasible &&
                                   r.breakdown.total > ex[i].breakdown.total);
                     if (worse) {
                         r.narrowing = ex[i].narrowing;
                         r.breakdown = ex[i].breakdown;
                     }
                     r.start = ex[i].fractions;
                     r.start_cost = ex[i].breakdown.total;
                     results[i] = std::move(r);
                 });
    if (control.cancel && control.cancel->load()) out.cancelled = true;
    std::stable_sort(results.begin(), results.end(), [](const ContinuousResult& a, const ContinuousResult& b) {
        if (a.breakdown.feasible != b.breakdown.feasible) return a.breakdown.feasible;
        if (a.breakdown.total != b.breakdown.total) return a.breakdown.total < b.breakdown.total;
        return a.narrowing > b.narrowing;
    });
    // Starts that converge to the same temperament (within 0.001 c, in any rotation when the
    // cost allows) are reported once.
    bool rot = cost.transposition_invariant();
    for (auto& r : results) {
        bool seen = false;
        for (const auto& q : out.results) {
            for (int s = 0; s < (rot ? 12 : 1) && !seen; ++s) {
                bool same = true;
                for (std::size_t i = 0; i < 12 && same; ++i)
                    same = std::fabs(r.narrowing[i] - q.narrowing[(i + static_cast<std::size_t>(s)) % 12]) < 1e-3;
                seen = same;
            }
        }
        if (!seen && out.results.size() < top) out.results.push_back(std::move(r));
    }
    return out;
}

} // namespace terzo

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

#include <boost/math/tools/minima.hpp>

#include "core/analysis/parallel.hpp"
#include "core/format.hpp"
#include "core/tuning/temperament.hpp"

namespace terzo {

namespace {

constexpr double S = syntonic_comma_cents;
constexpr double P = pythagorean_comma_cents;
constexpr double F = pure_fifth_cents;
constexpr double kInf = std::numeric_limits<double>::infinity();

/// Pitch class reached after i fifths from C: fifth i of the circle starts there.
constexpr int pc_of(int i) { return 7 * i % 12; }

void check_control(const SearchControl& control, std::size_t top) {
    if (control.threads < 1 || control.threads > max_search_threads)
        fail({"--threads", 0, 0}, "thread count " + std::to_string(control.threads) + " is outside 1..64");
    if (top < 1 || top > max_results)
        fail({"--top", 0, 0}, "result count " + std::to_string(top) + " is outside 1..1000");
}

// ---- the space ----------------------------------------------------------------------

/// The fractions as whole numbers of 1/whole of a comma, and counts of the completions.
struct Units {
    std::vector<long long> u;   // fraction * whole, ascending
    std::vector<double> cents;  // fraction * P
    long long whole = 1;
    long long umin = 0, umax = 0;
    // ways[left][rem - left*umin]: ways to choose `left` fractions adding up to rem units.
    std::vector<std::vector<std::uint64_t>> ways;

    std::uint64_t completions(int left, long long rem) const {
        if (rem < left * umin || rem > left * umax) return 0;
        return ways[static_cast<std::size_t>(left)][static_cast<std::size_t>(rem - left * umin)];
    }
};

Units make_units(const CirculatingSpace& space) {
    const std::string src = "--fractions";
    if (space.fractions.empty()) fail({src, 0, 0}, "give at least one fraction");
    if (space.fractions.size() > max_fractions)
        fail({src, 0, 0}, std::to_string(space.fractions.size()) + " fractions given; at most 12 are allowed");
    long long whole = 1;
    for (const Ratio& f : space.fractions) {
        if (f < Ratio(-1) || f > Ratio(1))
            fail({src, 0, 0}, "fraction " + f.str() + " is outside -1..1 (of a Pythagorean comma)");
        if (f.den() > max_fraction_denominator)
            fail({src, 0, 0}, "fraction " + f.str() + " has a denominator above 1000");
        whole = std::lcm(whole, f.den());
        if (whole > 5040) fail({src, 0, 0}, "the fractions' common denominator exceeds 5040");
    }
    Units u;
    u.whole = whole;
    for (const Ratio& f : space.fractions) {
        u.u.push_back(f.num() * (whole / f.den()));
        u.cents.push_back(static_cast<double>(f.num()) / static_cast<double>(f.den()) * P);
    }
    for (std::size_t i = 1; i < u.u.size(); ++i)
        TERZO_ASSERT(u.u[i] > u.u[i - 1]); // parse_fractions sorts and removes repeats
    u.umin = u.u.front();
    u.umax = u.u.back();
    u.ways.resize(13);
    u.ways[0] = {1};
    for (int left = 1; left <= 12; ++left) {
        auto& row = u.ways[static_cast<std::size_t>(left)];
        row.assign(static_cast<std::size_t>(left * (u.umax - u.umin) + 1), 0);
        for (std::size_t r = 0; r < row.size(); ++r) {
            long long rem = static_cast<long long>(r) + left * u.umin;
            std::uint64_t sum = 0;
            for (long long x : u.u) sum += u.completions(left - 1, rem - x);
            row[r] = sum;
        }
    }
    return u;
}

// ---- exhaustive enumeration ------------------------------------------------------------

struct Entry {
    double cost;
    std::array<std::uint8_t, 12> choice;
    int copies;
};
/// The canonical order of results: lower cost first, then larger fractions first (compared
/// fifth by fifth from C-G), which makes the kept set independent of the thread count.
bool better(const Entry& a, const Entry& b) {
    if (a.cost != b.cost) return a.cost < b.cost;
    return a.choice > b.choice;
}
struct WorseOnTop {
    bool operator()(const Entry& a, const Entry& b) const { return better(a, b); }
};

/// Index tables of the circle's symmetries: rotation r reads fifth (i + r) mod 12 at i;
/// mirror r reads the circle backwards, fifth (11 - i - r) mod 12.
struct SymmetryTables {
    std::array<std::array<std::uint8_t, 12>, 12> rotation{}, mirror{};
    SymmetryTables() {
        for (int r = 0; r < 12; ++r)
            for (int i = 0; i < 12; ++i) {
                rotation[static_cast<std::size_t>(r)][static_cast<std::size_t>(i)] = static_cast<std::uint8_t>((i + r) % 12);
                mirror[static_cast<std::size_t>(r)][static_cast<std::size_t>(i)] = static_cast<std::uint8_t>((23 - i - r) % 12);
            }
    }
};
const SymmetryTables kTables;

/// Per class and circle index: sum of w*|d|, of w*d^2, and the largest |d| (weight > 0).
struct Sums {
    std::array<double, 3> s1{}, s2{}, mx{};
};

// Aligned so that two threads' enumerators never share a cache line.
class alignas(64) Enumerator {
public:
    Enumerator(const CostModel& model, const Units& units, std::size_t top, bool rotations, bool mirror, bool prune,
               const std::atomic<bool>* cancel, std::atomic<std::uint64_t>* shared_done)
        : model_(model), units_(units), top_(top), rotations_(rotations), mirror_(mirror), prune_(prune), cancel_(cancel),
          shared_done_(shared_done) {
        const Constraints& c = model.cost().constraints;
        limit_[0] = c.max_fifth.value_or(kInf);
        limit_[1] = c.max_major_third.value_or(kInf);
        limit_[2] = c.max_minor_third.value_or(kInf);
        no_wide_ = c.no_wide_fifths;
        for (int k = 0; k < 3; ++k)
            for (int i = 0; i < 12; ++i)
                w_[static_cast<std::size_t>(k)][static_cast<std::size_t>(i)] = model.interval_weight(static_cast<KeyInterval>(k), pc_of(i));
        leaf_parts_ = !model.cost().beats.empty() || !model.cost().fits.empty();
        // Only the classes a part or a constraint looks at are summed.
        for (const auto& p : model.cost().deviations) needed_[static_cast<std::size_t>(p.interval)] = true;
        for (int k = 0; k < 3; ++k) needed_[static_cast<std::size_t>(k)] = needed_[static_cast<std::size_t>(k)] || std::isfinite(limit_[static_cast<std::size_t>(k)]);
        needed_[0] = needed_[0] || no_wide_;
        last_.assign(static_cast<std::size_t>(units.umax - units.umin + 1), -1);
        for (std::size_t j = 0; j < units.u.size(); ++j) last_[static_cast<std::size_t>(units.u[j] - units.umin)] = static_cast<int>(j);
    }

    /// Runs the subtree under a prefix of `length` choices.
    void run(const std::vector<std::uint8_t>& prefix) {
        long long rem = units_.whole;
        for (std::uint8_t j : prefix) rem -= units_.u[j];
        sums_[0] = Sums{};
        int length = static_cast<int>(prefix.size());
        for (std::uint8_t j : prefix)
            if (rotations_ && j > prefix[0]) { // see descend
                skip(units_.completions(12 - length, rem));
                return;
            }
        for (int i = 0; i < length; ++i) {
            choice_[static_cast<std::size_t>(i)] = prefix[static_cast<std::size_t>(i)];
            t_[static_cast<std::size_t>(i)] = units_.cents[prefix[static_cast<std::size_t>(i)]];
            sums_[static_cast<std::size_t>(i + 1)] = sums_[static_cast<std::size_t>(i)];
            if (!step(i, sums_[static_cast<std::size_t>(i + 1)])) {
                // this job owns only the leaves under its whole prefix
                skip(units_.completions(12 - length, rem));
                return;
            }
        }
        if (length == 12) leaf(sums_[12]);
        else descend(length, rem);
    }

    void flush() {
        shared_done_->fetch_add(pending_, std::memory_order_relaxed);
        pending_ = 0;
    }
    bool stopped() const { return stopped_; }

    std::uint64_t enumerated = 0, evaluated = 0, rejected = 0;
    std::priority_queue<Entry, std::vector<Entry>, WorseOnTop> best;

private:
    void skip(std::uint64_t leaves) {
        enumerated += leaves;
        pending_ += leaves;
        if (pending_ >= 8192) flush();
    }

    bool add(Sums& s, int k, int i, double d) {
        auto kk = static_cast<std::size_t>(k);
        if (!needed_[kk]) return true;
        double ad = std::fabs(d);
        if (ad > limit_[kk] + 1e-9) return false;
        if (k == 0 && no_wide_ && d > 1e-9) return false;
        double w = w_[kk][static_cast<std::size_t>(i)];
        if (w > 0) {
            s.s1[kk] += w * ad;
            s.s2[kk] += w * d * d;
            if (ad > s.mx[kk]) s.mx[kk] = ad;
        }
        return true;
    }

    // Fifth i narrowed by t_i deviates by -t_i. The major third from pc(i) spans fifths
    // i..i+3 and is a syntonic comma wide when they are pure, so it deviates by
    // S - (t_i + … + t_{i+3}); the minor third from pc(c) lies three fifths below, spans
    // fifths c-3..c-1 and deviates by -S + (t_{c-3} + t_{c-2} + t_{c-1}). When fifth i is
    // chosen, the windows that end on it are complete; the ones that wrap past F-C are
    // completed at the last fifth.
    bool step(int i, Sums& s) {
        const auto& t = t_;
        auto at = [&](int j) { return t[static_cast<std::size_t>((j + 12) % 12)]; };
        const double* p = t.data() + i;
        if (!add(s, 0, i, -p[0])) return false;
        if (i >= 3 && !add(s, 1, i - 3, S - (p[-3] + p[-2] + p[-1] + p[0]))) return false;
        if (i >= 2 && !add(s, 2, (i + 1) % 12, -S + (p[-2] + p[-1] + p[0]))) return false;
        if (i == 11) {
            for (int j = 9; j < 12; ++j)
                if (!add(s, 1, j, S - (at(j) + at(j + 1) + at(j + 2) + at(j + 3)))) return false;
            for (int c = 1; c <= 2; ++c)
                if (!add(s, 2, c, -S + (at(c - 3) + at(c - 2) + at(c - 1)))) return false;
        }
        return true;
    }

    void descend(int i, long long remaining) {
        if (i <= 9 && cancel_ && cancel_->load(std::memory_order_relaxed)) {
            stopped_ = true;
            return;
        }
        int left = 11 - i;
        std::size_t m = units_.u.size();
        if (i == 11) {
            // The last fraction is whatever the comma still needs, if the set has it.
            long long need = remaining - units_.umin;
            if (need < 0 || need >= static_cast<long long>(last_.size()) || last_[static_cast<std::size_t>(need)] < 0) return;
            std::size_t j = static_cast<std::size_t>(last_[static_cast<std::size_t>(need)]);
            if (rotations_ && j > choice_[0]) { // a rotation starting here would be larger
                skip(1);
                return;
            }
            visit(i, j, 0, 0);
            return;
        }
        for (std::size_t j = 0; j < m && !stopped_; ++j) {
            long long rem = remaining - units_.u[j];
            if (rem < left * units_.umin || rem > left * units_.umax) continue;
            // With rotations removed only choices led by their largest fraction can be
            // canonical: a later, larger fraction starts a larger rotation.
            if (rotations_ && i > 0 && j > choice_[0]) {
                skip(units_.completions(left, rem));
                continue;
            }
            visit(i, j, left, rem);
        }
    }

    void visit(int i, std::size_t j, int left, long long rem) {
        choice_[static_cast<std::size_t>(i)] = static_cast<std::uint8_t>(j);
        t_[static_cast<std::size_t>(i)] = units_.cents[j];
        Sums& s = sums_[static_cast<std::size_t>(i + 1)];
        s = sums_[static_cast<std::size_t>(i)];
        if (!step(i, s)) {
            if (i == 11) ++rejected;
            skip(units_.completions(left, rem));
            return;
        }
        if (i == 11) {
            leaf(s);
            return;
        }
        if (prune_ && best.size() == top_ && bound(s) > best.top().cost) {
            skip(units_.completions(left, rem));
            return;
        }
        descend(i + 1, rem);
    }

    /// The deviation parts over the intervals completed so far: a lower bound of the cost of
    /// every completion, also in floating point (adding non-negative terms never lowers a
    /// rounded sum, and sqrt and the weighting are monotone), so pruning above the worst kept
    /// result never drops one that would have been kept.
    double bound(const Sums& s) const {
        double total = 0;
        for (const auto& p : model_.cost().deviations) total += p.weight * value(s, p);
        return total;
    }

    double value(const Sums& s, const DeviationPart& p) const {
        auto k = static_cast<std::size_t>(p.interval);
        double tw = model_.total_weight(p.interval);
        if (tw <= 0) return 0;
        if (p.statistic == Statistic::mean) return s.s1[k] / tw;
        if (p.statistic == Statistic::rms) return std::sqrt(s.s2[k] / tw);
        return s.mx[k];
    }

    /// True when the choice is the canonical copy (the largest in fifth-by-fifth order among
    /// its rotations, and mirror images when allowed); sets the number of distinct copies.
    /// Most choices lose to a rotation within a comparison or two, so the copies are only
    /// built for the canonical ones.
    bool canonical(int& copies) const {
        const auto& a = choice_;
        auto loses_to = [&](const std::array<std::uint8_t, 12>& index) {
            for (std::size_t i = 0; i < 12; ++i) {
                std::uint8_t x = a[index[i]];
                if (x != a[i]) return x > a[i];
            }
            return false;
        };
        for (int r = 1; r < 12; ++r)
            if (loses_to(kTables.rotation[static_cast<std::size_t>(r)])) return false;
        if (mirror_)
            for (int r = 0; r < 12; ++r)
                if (loses_to(kTables.mirror[static_cast<std::size_t>(r)])) return false;
        // Orbit and stabiliser: the copies are the group's size divided by the number of
        // symmetries that map the choice onto itself.
        int fixed_by = 0;
        for (int r = 0; r < 12; ++r) {
            for (int m = 0; m < (mirror_ ? 2 : 1); ++m) {
                const auto& index = m ? kTables.mirror[static_cast<std::size_t>(r)] : kTables.rotation[static_cast<std::size_t>(r)];
                bool same = true;
                for (std::size_t i = 0; i < 12 && same; ++i) same = a[index[i]] == a[i];
                fixed_by += same;
            }
        }
        copies = (mirror_ ? 24 : 12) / fixed_by;
        return true;
    }

    void leaf(const Sums& s) {
        ++enumerated;
        if (++pending_ >= 8192) flush();
        int copies = 1;
        if (rotations_ && !canonical(copies)) return;
        ++evaluated;
        double total = bound(s);
        if (leaf_parts_) {
            Positions pos = positions_from_narrowings(t_);
            KeyDeviations d = key_deviations(pos);
            for (const auto& p : model_.cost().beats) total += p.weight * model_.beat_excess(p, pos, d);
            for (const auto& p : model_.cost().fits) total += p.weight * model_.fit_value(p, pos);
        }
        Entry e{total, choice_, copies};
        if (best.size() < top_) best.push(e);
        else if (better(e, best.top())) {
            best.pop();
            best.push(e);
        }
    }

    const CostModel& model_;
    const Units& units_;
    std::size_t top_;
    bool rotations_, mirror_, prune_;
    const std::atomic<bool>* cancel_;
    std::atomic<std::uint64_t>* shared_done_;
    std::array<double, 3> limit_{};
    std::array<bool, 3> needed_{};
    std::vector<int> last_; // fraction index by units - umin, or -1
    bool no_wide_ = false, leaf_parts_ = false;
    std::array<std::array<double, 12>, 3> w_{};
    std::array<double, 12> t_{};
    std::array<std::uint8_t, 12> choice_{};
    std::array<Sums, 13> sums_{};
    std::uint64_t pending_ = 0;
    bool stopped_ = false;
};

} // namespace

std::vector<Ratio> parse_fractions(const std::string& text, const std::string& source) {
    std::vector<Ratio> out;
    std::size_t start = 0;
    int column = 1;
    for (;;) {
        std::size_t at = text.find(',', start);
        std::string item = text.substr(start, at == std::string::npos ? std::string::npos : at - start);
        std::size_t lead = item.find_first_not_of(' ');
        std::size_t trail = item.find_last_not_of(' ');
        if (lead == std::string::npos) fail({source, 1, column}, "expected a fraction such as 1/4, found nothing");
        out.push_back(parse_ratio(item.substr(lead, trail - lead + 1), {source, 1, column + static_cast<int>(lead)}));
        if (out.size() > 64) fail({source, 0, 0}, "too many fractions; at most 12 distinct ones are allowed");
        if (at == std::string::npos) break;
        column += static_cast<int>(at - start) + 1;
        start = at + 1;
    }
    std::sort(out.begin(), out.end());
    out.erase(std::unique(out.begin(), out.end()), out.end());
    return out;
}

Positions positions_from_narrowings(const std::array<double, 12>& narrowing) {
    Positions pos{};
    double u = 0;
    for (int k = 1; k < 12; ++k) {
        u += F - narrowing[static_cast<std::size_t>(k - 1)];
        double reduced = u - 1200.0 * std::floor(u / 1200.0);
        pos[static_cast<std::size_t>(pc_of(k))] = reduced;
    }
    return pos;
}

CostBreakdown evaluate_narrowings(const CostModel& cost, const std::array<double, 12>& narrowing) {
    return cost.evaluate(positions_from_narrowings(narrowing));
}

Scale circulating_scale(const std::array<Ratio, 12>& fractions, const std::string& description) {
    FifthCircle circle;
    for (std::size_t i = 0; i < 12; ++i) circle.tempering[i] = pythagorean_comma().pow(-fractions[i]);
    return fifth_circle_scale(circle, description);
}

std::uint64_t count_distributions(const CirculatingSpace& space) {
    Units u = make_units(space);
    return u.completions(12, u.whole);
}

CirculatingSearch search_circulating(const CirculatingSpace& space, const CostModel& cost, std::size_t top,
                                     const SearchControl& control) {
    check_control(control, top);
    Units units = make_units(space);
    CirculatingSearch result;
    result.total = units.completions(12, units.whole);
    if (result.total == 0)
        fail({"--fractions", 0, 0}, "no twelve of these fractions add up to one comma, so no circle closes");
    if (result.total > max_circulating_candidates)
        fail({"--fractions", 0, 0}, std::to_string(result.total) +
                                        " distributions is more than the limit of 20000000000; give fewer fractions");
    // Symmetry (see the CostModel comments): turning the circle by r fifths gives the same
    // temperament started on another note, so its intervals are the same twelve deviations
    // on other pitch classes; a cost that treats all pitch classes alike cannot tell them
    // apart, and keeping one copy of each rotation class loses nothing. Reading the circle
    // backwards gives the tuning upside down (each fifth from X to X+7 becomes one from -X-7
    // to -X), which has the same sets of fifths, major thirds and minor thirds. Beat rates
    // depend on where a note lies against the reference and key weights on which key is
    // which, so those costs search every copy.
    result.symmetry_rotations = space.use_symmetry && cost.transposition_invariant();
    result.symmetry_mirror = result.symmetry_rotations && cost.inversion_invariant();

    // Jobs: every feasible prefix of a few fifths, enough for the threads to share evenly.
    int length = 1;
    while (length < 12 && std::pow(static_cast<double>(units.u.size()), length) < 256) ++length;
    std::vector<std::vector<std::uint8_t>> jobs;
    std::vector<std::uint8_t> prefix;
    std::function<void(long long)> build = [&](long long rem) {
        int depth = static_cast<int>(prefix.size());
        if (depth == length) {
            jobs.push_back(prefix);
            return;
        }
        for (std::size_t j = 0; j < units.u.size(); ++j) {
            long long r = rem - units.u[j];
            if (units.completions(11 - depth, r) == 0) continue;
            prefix.push_back(static_cast<std::uint8_t>(j));
            build(r);
            prefix.pop_back();
        }
    };
    build(units.whole);
    // Largest jobs first, so that no thread is left with a big one at the end. (The order of
    // jobs does not change the results: each thread's best are merged in the canonical order.)
    std::vector<std::pair<std::uint64_t, std::size_t>> sized;
    for (std::size_t i = 0; i < jobs.size(); ++i) {
        long long rem = units.whole;
        for (std::uint8_t j : jobs[i]) rem -= units.u[j];
        sized.push_back({units.completions(12 - length, rem), i});
    }
    std::stable_sort(sized.begin(), sized.end(), [](const auto& a, const auto& b) { return a.first > b.first; });
    std::vector<std::vector<std::uint8_t>> ordered;
    for (const auto& x : sized) ordered.push_back(std::move(jobs[x.second]));
    jobs = std::move(ordered);

    std::atomic<std::uint64_t> done{0};
    std::vector<Enumerator> workers;
    workers.reserve(static_cast<std::size_t>(control.threads));
    for (int t = 0; t < control.threads; ++t)
        workers.emplace_back(cost, units, top, result.symmetry_rotations, result.symmetry_mirror, space.prune,
                             control.cancel, &done);
    detail::run_parallel(control.threads, jobs.size(), control, done, result.total,
                 [&](int t, std::size_t job) { workers[static_cast<std::size_t>(t)].run(jobs[job]); });

    std::vector<Entry> all;
    for (auto& w : workers) {
        w.flush();
        result.enumerated += w.enumerated;
        result.evaluated += w.evaluated;
        result.rejected += w.rejected;
        result.cancelled = result.cancelled || w.stopped();
        for (; !w.best.empty(); w.best.pop()) all.push_back(w.best.top());
    }
    result.cancelled = result.cancelled || result.enumerated < result.total;
    std::sort(all.begin(), all.end(), better);
    if (all.size() > top) all.resize(top);
    for (const Entry& e : all) {
        CirculatingResult r;
        for (std::size_t i = 0; i < 12; ++i) {
            r.fractions[i] = space.fractions[e.choice[i]];
            r.narrowing[i] = units.cents[e.choice[i]];
        }
        r.cost = e.cost;
        r.breakdown = evaluate_narrowings(cost, r.narrowing);
        r.copies = e.copies;
        result.results.push_back(std::move(r));
    }
    return result;
}

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

namespace {

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

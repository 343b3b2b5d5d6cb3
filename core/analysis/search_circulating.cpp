// Search 1: every circulating temperament of a space of comma fractions (search.hpp).
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

namespace {

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


} // namespace terzo

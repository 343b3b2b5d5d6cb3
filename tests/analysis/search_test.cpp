#include <catch2/catch.hpp>

#include <cmath>
#include <set>

#include "core/analysis/compare.hpp"
#include "core/analysis/search.hpp"
#include "tests/analysis/test_tunings.hpp"

using namespace terzo;

namespace {

constexpr double P = 23.460010384649014; // Pythagorean comma, docs/references.md section 1
constexpr double S = 21.50628959671478;  // syntonic comma
constexpr double s = 1.9537207882660588; // schisma

CostModel model(std::vector<DeviationPart> parts, Constraints c = {}) {
    Cost cost;
    cost.deviations = std::move(parts);
    cost.constraints = c;
    return CostModel(cost);
}

CirculatingSpace space(const std::string& fractions, bool symmetry = true, bool prune = true) {
    return CirculatingSpace{parse_fractions(fractions, "--fractions"), symmetry, prune};
}

SearchControl threads(int n) {
    SearchControl c;
    c.threads = n;
    return c;
}

int count_of(const CirculatingResult& r, const Ratio& f) {
    int n = 0;
    for (const Ratio& x : r.fractions) n += x == f;
    return n;
}

double binomial(int n, int k) {
    double r = 1;
    for (int i = 1; i <= k; ++i) r = r * (n - k + i) / i;
    return r;
}

} // namespace

TEST_CASE("with fractions 0 and 1/4 and a fifths-only cost every result tempers exactly four fifths", "[search]") {
    // Twelve fractions from {0, 1/4} add up to one comma only as four quarters and eight
    // zeros, so every closed circle has exactly four fifths P/4 narrow (as Werckmeister III,
    // docs/references.md 2.1) and there are C(12, 4) = 495 of them. Their fifths deviate by the
    // same multiset {-P/4 x4, 0 x8}, so "fifths only" ties them all: mean |dev| = 4(P/4)/12 =
    // P/12, rms = sqrt(4 (P/4)^2 / 12) = P / (4 sqrt 3), worst = P/4.
    CostModel m = model({{KeyInterval::fifth, Statistic::rms, 1}});
    CirculatingSearch r = search_circulating(space("0,1/4", false), m, 1000, threads(2));
    CHECK(r.total == 495);
    CHECK(r.enumerated == 495);
    CHECK(r.evaluated == 495);
    REQUIRE(r.results.size() == 495);
    for (const auto& x : r.results) {
        CHECK(count_of(x, Ratio(1, 4)) == 4);
        CHECK(count_of(x, Ratio(0)) == 8);
        CHECK(x.cost == Approx(P / (4 * std::sqrt(3.0))).margin(1e-12));
    }
    // Werckmeister III (C-G, G-D, D-A, B-F# narrowed) is one of them.
    std::array<Ratio, 12> w3;
    w3.fill(Ratio(0));
    w3[0] = w3[1] = w3[2] = w3[5] = Ratio(1, 4);
    bool found = false;
    for (const auto& x : r.results) found = found || x.fractions == w3;
    CHECK(found);
    CHECK(count_distributions(space("0,1/4")) == static_cast<std::uint64_t>(binomial(12, 4)));
}

TEST_CASE("symmetry removal keeps one copy of each rotation and mirror class, and no cost is lost", "[search]") {
    CostModel m = model({{KeyInterval::major_third, Statistic::rms, 1}, {KeyInterval::minor_third, Statistic::worst, 0.5}});
    CirculatingSearch all = search_circulating(space("0,1/4", false), m, 1000, threads(1));
    CirculatingSearch sym = search_circulating(space("0,1/4", true), m, 1000, threads(1));
    CHECK(sym.symmetry_rotations);
    CHECK(sym.symmetry_mirror);
    // Independent count: the classes of 4-of-12 patterns on a circle under turning and
    // reading backwards, by brute force over all 2^12 bit patterns.
    std::set<unsigned> classes;
    for (unsigned b = 0; b < 4096; ++b) {
        if (__builtin_popcount(b) != 4) continue;
        unsigned best = b;
        for (int r = 0; r < 12; ++r) {
            unsigned rot = ((b >> r) | (b << (12 - r))) & 4095u, rev = 0;
            for (int i = 0; i < 12; ++i)
                if (rot & (1u << i)) rev |= 1u << (11 - i);
            best = std::min({best, rot, rev});
        }
        classes.insert(best);
    }
    CHECK(sym.evaluated == classes.size());
    REQUIRE(sym.results.size() == classes.size());
    int copies = 0;
    for (const auto& x : sym.results) copies += x.copies;
    CHECK(copies == 495);
    // Same best cost, and each kept result's copies all appear in the full search with the
    // same cost.
    CHECK(sym.results[0].cost == Approx(all.results[0].cost).margin(1e-12));
    int same = 0;
    for (const auto& x : all.results) same += std::fabs(x.cost - sym.results[0].cost) < 1e-9;
    int best_copies = 0;
    for (const auto& x : sym.results) best_copies += std::fabs(x.cost - sym.results[0].cost) < 1e-9 ? x.copies : 0;
    CHECK(same == best_copies);
    // A cost with beat rates is not invariant: no symmetry is used.
    Cost beats;
    beats.beats = {{KeyInterval::major_third, 5.0, 1}};
    CirculatingSearch b = search_circulating(space("0,1/4", true), CostModel(beats), 5, threads(2));
    CHECK_FALSE(b.symmetry_rotations);
    CHECK(b.evaluated == 495);
}

TEST_CASE("spreading the comma evenly gives the smallest rms of the fifths", "[search]") {
    // {0, 1/6, 1/4}: one comma is six sixths, three sixths and two quarters, or four quarters.
    // The sums of squared narrowings are 6(P/6)^2 = P^2/6, 3(P/6)^2 + 2(P/4)^2 = 5P^2/24 and
    // 4(P/4)^2 = P^2/4, so six fifths of P/6 win, with rms sqrt(P^2/72) = P/(6 sqrt 2).
    CostModel m = model({{KeyInterval::fifth, Statistic::rms, 1}});
    CirculatingSearch r = search_circulating(space("0,1/6,1/4"), m, 10, threads(2));
    CHECK(r.total == 924 + 7920 + 495); // C(12,6) + 12!/(3!2!7!) + C(12,4)
    REQUIRE_FALSE(r.results.empty());
    CHECK(count_of(r.results[0], Ratio(1, 6)) == 6);
    CHECK(r.results[0].cost == Approx(P / (6 * std::sqrt(2.0))).margin(1e-12));
    // The canonical copy puts the tempered fifths first: C-G … E-B narrowed by P/6, the
    // rest pure, which is Young No. 2 (docs/references.md 2.1).
    for (int i = 0; i < 12; ++i) CHECK(r.results[0].fractions[static_cast<std::size_t>(i)] == (i < 6 ? Ratio(1, 6) : Ratio(0)));
}

TEST_CASE("the search's running sums agree with a from-scratch evaluation and with the key comparison", "[search]") {
    Cost c;
    c.deviations = {{KeyInterval::fifth, Statistic::mean, 0.3}, {KeyInterval::major_third, Statistic::worst, 1},
                    {KeyInterval::minor_third, Statistic::rms, 0.7}, {KeyInterval::major_third, Statistic::mean, 2}};
    KeyWeights w;
    for (int k = 0; k < 24; ++k) w.weight[static_cast<std::size_t>(k)] = 1 + k % 3;
    c.weights = w;
    CostModel m(c);
    CirculatingSearch r = search_circulating(space("-1/12,0,1/12,1/6,1/4"), m, 40, threads(2));
    REQUIRE(r.results.size() == 40);
    for (const auto& x : r.results) {
        CHECK(x.cost == Approx(x.breakdown.total).margin(1e-9));
        // Exact route: the fifth-circle recipe builds the tuning; compare_keys measures it.
        Scale exact = circulating_scale(x.fractions, "candidate");
        CompareOptions o;
        o.weights = w;
        CompareSummary sum = compare_keys(exact, o, "candidate").summary;
        CHECK(x.breakdown.parts[0].value == Approx(sum.mean_fifth).margin(1e-9));
        CHECK(x.breakdown.parts[1].value == Approx(sum.worst_major_third).margin(1e-9));
        CHECK(x.breakdown.parts[3].value == Approx(sum.mean_major_third).margin(1e-9));
    }
    for (std::size_t i = 1; i < r.results.size(); ++i) CHECK(r.results[i - 1].cost <= r.results[i].cost);
}

TEST_CASE("results do not depend on the number of threads", "[search]") {
    CostModel m = model({{KeyInterval::major_third, Statistic::mean, 1}, {KeyInterval::fifth, Statistic::worst, 0.25}});
    CirculatingSpace sp = space("-1/12,0,1/12,1/6,1/4", false);
    CirculatingSearch one = search_circulating(sp, m, 25, threads(1));
    for (int t : {2, 3, 7}) {
        CirculatingSearch many = search_circulating(sp, m, 25, threads(t));
        REQUIRE(many.results.size() == one.results.size());
        CHECK(many.enumerated == one.enumerated);
        for (std::size_t i = 0; i < one.results.size(); ++i) {
            CHECK(many.results[i].fractions == one.results[i].fractions);
            CHECK(many.results[i].cost == one.results[i].cost); // bit for bit
        }
    }
}

TEST_CASE("constraints rule candidates out during the search", "[search]") {
    Constraints c;
    c.no_wide_fifths = true;
    c.max_major_third = 16.0;
    CostModel m = model({{KeyInterval::major_third, Statistic::rms, 1}}, c);
    CirculatingSearch r = search_circulating(space("-1/12,0,1/12,1/6,1/4"), m, 1000, threads(2));
    REQUIRE_FALSE(r.results.empty());
    CHECK(r.enumerated == r.total);
    for (const auto& x : r.results) {
        CHECK(x.breakdown.feasible);
        for (const Ratio& f : x.fractions) CHECK(f >= Ratio(0));
        Scale exact = circulating_scale(x.fractions, "c");
        CHECK(compare_keys(exact, {}, "c").summary.worst_major_third <= 16.0 + 1e-9);
    }
    // 12-TET (every fifth 1/12) has every third +13.686 c: it is within the limit and kept.
    bool et = false;
    for (const auto& x : r.results) et = et || count_of(x, Ratio(1, 12)) == 12;
    CHECK(et);
}

TEST_CASE("a cancelled search stops early and keeps the best found so far", "[search]") {
    CostModel m = model({{KeyInterval::major_third, Statistic::rms, 1}});
    CirculatingSpace big = space("-1/12,0,1/24,1/12,1/8,1/6,1/4,1/3", false);
    std::atomic<bool> cancel{false};
    SearchControl c = threads(2);
    c.cancel = &cancel;
    c.progress_interval_ms = 1;
    std::vector<SearchProgress> seen;
    c.progress = [&](const SearchProgress& p) {
        seen.push_back(p);
        if (p.done > 0) cancel = true;
    };
    CirculatingSearch r = search_circulating(big, m, 10, c);
    CHECK(r.cancelled);
    CHECK(r.enumerated < r.total);
    CHECK(r.total == count_distributions(big));
    REQUIRE_FALSE(seen.empty());
    for (std::size_t i = 1; i < seen.size(); ++i) CHECK(seen[i].done >= seen[i - 1].done);
    CHECK(seen.back().total == r.total);
    CHECK_FALSE(r.results.empty());
    for (std::size_t i = 1; i < r.results.size(); ++i) CHECK(r.results[i - 1].cost <= r.results[i].cost);
    // Already cancelled before starting: nothing is visited.
    std::atomic<bool> stop{true};
    SearchControl c2 = threads(2);
    c2.cancel = &stop;
    CirculatingSearch none = search_circulating(big, m, 10, c2);
    CHECK(none.cancelled);
    CHECK(none.enumerated == 0);
}

TEST_CASE("bad circulating searches are rejected with one clear message", "[search]") {
    CostModel m = model({{KeyInterval::fifth, Statistic::rms, 1}});
    CHECK_THROWS_WITH(parse_fractions("0,1/x", "--fractions"), "--fractions:1:3: error: expected a ratio p/q or an integer, found \"1/x\"");
    CHECK_THROWS_WITH(parse_fractions("0,,1/4", "--fractions"), "--fractions:1:3: error: expected a fraction such as 1/4, found nothing");
    CHECK_THROWS_WITH(search_circulating(space("1/4,1/3"), m, 5, threads(1)),
                      "--fractions: error: no twelve of these fractions add up to one comma, so no circle closes");
    CHECK_THROWS_WITH(search_circulating(space("0,3/2"), m, 5, threads(1)),
                      "--fractions: error: fraction 3/2 is outside -1..1 (of a Pythagorean comma)");
    CHECK_THROWS_WITH(search_circulating(space("0,1/1001"), m, 5, threads(1)),
                      "--fractions: error: fraction 1/1001 has a denominator above 1000");
    CHECK_THROWS_WITH(search_circulating(space("0,1/997,1/991"), m, 5, threads(1)),
                      "--fractions: error: the fractions' common denominator exceeds 5040");
    CHECK_THROWS_WITH(search_circulating(space("-1/12,0,1/24,1/12,1/8,1/6,1/5,1/4,1/3,1/2,-1/6,-1/24"), m, 5, threads(1)),
                      Catch::Contains("distributions is more than the limit of 20000000000; give fewer fractions"));
    CHECK_THROWS_WITH(search_circulating(space("0,1/4"), m, 0, threads(1)), "--top: error: result count 0 is outside 1..1000");
    CHECK_THROWS_WITH(search_circulating(space("0,1/4"), m, 5, threads(65)), "--threads: error: thread count 65 is outside 1..64");
}

TEST_CASE("the smoothed cost's gradient matches finite differences", "[search]") {
    Cost c;
    c.deviations = {{KeyInterval::fifth, Statistic::mean, 0.5}, {KeyInterval::major_third, Statistic::worst, 1},
                    {KeyInterval::minor_third, Statistic::rms, 0.7}};
    c.beats = {{KeyInterval::major_third, 6.0, 0.2}, {KeyInterval::fifth, 0.5, 1}};
    c.constraints.max_minor_third = 14.0;
    c.reference = parse_pitch_reference("A4=415", {"--reference", 0, 0});
    CostModel m(c);
    std::array<double, 12> t{};
    for (int i = 0; i < 12; ++i) t[static_cast<std::size_t>(i)] = P / 12 + 2.0 * std::sin(1.7 * i + 0.3);
    for (double tau : {1.0, 0.1}) {
        std::array<double, 12> g{};
        smoothed_cost(m, t, tau, &g);
        for (std::size_t j = 0; j < 12; ++j) {
            const double h = 1e-6;
            auto up = t, down = t;
            up[j] += h;
            down[j] -= h;
            double fd = (smoothed_cost(m, up, tau, nullptr) - smoothed_cost(m, down, tau, nullptr)) / (2 * h);
            INFO("tau " << tau << " j " << j);
            CHECK(g[j] == Approx(fd).epsilon(1e-5).margin(1e-6));
        }
    }
}

TEST_CASE("making all major thirds as pure as possible leads the continuous search to equal temperament", "[search]") {
    // Each fifth lies in four of the twelve major thirds, so the thirds' deviations add up to
    // 12 S - 4 (sum of narrowings) = 12 S - 4 P whatever the distribution: their mean is fixed
    // at S - P/3 = +13.686 c, which is 12-TET's third (docs/references.md section 1). The rms is at
    // least the size of the mean, with equality only when all twelve are equal: the best
    // possible thirds are all 12-TET thirds. Equal thirds alone leave a 4-periodic pattern
    // free; adding the fifths' rms (at least P/12, equal only when every fifth is P/12) makes
    // 12-TET the single optimum of both parts.
    // With sixths available the exhaustive search already has such a pattern (1/6, 1/6, 0, 0
    // repeated three times); from quarters alone it has not, and the optimiser must find it.
    CirculatingSpace sp = space("0,1/6,1/4");
    CostModel thirds = model({{KeyInterval::major_third, Statistic::rms, 1}});
    CHECK(search_circulating(sp, thirds, 1, threads(2)).results[0].cost == Approx(S - P / 3).margin(1e-9));
    ContinuousSearch r = search_continuous(space("0,1/4"), thirds, 3, 3, threads(2));
    REQUIRE_FALSE(r.results.empty());
    KeyDeviations d = key_deviations(positions_from_narrowings(r.results[0].narrowing));
    for (double x : d.major_third) CHECK(x == Approx(S - P / 3).margin(1e-4));
    CHECK(r.results[0].breakdown.total == Approx(13.686286).margin(1e-4));
    CHECK(r.results[0].breakdown.total < r.exhaustive.results[0].cost);

    CostModel both = model({{KeyInterval::major_third, Statistic::rms, 1}, {KeyInterval::fifth, Statistic::rms, 0.1}});
    ContinuousSearch e = search_continuous(sp, both, 1, 3, threads(2));
    REQUIRE_FALSE(e.results.empty());
    for (double n : e.results[0].narrowing) CHECK(n == Approx(P / 12).margin(1e-4));
    // Minimax of the thirds has the same optimum: the largest is at least the mean.
    CostModel worst = model({{KeyInterval::major_third, Statistic::worst, 1}});
    ContinuousSearch w = search_continuous(sp, worst, 1, 3, threads(1));
    CHECK(w.results[0].breakdown.total == Approx(S - P / 3).margin(1e-3));
}

TEST_CASE("the continuous search keeps fifths within their constraints and never ends worse than its start", "[search]") {
    Constraints c;
    c.no_wide_fifths = true;
    CostModel m = model({{KeyInterval::major_third, Statistic::mean, 1}, {KeyInterval::minor_third, Statistic::mean, 1}}, c);
    ContinuousSearch r = search_continuous(space("0,1/6,1/4"), m, 5, 5, threads(2));
    REQUIRE_FALSE(r.results.empty());
    for (const auto& x : r.results) {
        double sum = 0;
        for (double n : x.narrowing) {
            CHECK(n >= -1e-12);
            sum += n;
        }
        CHECK(sum == Approx(P).margin(1e-9)); // the circle closes
        CHECK(x.breakdown.total <= x.start_cost + 1e-12);
        CHECK(x.breakdown.feasible);
    }
    Cost fit;
    fit.fits = {FitPart{}};
    CHECK_THROWS_WITH(search_continuous(space("0,1/4"), CostModel(fit), 1, 1, threads(1)),
                      "--fit: error: the continuous search needs analytic gradients, which the resultant fit does not have; use the circulating search for fits");
    Constraints tight;
    tight.max_fifth = 1.0;
    CHECK_THROWS_WITH(optimise_circulating(model({{KeyInterval::fifth, Statistic::rms, 1}}, tight), {}),
                      "--max-fifth: error: no circle closes with every fifth within 1.000 c of pure: it needs at least P/12 = 1.955 c");
}

TEST_CASE("least-squares meantone lies between 1/4 and 1/5 comma, at 4/17 comma", "[search]") {
    // Meantone maps 3/2 to one generator g and 5/4 to four generators less two octaves. With
    // g = 3/2 narrowed by x cents, the fifth errs by -x and the third by S - 4x (four pure
    // fifths overshoot 5/4 by the syntonic comma). Minimising x^2 + (S - 4x)^2: 2x - 8(S - 4x) = 0,
    // so x = 4S/17 = 5.0603 c, between S/5 = 4.3013 and S/4 = 5.3766 (docs/references.md 2.2).
    // This is our own closed-form derivation; no published least-squares value was checked.
    TargetCost cost;
    cost.targets = {parse_target("3/2=1", "--target"), parse_target("5/4=4", "--target")};
    cost.statistic = Statistic::rms;
    auto r = search_rank2(cost, 1200.0, 11, 3);
    REQUIRE_FALSE(r.empty());
    double x = 701.9550008653874 - r[0].generator;
    CHECK(x == Approx(4 * S / 17).margin(1e-9));
    CHECK(x > S / 5);
    CHECK(x < S / 4);
    CHECK(r[0].errors[1].steps == 4);
    CHECK(r[0].errors[1].periods == -2);
    CHECK(r[0].errors[1].error == Approx(S - 16 * S / 17).margin(1e-9));
    // Minimax instead: the fifth and third errors balance, x = S - 4x, x = S/5 (1/5 comma).
    cost.statistic = Statistic::worst;
    auto w = search_rank2(cost, 1200.0, 11, 1);
    CHECK(701.9550008653874 - w[0].generator == Approx(S / 5).margin(1e-7));
}

TEST_CASE("without a pinned mapping the chain finds the schismatic third 8 fifths down", "[search]") {
    // With up to 11 generators either way, 5/4 can also be reached 8 fifths down and 5
    // octaves up; eight pure fifths down miss 5/4 by a schisma s (docs/references.md section 1).
    // With g = 3/2 - x the errors are -x and 8x - s; least squares gives x = 8s/65.
    TargetCost cost;
    cost.targets = {parse_target("3/2", "--target"), parse_target("5/4", "--target")};
    auto r = search_rank2(cost, 1200.0, 11, 5);
    REQUIRE_FALSE(r.empty());
    // An independent dense scan of the same cost confirms nothing better exists.
    double scan_best = 1e9;
    for (int i = 1; i < 1200000; ++i) scan_best = std::min(scan_best, evaluate_rank2(cost, 1200.0, 11, i * 0.001).cost);
    CHECK(r[0].cost <= scan_best + 1e-12);
    double g = r[0].generator;
    if (g > 600) g = 1200 - g; // a chain and its mirror image are the same tuning
    CHECK(g == Approx(1200 - (701.9550008653874 - 8 * s / 65)).margin(1e-9));
    CHECK(std::abs(r[0].errors[1].steps) == 8);
    CHECK_THROWS_WITH(parse_target("5/4=x", "--target"),
                      "--target:1:5: error: expected a generator count from -200 to 200 after '=', found \"x\"");
    CHECK_THROWS_WITH(parse_target("5/4*-1", "--target"),
                      "--target:1:5: error: expected a weight from 0 to 1000000 after '*', found \"-1\"");
    TargetCost pinned;
    pinned.targets = {parse_target("5/4=12", "--target")};
    CHECK_THROWS_WITH(search_rank2(pinned, 1200.0, 11, 1),
                      "--target: error: 5/4=12 needs more generators than the chain has (11)");
    CHECK_THROWS_WITH(search_rank2(cost, 1200.0, 201, 1), "--generators: error: chain length 201 is outside 1..200");
    CHECK_THROWS_WITH(search_rank2(TargetCost{}, 1200.0, 11, 1), "--target: error: give at least one target interval");
}

TEST_CASE("equal divisions are ranked by their targets' errors", "[search]") {
    TargetCost cost;
    cost.targets = {parse_target("3/2", "--target"), parse_target("5/4", "--target"), parse_target("6/5", "--target")};
    // docs/references.md section 3 (common practice; computed): best 3/2, 5/4, 6/5 errors.
    EqualResult e12 = evaluate_equal(cost, 1200.0, 12);
    CHECK(e12.errors[0].error == Approx(-1.955).margin(5e-4));
    CHECK(e12.errors[1].error == Approx(13.686).margin(5e-4));
    CHECK(e12.errors[2].error == Approx(-15.641).margin(5e-4));
    EqualResult e31 = evaluate_equal(cost, 1200.0, 31);
    CHECK(e31.errors[0].steps == 18);
    CHECK(e31.errors[1].error == Approx(0.783).margin(5e-4));
    EqualResult e53 = evaluate_equal(cost, 1200.0, 53);
    CHECK(e53.errors[0].error == Approx(-0.068).margin(5e-4));
    CHECK(e53.errors[1].error == Approx(-1.408).margin(5e-4));
    CHECK(e53.errors[2].error == Approx(1.340).margin(5e-4));
    // The ranking up to 60 by rms, computed separately with python3 (double precision):
    // 53 (1.12286), 34 (2.77727), 46 (3.52990), 50 (4.24556), 56 (4.50059).
    auto r = search_equal(cost, 1200.0, 60, 5);
    REQUIRE(r.size() == 5);
    std::vector<int> order;
    for (const auto& x : r) order.push_back(x.steps);
    CHECK(order == std::vector<int>{53, 34, 46, 50, 56});
    CHECK(r[0].cost == Approx(1.1228612018593416).margin(1e-9));
    // Thirteen divisions of 3/1 (docs/references.md section 3): 7/5 is 4 steps, +2.705 c.
    TargetCost bp;
    bp.targets = {parse_target("7/5", "--target")};
    EqualResult e13 = evaluate_equal(bp, 1901.9550008653874, 13);
    CHECK(e13.errors[0].steps == 4);
    CHECK(e13.errors[0].error == Approx(2.705).margin(5e-4));
    CHECK_THROWS_WITH(search_equal(cost, 1200.0, 100001, 5), "--max-steps: error: largest division 100001 is outside 1..100000");
}

TEST_CASE("pruning by the partial cost keeps exactly the same results", "[search]") {
    std::vector<std::vector<DeviationPart>> costs = {
        {{KeyInterval::major_third, Statistic::rms, 1}},
        {{KeyInterval::fifth, Statistic::worst, 1}, {KeyInterval::minor_third, Statistic::mean, 0.3}},
        {{KeyInterval::major_third, Statistic::mean, 1}, {KeyInterval::major_third, Statistic::worst, 0.5}},
    };
    for (const auto& parts : costs) {
        CostModel m = model(parts);
        for (bool symmetry : {false, true}) {
            CirculatingSearch full = search_circulating(space("-1/12,0,1/12,1/6,1/4", symmetry, false), m, 20, threads(2));
            CirculatingSearch pruned = search_circulating(space("-1/12,0,1/12,1/6,1/4", symmetry, true), m, 20, threads(2));
            REQUIRE(pruned.results.size() == full.results.size());
            CHECK(pruned.enumerated == full.enumerated); // skipped branches are counted as covered
            CHECK(pruned.evaluated < full.evaluated);
            for (std::size_t i = 0; i < full.results.size(); ++i) {
                CHECK(pruned.results[i].fractions == full.results[i].fractions);
                CHECK(pruned.results[i].cost == full.results[i].cost);
                CHECK(pruned.results[i].copies == full.results[i].copies);
            }
        }
    }
}

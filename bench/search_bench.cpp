// Search and ranking throughput.
// - Exhaustive circulating search, every candidate evaluated (no symmetry removal, no
//   pruning), on 1 and 2 threads: candidates per second and the parallel speedup (wall-clock
//   time), beside the speedup of independent loops that share nothing (what the machine
//   gives at that moment); and the default search (symmetry removal and pruning) against it.
// - The search's running sums against evaluating each candidate from scratch (positions ->
//   deviations -> statistics, in doubles), per candidate; and against the exact route (the
//   fifth-circle recipe and the key comparison) for a sample.
// - Ranking 10,000 generated .scl files against just reading their bytes.
#include "bench_main.hpp"

#include <ctime>
#include <filesystem>
#include <fstream>
#include <iomanip>
#include <random>
#include <sstream>
#include <thread>

#include "core/analysis/compare.hpp"
#include "core/analysis/rank.hpp"
#include "core/analysis/search.hpp"

namespace {

using namespace terzo;

const char* kFractions = "-1/12,0,1/12,1/4,1/3"; // 11,628,398 distributions

double cents_times_p(const Ratio& f) {
    return static_cast<double>(f.num()) / static_cast<double>(f.den()) * pythagorean_comma_cents;
}

/// CPU seconds used by the whole process so far (all threads).
double process_cpu_seconds() {
    timespec t{};
    clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &t);
    return static_cast<double>(t.tv_sec) + 1e-9 * static_cast<double>(t.tv_nsec);
}

CostModel bench_cost() {
    Cost c;
    c.deviations = {{KeyInterval::major_third, Statistic::rms, 1}, {KeyInterval::fifth, Statistic::worst, 0.5},
                    {KeyInterval::minor_third, Statistic::mean, 0.25}};
    return CostModel(c);
}

void exhaustive(benchmark::State& state) {
    CostModel m = bench_cost();
    CirculatingSpace sp{parse_fractions(kFractions, "f"), false, false};
    SearchControl c;
    c.threads = static_cast<int>(state.range(0));
    std::uint64_t n = 0;
    double cpu = 0;
    for (auto _ : state) {
        double t0 = process_cpu_seconds();
        CirculatingSearch r = search_circulating(sp, m, 10, c);
        cpu += process_cpu_seconds() - t0;
        n += r.evaluated;
        benchmark::DoNotOptimize(r);
    }
    state.counters["candidates/s"] = benchmark::Counter(static_cast<double>(n), benchmark::Counter::kIsRate);
    state.counters["candidates/cpu_s"] = static_cast<double>(n) / cpu;
}
BENCHMARK(exhaustive)->Arg(1)->Arg(2)->UseRealTime()->Unit(benchmark::kMillisecond)->MinTime(2.0);

/// The machine's own ceiling: the same wall-clock work split into independent arithmetic
/// loops that share nothing, on 1 and 2 threads. On a shared machine another process's load
/// lowers this figure too, so the search's speedup is read against it.
void independent_loops(benchmark::State& state) {
    const int threads = static_cast<int>(state.range(0));
    const long total = 300'000'000;
    for (auto _ : state) {
        std::vector<std::thread> pool;
        std::vector<double> sums(static_cast<std::size_t>(threads) * 8); // one cache line apart
        for (int t = 0; t < threads; ++t)
            pool.emplace_back([&, t] {
                double x = 0;
                for (long i = 0; i < total / threads; ++i) x += std::sqrt(static_cast<double>(i) * 1.0001);
                sums[static_cast<std::size_t>(t) * 8] = x;
            });
        for (auto& th : pool) th.join();
        benchmark::DoNotOptimize(sums);
    }
}
BENCHMARK(independent_loops)->Arg(1)->Arg(2)->UseRealTime()->Unit(benchmark::kMillisecond)->MinTime(1.0);

void exhaustive_with_symmetry(benchmark::State& state) {
    CostModel m = bench_cost();
    CirculatingSpace sp{parse_fractions(kFractions, "f"), true, false};
    SearchControl c;
    c.threads = 1;
    for (auto _ : state) benchmark::DoNotOptimize(search_circulating(sp, m, 10, c));
}
BENCHMARK(exhaustive_with_symmetry)->UseRealTime()->Unit(benchmark::kMillisecond)->MinTime(1.0);

/// The default search: symmetry removal and pruning by the partial cost, 1 thread.
void exhaustive_default(benchmark::State& state) {
    CostModel m = bench_cost();
    CirculatingSpace sp{parse_fractions(kFractions, "f"), true, true};
    SearchControl c;
    for (auto _ : state) benchmark::DoNotOptimize(search_circulating(sp, m, 10, c));
}
BENCHMARK(exhaustive_default)->UseRealTime()->Unit(benchmark::kMillisecond)->MinTime(1.0);

/// Every distribution of the bench space as narrowings in cents (made once).
const std::vector<std::array<double, 12>>& all_candidates() {
    static const std::vector<std::array<double, 12>> list = [] {
        std::vector<Ratio> f = parse_fractions(kFractions, "f");
        std::vector<std::array<double, 12>> out;
        std::array<int, 12> idx{};
        std::function<void(int, Ratio)> rec = [&](int i, Ratio rem) {
            if (i == 12) {
                if (rem == Ratio(0)) {
                    std::array<double, 12> t{};
                    for (int k = 0; k < 12; ++k) t[static_cast<std::size_t>(k)] = cents_times_p(f[static_cast<std::size_t>(idx[static_cast<std::size_t>(k)])]);
                    out.push_back(t);
                }
                return;
            }
            for (std::size_t j = 0; j < f.size(); ++j) {
                Ratio r = rem - f[j];
                // the rest can add up to at most (11 - i)/3 and at least -(11 - i)/12
                if (r > Ratio(11 - i, 3) || r < Ratio(-(11 - i), 12)) continue;
                idx[static_cast<std::size_t>(i)] = static_cast<int>(j);
                rec(i + 1, r);
            }
        };
        rec(0, Ratio(1));
        return out;
    }();
    return list;
}

void incremental_per_candidate(benchmark::State& state) {
    CostModel m = bench_cost();
    CirculatingSpace sp{parse_fractions(kFractions, "f"), false, false};
    SearchControl c;
    double per = 0;
    for (auto _ : state) {
        double t0 = process_cpu_seconds(); // the search runs on a worker thread
        CirculatingSearch r = search_circulating(sp, m, 10, c);
        state.SetIterationTime(process_cpu_seconds() - t0);
        per = static_cast<double>(r.evaluated);
        benchmark::DoNotOptimize(r);
    }
    state.counters["candidates"] = per;
}
BENCHMARK(incremental_per_candidate)->UseManualTime()->Unit(benchmark::kMillisecond)->MinTime(2.0);

/// The same candidates evaluated from scratch in doubles (positions, twelve deviations per
/// class, the statistics), keeping the best ten.
void scratch_per_candidate(benchmark::State& state) {
    CostModel m = bench_cost();
    const auto& all = all_candidates();
    for (auto _ : state) {
        double t0 = process_cpu_seconds();
        std::vector<double> best;
        for (const auto& t : all) {
            KeyDeviations d = key_deviations(positions_from_narrowings(t));
            double cost = 0;
            for (const auto& p : m.cost().deviations) cost += p.weight * m.statistic(p.interval, p.statistic, d.of(p.interval));
            if (best.size() < 10 || cost < best.back()) {
                best.insert(std::upper_bound(best.begin(), best.end(), cost), cost);
                if (best.size() > 10) best.pop_back();
            }
        }
        benchmark::DoNotOptimize(best);
        state.SetIterationTime(process_cpu_seconds() - t0);
    }
    state.counters["candidates"] = static_cast<double>(all.size());
}
BENCHMARK(scratch_per_candidate)->UseManualTime()->Unit(benchmark::kMillisecond)->MinTime(2.0);

/// The exact route for 1,000 of the candidates: fifth-circle recipe -> Scale -> compare_keys.
void exact_route_1000(benchmark::State& state) {
    std::vector<Ratio> f = parse_fractions("0,1/6,1/4", "f");
    std::vector<std::array<Ratio, 12>> sample;
    std::mt19937 rng(7);
    while (sample.size() < 1000) {
        std::array<Ratio, 12> a;
        Ratio sum(0);
        for (auto& x : a) {
            x = f[rng() % 3];
            sum += x;
        }
        if (sum == Ratio(1)) sample.push_back(a);
    }
    for (auto _ : state) {
        double t0 = process_cpu_seconds();
        double total = 0;
        for (const auto& a : sample) total += compare_keys(circulating_scale(a, "x"), {}, "x").summary.mean_major_third;
        benchmark::DoNotOptimize(total);
        state.SetIterationTime(process_cpu_seconds() - t0);
    }
}
BENCHMARK(exact_route_1000)->UseManualTime()->Unit(benchmark::kMillisecond)->MinTime(1.0);

std::filesystem::path scl_folder() {
    static const std::filesystem::path dir = [] {
        auto d = std::filesystem::temp_directory_path() / ("terzo-search-bench-" + std::to_string(::getpid()));
        std::filesystem::remove_all(d);
        std::filesystem::create_directories(d);
        std::mt19937 rng(11);
        for (int i = 0; i < 10000; ++i) {
            auto sub = d / ("group" + std::to_string(i % 20));
            std::filesystem::create_directories(sub);
            std::ofstream out(sub / ("t" + std::to_string(i) + ".scl"));
            out << "! t" << i << ".scl\n!\ngenerated tuning " << i << "\n 12\n!\n";
            for (int k = 1; k < 12; ++k) {
                if (rng() % 2) out << " " << std::fixed << std::setprecision(3) << (k * 100 + static_cast<int>(rng() % 2000) / 100.0 - 10) << "\n";
                else out << " " << (std::vector<const char*>{"16/15", "9/8", "6/5", "5/4", "4/3", "45/32", "3/2", "8/5", "5/3", "9/5", "15/8"})[static_cast<std::size_t>(k - 1)] << "\n";
            }
            out << " 2/1\n";
        }
        return d;
    }();
    return dir;
}

void read_10000_files(benchmark::State& state) {
    std::vector<RankFailure> failures;
    std::vector<std::string> files = collect_tunings({scl_folder().string()}, failures);
    std::size_t bytes = 0;
    for (auto _ : state) {
        bytes = 0;
        for (const auto& f : files) {
            std::ifstream in(f, std::ios::binary);
            std::ostringstream s;
            s << in.rdbuf();
            bytes += s.str().size();
        }
        benchmark::DoNotOptimize(bytes);
    }
    state.counters["files"] = static_cast<double>(files.size());
    state.counters["bytes"] = static_cast<double>(bytes);
}
BENCHMARK(read_10000_files)->UseRealTime()->Unit(benchmark::kMillisecond)->MinTime(1.0);

void rank_10000_files(benchmark::State& state) {
    SearchControl c;
    c.threads = static_cast<int>(state.range(0));
    std::size_t ranked = 0;
    for (auto _ : state) {
        Ranking r = rank_tunings({scl_folder().string()}, RankMetric::worst_major_third, c);
        ranked = r.entries.size();
        benchmark::DoNotOptimize(r);
    }
    state.counters["ranked"] = static_cast<double>(ranked);
}
BENCHMARK(rank_10000_files)->Arg(1)->Arg(2)->UseRealTime()->Unit(benchmark::kMillisecond)->MinTime(1.0);

/// Collects wall-clock time as well, for the threaded cases.
class WallReporter : public terzo::bench::CollectingReporter {
public:
    std::map<std::string, double> real_ns;
    void ReportRuns(const std::vector<Run>& runs) override {
        for (const auto& r : runs)
            if (!r.error_occurred) real_ns[r.benchmark_name()] = r.GetAdjustedRealTime();
        CollectingReporter::ReportRuns(runs);
    }
};

} // namespace

int main(int argc, char** argv) {
    benchmark::Initialize(&argc, argv);
    WallReporter rep;
    const terzo::bench::CpuTicks before = terzo::bench::machine_cpu_ticks();
    benchmark::RunSpecifiedBenchmarks(&rep);
    terzo::bench::print_steal_since(before);
    auto ratio = [&](const char* label, const std::map<std::string, double>& m, const std::string& a, const std::string& b,
                     double scale) {
        auto x = m.find(a), y = m.find(b);
        if (x == m.end() || y == m.end() || y->second == 0) {
            std::printf("  %-58s (not run)\n", label);
            return;
        }
        std::printf("  %-58s %8.2f\n", label, x->second / y->second * scale);
    };
    std::printf("\nratios (same run):\n");
    ratio("exhaustive speedup, 2 threads over 1 (wall clock)", rep.real_ns, "exhaustive/1/min_time:2.000/real_time",
          "exhaustive/2/min_time:2.000/real_time", 1);
    ratio("independent loops speedup, 2 threads over 1 (the machine)", rep.real_ns, "independent_loops/1/min_time:1.000/real_time",
          "independent_loops/2/min_time:1.000/real_time", 1);
    ratio("symmetry removal speedup (wall clock, 1 thread)", rep.real_ns, "exhaustive/1/min_time:2.000/real_time",
          "exhaustive_with_symmetry/min_time:1.000/real_time", 1);
    ratio("symmetry and pruning (the default) speedup (wall, 1 thread)", rep.real_ns, "exhaustive/1/min_time:2.000/real_time",
          "exhaustive_default/min_time:1.000/real_time", 1);
    ratio("from scratch / incremental, per candidate (process CPU)", rep.real_ns, "scratch_per_candidate/min_time:2.000/manual_time",
          "incremental_per_candidate/min_time:2.000/manual_time", 1);
    // exact route times 1,000 candidates; incremental times 11,628,398
    ratio("exact route / incremental, per candidate (process CPU)", rep.real_ns, "exact_route_1000/min_time:1.000/manual_time",
          "incremental_per_candidate/min_time:2.000/manual_time", 11628398.0 / 1000.0);
    ratio("rank 10,000 files / read their bytes (wall, 1 thread)", rep.real_ns, "rank_10000_files/1/min_time:1.000/real_time",
          "read_10000_files/min_time:1.000/real_time", 1);
    ratio("rank 10,000 files / read their bytes (wall, 2 threads)", rep.real_ns, "rank_10000_files/2/min_time:1.000/real_time",
          "read_10000_files/min_time:1.000/real_time", 1);
    benchmark::Shutdown();
    std::filesystem::remove_all(scl_folder());
    return 0;
}

// Cost of exact rational arithmetic: terzo's Ratio (checked 64-bit path, promoting to
// cpp_int on overflow) against plain boost::rational<cpp_int>, unchecked
// boost::rational<int64_t> and double, on the same stream of small musical ratios.
#include <boost/multiprecision/cpp_int.hpp>
#include <boost/rational.hpp>

#include <random>
#include <vector>

#include "bench_main.hpp"
#include "core/arith/ratio.hpp"

namespace {

std::vector<std::pair<int, int>> operands() {
    std::mt19937 rng(7);
    std::uniform_int_distribution<int> d(1, 64);
    std::vector<std::pair<int, int>> v(1024);
    for (auto& p : v) p = {d(rng), d(rng)};
    return v;
}

// acc = acc * r_i + r_{i-1}: additions and multiplications that stay within 64 bits because
// the running value is reset to the operand every 4 steps (so the unchecked int64 baseline
// computes correct values too); the promoted path is measured separately below.
template <class T, class Make>
void mixed_ops(benchmark::State& state, Make make) {
    auto ops = operands();
    std::vector<T> vals;
    for (auto [n, d] : ops) vals.push_back(make(n, d));
    for (auto _ : state) {
        T acc = vals[0];
        for (std::size_t i = 1; i < vals.size(); ++i) {
            if (i % 4 == 0) acc = vals[i];
            acc = acc * vals[i] + vals[i - 1];
        }
        benchmark::DoNotOptimize(acc);
    }
    state.SetItemsProcessed(state.iterations() * 2 * (vals.size() - 1));
}

void terzo_ratio(benchmark::State& s) {
    mixed_ops<terzo::Ratio>(s, [](int n, int d) { return terzo::Ratio(n, d); });
}
void boost_cpp_int(benchmark::State& s) {
    using R = boost::rational<boost::multiprecision::cpp_int>;
    mixed_ops<R>(s, [](int n, int d) { return R(n, d); });
}
void boost_int64_unchecked(benchmark::State& s) {
    using R = boost::rational<std::int64_t>;
    mixed_ops<R>(s, [](int n, int d) { return R(n, d); });
}
void plain_double(benchmark::State& s) {
    mixed_ops<double>(s, [](int n, int d) { return double(n) / d; });
}

// Stacking forty 3/2s passes int64 (3^40 > 2^63): this measures the promoted path.
void terzo_ratio_promoting(benchmark::State& state) {
    const terzo::Ratio fifth(3, 2);
    for (auto _ : state) {
        terzo::Ratio r(1);
        for (int i = 0; i < 60; ++i) r *= fifth;
        benchmark::DoNotOptimize(r);
    }
}
void boost_cpp_int_stacking(benchmark::State& state) {
    using R = boost::rational<boost::multiprecision::cpp_int>;
    const R fifth(3, 2);
    for (auto _ : state) {
        R r(1);
        for (int i = 0; i < 60; ++i) r *= fifth;
        benchmark::DoNotOptimize(r);
    }
}

BENCHMARK(terzo_ratio);
BENCHMARK(boost_cpp_int);
BENCHMARK(boost_int64_unchecked);
BENCHMARK(plain_double);
BENCHMARK(terzo_ratio_promoting);
BENCHMARK(boost_cpp_int_stacking);

} // namespace

int main(int argc, char** argv) {
    return terzo::bench::run_with_ratios(
        argc, argv,
        {{"Ratio / double", "terzo_ratio", "plain_double"},
         {"Ratio / rational<int64> (unchecked)", "terzo_ratio", "boost_int64_unchecked"},
         {"rational<cpp_int> / Ratio", "boost_cpp_int", "terzo_ratio"},
         {"60 fifths: rational<cpp_int> / Ratio", "boost_cpp_int_stacking", "terzo_ratio_promoting"}});
}

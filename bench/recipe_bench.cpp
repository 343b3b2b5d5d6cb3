// Cost of building tunings from recipes, exactly, against the same recipes in cents
// (floating point only) measured in the same run: 12-note tunings, and the 4096-note chain
// limit where exact rationals have thousands of digits.
#include <string>

#include "bench_main.hpp"
#include "core/tuning/recipe.hpp"

namespace {

void build(benchmark::State& state, const std::string& recipe) {
    for (auto _ : state) {
        terzo::Scale s = terzo::build_recipe(recipe);
        benchmark::DoNotOptimize(s);
    }
}

} // namespace

BENCHMARK_CAPTURE(build, chain_cents_12, std::string("chain 701.955c up 8 down 3"));
BENCHMARK_CAPTURE(build, meantone_12, std::string("meantone 1/4"));
BENCHMARK_CAPTURE(build, pythagorean_12, std::string("chain 3/2 up 8 down 3"));
BENCHMARK_CAPTURE(build, werckmeister_12,
                  std::string("fifths from C: -P/4 -P/4 -P/4 0 0 -P/4 0 0 0 0 0 0"));
BENCHMARK_CAPTURE(build, equal_53, std::string("equal 53"));
BENCHMARK_CAPTURE(build, diamond_11, std::string("diamond 1 3 5 7 9 11"));
BENCHMARK_CAPTURE(build, chain_cents_4096, std::string("chain 701.955c up 4095"))
    ->Unit(benchmark::kMillisecond);
BENCHMARK_CAPTURE(build, chain_tempered_4096, std::string("chain 3/2*S^(-1/4) up 4095"))
    ->Unit(benchmark::kMillisecond);
BENCHMARK_CAPTURE(build, chain_rational_4096, std::string("chain 3/2 up 4095"))
    ->Unit(benchmark::kMillisecond)
    ->Iterations(3);

int main(int argc, char** argv) {
    return terzo::bench::run_with_ratios(
        argc, argv,
        {{"meantone 1/4 (exact) / chain in cents", "build/meantone_12", "build/chain_cents_12"},
         {"Pythagorean (exact) / chain in cents", "build/pythagorean_12", "build/chain_cents_12"},
         {"Werckmeister III / chain in cents", "build/werckmeister_12", "build/chain_cents_12"},
         {"4096 tempered / 4096 in cents", "build/chain_tempered_4096", "build/chain_cents_4096"},
         {"4096 rational / 4096 in cents", "build/chain_rational_4096/iterations:3",
          "build/chain_cents_4096"}});
}

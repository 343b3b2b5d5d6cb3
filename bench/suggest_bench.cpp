// Growing a scale: the 7-note just scale of the tests (1/1 9/8 5/4 4/3 3/2 5/3 15/8) at span 2
// and order 5, every odd-limit-15 candidate not in the scale (42), tones below 20 Hz left out
// (suggest's default). suggest_incremental is `terzo suggest` (the existing dyads' tones once,
// then per candidate only landings and the new dyads); suggest_from_scratch builds each grown
// scale's keyboard and computes all its tones and its fit. Goal: from scratch / incremental >= 20.
#include <malloc.h>

#include <vector>

#include "bench_main.hpp"
#include "core/analysis/candidates.hpp"
#include "core/analysis/suggest.hpp"

namespace {

terzo::Keyboard seven_keyboard() {
    const int r[][2] = {{9, 8}, {5, 4}, {4, 3}, {3, 2}, {5, 3}, {15, 8}};
    std::vector<terzo::Pitch> degrees;
    for (auto [n, d] : r) degrees.push_back(terzo::Pitch::from_ratio(terzo::Ratio(n, d)));
    terzo::Scale s("seven just notes", degrees, terzo::Pitch::from_ratio(terzo::Ratio(2)));
    return terzo::Keyboard(s, terzo::default_ref_hz, 2);
}

terzo::SuggestOptions options() {
    terzo::SuggestOptions o;
    o.tones.order = 5;
    o.fit.pitch_floor_hz = terzo::pitch_perception_floor_hz;
    return o;
}

std::vector<terzo::Pitch> candidates(const terzo::Keyboard& kb) {
    auto spec = terzo::parse_candidate_spec("odd:15", {"bench"});
    return terzo::new_candidates(kb, terzo::candidate_pitches(spec, kb.scale().period(), {"bench"}));
}

void suggest_incremental(benchmark::State& state) {
    const terzo::Keyboard kb = seven_keyboard();
    const auto c = candidates(kb);
    const auto o = options();
    for (auto _ : state) {
        auto s = terzo::suggest(kb, c, o, false);
        benchmark::DoNotOptimize(s.add.data());
    }
    state.counters["candidates_per_s"] =
        benchmark::Counter(double(c.size()), benchmark::Counter::kIsIterationInvariantRate);
}

void suggest_from_scratch(benchmark::State& state) {
    const terzo::Keyboard kb = seven_keyboard();
    const auto c = candidates(kb);
    const auto o = options();
    const double base = terzo::suggest(kb, {}, o, false).base_fit;
    for (auto _ : state) {
        std::vector<terzo::Addition> out;
        for (const auto& p : c) out.push_back(terzo::addition_from_scratch(kb, p, o, base));
        benchmark::DoNotOptimize(out.data());
    }
    state.counters["candidates_per_s"] =
        benchmark::Counter(double(c.size()), benchmark::Counter::kIsIterationInvariantRate);
}

// The part of suggest_incremental that does not depend on the candidates: the scale's own
// tones and fit (what from scratch computes once per candidate, for a keyboard 2 notes smaller).
void suggest_no_candidate(benchmark::State& state) {
    const terzo::Keyboard kb = seven_keyboard();
    const auto o = options();
    for (auto _ : state) {
        auto s = terzo::suggest(kb, {}, o, false);
        benchmark::DoNotOptimize(s.base_fit);
    }
}

BENCHMARK(suggest_no_candidate)->Unit(benchmark::kMillisecond);
BENCHMARK(suggest_incremental)->Unit(benchmark::kMillisecond);
BENCHMARK(suggest_from_scratch)->Unit(benchmark::kMillisecond);

} // namespace

int main(int argc, char** argv) {
    // Keep freed memory in the process: otherwise glibc may hand it back to the system after
    // each iteration and fault it in again, which on a virtual machine cost the from-scratch
    // case (many small allocations per candidate) anywhere from 1x to 6x between runs.
    mallopt(M_MMAP_THRESHOLD, 64 << 20);
    mallopt(M_TRIM_THRESHOLD, 256 << 20);
    return terzo::bench::run_with_ratios(
        argc, argv, {{"from scratch / incremental (goal >= 20)", "suggest_from_scratch", "suggest_incremental"}});
}

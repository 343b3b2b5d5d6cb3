// Cost of exactness in the resultant engine: every dyad of a 12-note just scale laid over 88
// keys and more (span 8 from 27.5 Hz, 97 notes, 4656 dyads), every term up to order 5, once
// with exact ratios and exact landings (resultants_exact) and once in plain floating point
// (resultants_float) over the same work. Goal: exact <= 1.5 x float.
#include <vector>

#include "bench_main.hpp"
#include "core/analysis/combination.hpp"

namespace {

terzo::Keyboard just_keyboard() {
    // A 5-limit just chromatic scale (common practice); the same as tests/analysis/data/just12.scl.
    const int r[][2] = {{16, 15}, {9, 8}, {6, 5}, {5, 4}, {4, 3}, {45, 32},
                        {3, 2},   {8, 5}, {5, 3}, {9, 5}, {15, 8}};
    std::vector<terzo::Pitch> degrees;
    for (auto [n, d] : r) degrees.push_back(terzo::Pitch::from_ratio(terzo::Ratio(n, d)));
    terzo::Scale s("just 12", degrees, terzo::Pitch::from_ratio(terzo::Ratio(2)));
    return terzo::Keyboard(s, 27.5, 8);
}

void run(benchmark::State& state, bool exact) {
    const terzo::Keyboard kb = just_keyboard();
    terzo::ToneOptions opt;
    opt.order = 5;
    opt.exact = exact;
    std::size_t tones = 0;
    for (auto _ : state) {
        auto dyads = terzo::keyboard_tones(kb, opt);
        tones = 0;
        for (const auto& d : dyads) tones += d.tones.size();
        benchmark::DoNotOptimize(dyads.data());
    }
    state.counters["tones"] = double(tones);
    state.SetItemsProcessed(state.iterations() * std::int64_t(tones));
}

void resultants_exact(benchmark::State& s) { run(s, true); }
void resultants_float(benchmark::State& s) { run(s, false); }

// For comparison, the obvious exact design: every tone as Ratio arithmetic, turned into a
// Pitch and landed through the general landing(Keyboard, Pitch). Shows what the fast path
// (common denominator per dyad, 128-bit integer sums, exact checks only where the
// deviation is tiny) saves.
void resultants_naive_exact(benchmark::State& state) {
    const terzo::Keyboard kb = just_keyboard();
    const auto terms = terzo::combination_terms(5);
    std::size_t tones = 0;
    for (auto _ : state) {
        std::vector<terzo::Landing> out;
        const auto& notes = kb.notes();
        for (std::size_t i = 0; i < notes.size(); ++i)
            for (std::size_t j = i + 1; j < notes.size(); ++j) {
                const terzo::Ratio lo = *notes[i].ratio(), hi = *notes[j].ratio();
                for (const auto& t : terms) {
                    terzo::Ratio r = terzo::Ratio(t.a) * lo + terzo::Ratio(t.b) * hi;
                    if (r.sign() <= 0) continue;
                    out.push_back(terzo::landing(kb, terzo::Pitch::from_ratio(r)));
                }
            }
        tones = out.size();
        benchmark::DoNotOptimize(out.data());
    }
    state.counters["tones"] = double(tones);
}

BENCHMARK(resultants_exact)->Unit(benchmark::kMillisecond);
BENCHMARK(resultants_float)->Unit(benchmark::kMillisecond);
BENCHMARK(resultants_naive_exact)->Unit(benchmark::kMillisecond);

} // namespace

int main(int argc, char** argv) {
    return terzo::bench::run_with_ratios(argc, argv,
                                         {{"exact / float (goal <= 1.5)", "resultants_exact", "resultants_float"},
                                          {"naive exact (landings only) / float", "resultants_naive_exact", "resultants_float"}});
}

// Cost of the resultant engine: every dyad of a 12-note just scale laid over 88 keys and more
// (span 8 from 27.5 Hz, 97 notes, 4656 dyads), every term up to order 5.
//  - resultants_exact: the engine as terzo uses it (exact ratios, exact landings).
//  - resultants_float: the same engine with exact work switched off.
//  - resultants_float_kernel: the least a floating-point program must do for the same tones:
//    each tone's frequency, its cents, the nearest note by binary search over the degrees and
//    the deviation, 24 bytes stored per tone in a buffer allocated once. Goal: exact <= 2.0 x it.
//  - resultants_sweep/<divisions>/<span>: the engine on equal divisions of the octave, to show
//    that the cost per tone stays flat as tunings and keyboards grow (ns per tone printed).
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <vector>

#include "bench_main.hpp"
#include "core/analysis/combination.hpp"
#include "core/tuning/temperament.hpp"

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

// Runs the engine over every dyad, keeping one dyad's tones at a time (as the CLI does).
std::size_t engine_pass(const terzo::Keyboard& kb, const terzo::ToneOptions& opt) {
    std::size_t tones = 0;
    terzo::for_each_keyboard_dyad(kb, opt, [&](const terzo::DyadTones& d) {
        tones += d.tones.size();
        benchmark::DoNotOptimize(d.tones.data());
    });
    return tones;
}

void run(benchmark::State& state, const terzo::Keyboard& kb, bool exact) {
    terzo::ToneOptions opt;
    opt.order = 5;
    opt.exact = exact;
    std::size_t tones = 0;
    for (auto _ : state) tones = engine_pass(kb, opt);
    state.counters["tones"] = double(tones);
    state.SetItemsProcessed(state.iterations() * std::int64_t(tones));
}

void resultants_exact(benchmark::State& s) { run(s, just_keyboard(), true); }
void resultants_float(benchmark::State& s) { run(s, just_keyboard(), false); }

// The minimal floating-point loop (see the header comment), over the same dyads and terms.
void resultants_float_kernel(benchmark::State& state) {
    const terzo::Keyboard kb = just_keyboard();
    const auto terms = terzo::combination_terms(5);
    std::vector<double> degrees; // cents inside the period, sorted, with the next period's first
    for (const auto& d : kb.sorted_degrees()) degrees.push_back(d.cents_in_period);
    const double period = kb.period_cents();
    degrees.push_back(degrees.front() + period);
    struct Out {
        float hz, cents, deviation;
        std::int32_t degree, period, term;
    };
    static_assert(sizeof(Out) == 24, "24 bytes a tone");
    std::vector<double> hz;
    for (const auto& n : kb.notes()) hz.push_back(n.hz);
    std::vector<Out> out(hz.size() * hz.size() / 2 * terms.size());
    const double ref = kb.ref_hz();
    std::size_t tones = 0;
    for (auto _ : state) {
        std::size_t k = 0;
        for (std::size_t i = 0; i < hz.size(); ++i)
            for (std::size_t j = i + 1; j < hz.size(); ++j) {
                const double fl = hz[i], fh = hz[j];
                for (std::size_t t = 0; t < terms.size(); ++t) {
                    const double f = terms[t].a * fl + terms[t].b * fh;
                    if (f <= 0) continue;
                    const double c = 1200.0 * std::log2(f / ref);
                    const double p = std::floor(c / period);
                    const double in = c - p * period;
                    const auto at = std::upper_bound(degrees.begin(), degrees.end(), in) - degrees.begin();
                    const double below = at > 0 ? degrees[std::size_t(at - 1)] : degrees.back() - period;
                    const double above = degrees[std::size_t(at)];
                    const bool low = in - below <= above - in;
                    out[k++] = {float(f), float(c), float(low ? in - below : in - above),
                                std::int32_t(low ? at - 1 : at), std::int32_t(p), std::int32_t(t)};
                }
            }
        tones = k;
        benchmark::DoNotOptimize(out.data());
        benchmark::ClobberMemory();
    }
    state.counters["tones"] = double(tones);
    state.SetItemsProcessed(state.iterations() * std::int64_t(tones));
}

// Equal divisions of the octave (exact tempered pitches, 2^(k/n)) from 27.5 Hz.
void resultants_sweep(benchmark::State& state) {
    const int divisions = int(state.range(0)), span = int(state.range(1));
    const terzo::Keyboard kb(
        terzo::equal_division(divisions, terzo::Pitch::from_ratio(terzo::Ratio(2)), "equal"), 27.5, span);
    run(state, kb, true);
}

BENCHMARK(resultants_exact)->Unit(benchmark::kMillisecond);
BENCHMARK(resultants_float)->Unit(benchmark::kMillisecond);
BENCHMARK(resultants_float_kernel)->Unit(benchmark::kMillisecond);
BENCHMARK(resultants_sweep)
    ->ArgNames({"divisions", "span"})
    ->Args({12, 2})->Args({31, 2})->Args({53, 2})->Args({72, 2})->Args({144, 2})
    ->Args({12, 1})->Args({12, 3})->Args({12, 4})->Args({12, 5})->Args({12, 6})->Args({12, 7})->Args({12, 8})
    ->Unit(benchmark::kMillisecond);

// Prints ns per tone for each benchmark that counted tones (CPU time / tones).
class PerTone : public terzo::bench::CollectingReporter {
public:
    std::map<std::string, double> ns_per_tone;
    void ReportRuns(const std::vector<Run>& runs) override {
        for (const auto& r : runs) {
            auto t = r.counters.find("tones");
            if (!r.error_occurred && t != r.counters.end() && t->second.value > 0)
                ns_per_tone[r.benchmark_name()] = r.GetAdjustedCPUTime() * 1e6 / t->second.value;
        }
        CollectingReporter::ReportRuns(runs);
    }
};

} // namespace

int main(int argc, char** argv) {
    PerTone reporter;
    const int status = terzo::bench::run_with_ratios(
        argc, argv,
        {{"exact / float_kernel (goal <= 2.0)", "resultants_exact", "resultants_float_kernel"},
         {"exact / float", "resultants_exact", "resultants_float"}},
        reporter);
    std::printf("\nns per tone (CPU time / tones; flat means cost grows with the tones only):\n");
    for (const auto& [name, ns] : reporter.ns_per_tone) std::printf("  %-44s %8.1f\n", name.c_str(), ns);
    return status;
}

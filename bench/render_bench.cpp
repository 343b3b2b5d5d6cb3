// Rendering speed: audio seconds produced per CPU second (the counter audio_s_per_cpu_s,
// Google Benchmark's rate counter divides by CPU time) for each model at 48 kHz, on a
// just major triad of harmonic tones (8 partials), one second of audio per iteration; then
// each model's cost relative to the plain render measured in the same run.
// Goals (issue 7): >= 200x real time for poly, >= 20x for the oscillator.
#include "bench_main.hpp"
#include "core/arith/pitch.hpp"
#include "core/io/wav.hpp"
#include "core/sound/render.hpp"

namespace {

terzo::Scale triad() {
    using terzo::Pitch;
    using terzo::Ratio;
    return terzo::Scale("bench", {Pitch::from_ratio(Ratio(5, 4)), Pitch::from_ratio(Ratio(3, 2))},
                        Pitch::from_ratio(Ratio(2)));
}

void render_model(benchmark::State& state, terzo::Model model, int partials) {
    const terzo::Scale scale = triad();
    terzo::RenderSettings s;
    s.seconds = 1.0;
    s.sample_rate = 48000;
    s.model = model;
    s.timbre.partials = partials;
    for (auto _ : state) {
        auto y = terzo::render(scale, {0, 1, 2}, s);
        benchmark::DoNotOptimize(y.data());
    }
    state.counters["audio_s_per_cpu_s"] =
        benchmark::Counter(s.seconds * double(state.iterations()), benchmark::Counter::kIsRate);
}

void none_8(benchmark::State& st) {
    render_model(st, terzo::Model::none, 8);
}
void poly_8(benchmark::State& st) {
    render_model(st, terzo::Model::poly, 8);
}
void oscillator_8(benchmark::State& st) {
    render_model(st, terzo::Model::oscillator, 8);
}
void predicted_8(benchmark::State& st) {
    render_model(st, terzo::Model::predicted, 8);
}
void poly_sine(benchmark::State& st) {
    render_model(st, terzo::Model::poly, 1);
}
void oscillator_sine(benchmark::State& st) {
    render_model(st, terzo::Model::oscillator, 1);
}

// Encoding the rendered second as a 16-bit WAV in memory (what --out adds besides the disk).
void poly_8_and_wav(benchmark::State& state) {
    const terzo::Scale scale = triad();
    terzo::RenderSettings s;
    s.seconds = 1.0;
    s.timbre.partials = 8;
    for (auto _ : state) {
        auto bytes = terzo::encode_wav(terzo::render(scale, {0, 1, 2}, s), terzo::WavFormat{});
        benchmark::DoNotOptimize(bytes.data());
    }
    state.counters["audio_s_per_cpu_s"] =
        benchmark::Counter(s.seconds * double(state.iterations()), benchmark::Counter::kIsRate);
}

BENCHMARK(none_8)->Unit(benchmark::kMillisecond);
BENCHMARK(poly_8)->Unit(benchmark::kMillisecond);
BENCHMARK(oscillator_8)->Unit(benchmark::kMillisecond);
BENCHMARK(predicted_8)->Unit(benchmark::kMillisecond);
BENCHMARK(poly_sine)->Unit(benchmark::kMillisecond);
BENCHMARK(oscillator_sine)->Unit(benchmark::kMillisecond);
BENCHMARK(poly_8_and_wav)->Unit(benchmark::kMillisecond);

} // namespace

int main(int argc, char** argv) {
    return terzo::bench::run_with_ratios(
        argc, argv,
        {{"poly / none (8 partials)", "poly_8", "none_8"},
         {"oscillator / none (8 partials)", "oscillator_8", "none_8"},
         {"predicted / none (8 partials)", "predicted_8", "none_8"},
         {"oscillator / poly (8 partials)", "oscillator_8", "poly_8"},
         {"poly + WAV encoding / poly", "poly_8_and_wav", "poly_8"}});
}

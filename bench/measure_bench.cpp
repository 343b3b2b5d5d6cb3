// Measuring speed: seconds of audio analysed per CPU second (the counter audio_s_per_cpu_s),
// on a synthetic recording of the 13 notes F3..F4 of Werckmeister III at A4 = 415 (stiff
// strings, decay, attack noise, background noise 45 dB down; tests/sound/recording.hpp),
// 0.8 s a note, 44.1 kHz, as a 16-bit WAV file in memory. Baseline in the same run: decoding
// that WAV (what reading the file costs anyway). Goal (issue 20): >= 50x real time for the
// whole measurement.
#include "bench_main.hpp"
#include "core/analysis/measure_match.hpp"
#include "core/tuning/scl.hpp"
#include "core/io/wav.hpp"
#include "core/sound/measure.hpp"
#include "tests/sound/recording.hpp"

namespace {

struct Audio {
    std::string wav;
    double seconds = 0;
};

const Audio& audio() {
    static const Audio a = [] {
        const terzo::Scale scale = terzo::read_scl_file(std::string(TERZO_SOURCE_DIR) + "/scales/werckmeister-iii.scl");
        terzo::NoteMap map(scale, 0, terzo::PitchReference{terzo::NoteName{9, 4}, 415.0}, "bench");
        std::vector<terzo::test::StringNote> notes;
        for (int key = 53; key <= 65; ++key) notes.push_back({map.hz(terzo::note_of_key(key)), 0.8, 0.0, 0.0});
        terzo::test::StringSound s;
        s.sample_rate = 44100;
        auto r = terzo::test::string_recording(notes, s);
        return Audio{terzo::encode_wav(r.samples, terzo::WavFormat{44100, terzo::SampleFormat::int16}),
                     double(r.samples.size()) / 44100.0};
    }();
    return a;
}

void count(benchmark::State& state) {
    state.counters["audio_s_per_cpu_s"] =
        benchmark::Counter(audio().seconds * double(state.iterations()), benchmark::Counter::kIsRate);
}

void decode(benchmark::State& state) {
    for (auto _ : state) {
        auto a = terzo::decode_wav(audio().wav, "bench.wav");
        benchmark::DoNotOptimize(a.samples.data());
    }
    count(state);
}

void find_only(benchmark::State& state) {
    const auto a = terzo::decode_wav(audio().wav, "bench.wav");
    for (auto _ : state) {
        auto spans = terzo::find_notes(a.samples, a.sample_rate);
        benchmark::DoNotOptimize(spans.data());
    }
    count(state);
}

// What `terzo measure` does between reading the file and printing: decode, find, estimate.
void decode_and_measure(benchmark::State& state) {
    for (auto _ : state) {
        auto a = terzo::decode_wav(audio().wav, "bench.wav");
        auto notes = terzo::measure_notes(a.samples, a.sample_rate);
        benchmark::DoNotOptimize(notes.data());
    }
    count(state);
}

BENCHMARK(decode)->Unit(benchmark::kMillisecond);
BENCHMARK(find_only)->Unit(benchmark::kMillisecond);
BENCHMARK(decode_and_measure)->Unit(benchmark::kMillisecond);

} // namespace

int main(int argc, char** argv) {
    std::printf("recording: %.2f s of audio\n", audio().seconds);
    return terzo::bench::run_with_ratios(argc, argv,
                                         {{"decode + measure / decode", "decode_and_measure", "decode"},
                                          {"finding notes / decode", "find_only", "decode"}});
}

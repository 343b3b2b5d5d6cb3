// The WAV reader (libsndfile behind decode_wav) and the measurement on arbitrary bytes: either
// an InputError, or audio within the stated limits whose notes have finite times and pitches.
#include <cmath>
#include <string>

#include "core/io/wav.hpp"
#include "core/sound/measure.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    terzo::fuzz::expect_clean([&] {
        const std::string bytes(reinterpret_cast<const char*>(data), size);
        const terzo::WavAudio a = terzo::decode_wav(bytes, "fuzz.wav");
        terzo::fuzz::require(a.sample_rate >= terzo::min_read_rate && a.sample_rate <= terzo::max_read_rate,
                             "sample rate in range");
        terzo::fuzz::require(!a.samples.empty(), "some samples");
        if (a.samples.size() > 200000) return; // keep each run short
        for (const auto& n : terzo::measure_notes(a.samples, a.sample_rate)) {
            terzo::fuzz::require(n.span.start_s >= 0 && n.span.end_s > n.span.start_s, "ordered times");
            terzo::fuzz::require(std::isfinite(n.pitch.hz) && n.pitch.hz > 0, "finite pitch");
            terzo::fuzz::require(n.pitch.confidence >= 0 && n.pitch.confidence <= 1, "confidence in 0..1");
        }
    });
    return 0;
}

// Note names and reference pitches ("A4=415") on arbitrary text.
#include <cmath>

#include "core/tuning/note_names.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    std::string text = terzo::fuzz::as_text(data, size);
    const terzo::SourcePos pos{"--pitch", 0, 0};
    terzo::fuzz::expect_clean([&] {
        terzo::PitchReference ref = terzo::parse_pitch_reference(text, pos);
        terzo::fuzz::require(ref.hz > 0 && ref.hz <= 20000, "frequency in range");
        int key = terzo::midi_key(ref.note);
        terzo::fuzz::require(terzo::note_of_key(key) == ref.note, "key round trip");
        terzo::fuzz::require(std::isfinite(terzo::equal_tempered_hz({0, 4}, ref)), "finite");
    });
    terzo::fuzz::expect_clean([&] { terzo::parse_pitch_class(text, pos); });
    return 0;
}

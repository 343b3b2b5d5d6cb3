// Chord lists (`--chord`) on arbitrary text, parsed against a just and a tempered keyboard;
// a parsed chord's resultants and common bass are computed too, within the engine's limits.
#include "core/analysis/chord.hpp"
#include "core/tuning/recipe.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    static const terzo::Keyboard just(terzo::build_recipe("list 9/8 5/4 4/3 3/2 5/3 7/4 15/8 2/1"));
    static const terzo::Keyboard tempered(terzo::build_recipe("meantone 1/4"));
    std::string text = terzo::fuzz::as_text(data, size);
    for (const terzo::Keyboard* k : {&just, &tempered}) {
        terzo::fuzz::expect_clean([&] {
            auto chord = terzo::parse_chord(text, *k, {"--chord", 0, 0});
            terzo::fuzz::require(chord.size() >= 2 && chord.size() <= terzo::max_chord_notes, "chord size");
            terzo::chord_tones(*k, chord, terzo::ToneOptions{});
            terzo::common_bass(*k, chord);
        });
    }
    return 0;
}

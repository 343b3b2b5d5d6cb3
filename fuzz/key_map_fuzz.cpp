// The key-map file reader on arbitrary bytes: a rejection is an InputError; an accepted map
// writes out and reads back to the same text, and laying it on a 9-note and a 12-note tuning
// either succeeds for every key or is an InputError.
#include <sstream>

#include "core/arith/prime_vector.hpp"
#include "core/io/key_map_file.hpp"
#include "core/io/mts.hpp"
#include "fuzz_target.hpp"

namespace {

terzo::Scale equal(int n) {
    std::vector<terzo::Pitch> d;
    for (int k = 1; k < n; ++k)
        d.push_back(terzo::Pitch::from_vector(terzo::PrimeVector::prime_power(2, terzo::Ratio(k, n))));
    return terzo::Scale("equal", d, terzo::Pitch::from_ratio(terzo::Ratio(2)));
}

} // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    terzo::fuzz::expect_clean([&] {
        std::istringstream in(terzo::fuzz::as_text(data, size));
        const terzo::KeyMapSpec spec = terzo::read_key_map(in, "map.json");
        std::ostringstream out;
        terzo::write_key_map(out, spec);
        std::istringstream again(out.str());
        const terzo::KeyMapSpec back = terzo::read_key_map(again, "again.json");
        terzo::fuzz::require(back == spec, "write, read gives the same key map");
        for (int n : {9, 12}) {
            try {
                const terzo::KeyMap map = terzo::make_key_map(equal(n), spec, {"map.json", 0, 0});
                terzo::encode_keys(map);
            } catch (const terzo::InputError&) {
            }
        }
    });
    return 0;
}

// The key-weights file of `terzo compare --weights` on arbitrary bytes.
#include <sstream>

#include "core/analysis/compare.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    terzo::fuzz::expect_clean([&] {
        std::istringstream in(terzo::fuzz::as_text(data, size));
        terzo::parse_key_weights(in, "weights.txt");
    });
    return 0;
}

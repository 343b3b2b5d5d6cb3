// The .scl reader on arbitrary bytes: it either rejects with an InputError or returns a scale
// that the writer turns into text that reads back to the same scale.
#include <sstream>

#include "core/tuning/scl.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    terzo::fuzz::expect_clean([&] {
        std::istringstream in(terzo::fuzz::as_text(data, size));
        terzo::Scale scale = terzo::read_scl(in, "fuzz.scl");
        terzo::fuzz::require(scale.size() >= 1 && scale.size() <= terzo::max_scale_size, "size in range");
        std::ostringstream out;
        terzo::write_scl(out, scale, "fuzz.scl");
        std::istringstream again(out.str());
        terzo::fuzz::require(terzo::read_scl(again, "again.scl") == scale, "write then read is lossless");
    });
    return 0;
}

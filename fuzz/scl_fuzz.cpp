// The .scl reader on arbitrary bytes: it either rejects with an InputError or returns a scale
// that the writer turns into text that reads back to the same scale, and whose description
// any JSON or terminal writer can write (whatever its bytes) as valid UTF-8.
#include <sstream>

#include "core/report/scale_report.hpp"
#include "core/tuning/scl.hpp"
#include "core/text.hpp"
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
        terzo::fuzz::require(terzo::is_valid_utf8(terzo::json_text(terzo::scale_json(scale))), "JSON is UTF-8");
        terzo::fuzz::require(terzo::is_printable(terzo::printable(scale.description())), "terminal text is printable");
    });
    return 0;
}

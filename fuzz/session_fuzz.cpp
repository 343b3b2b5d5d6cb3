// The session file reader on arbitrary bytes: a rejection is an InputError; an accepted
// session writes out and reads back to the same text.
#include <sstream>

#include "core/io/session.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    terzo::fuzz::expect_clean([&] {
        std::istringstream in(terzo::fuzz::as_text(data, size));
        terzo::Session session = terzo::read_session(in, "session.json");
        std::ostringstream out;
        terzo::write_session(out, session);
        std::istringstream again(out.str());
        std::ostringstream out2;
        terzo::write_session(out2, terzo::read_session(again, "again.json"));
        terzo::fuzz::require(out.str() == out2.str(), "write, read, write gives the same text");
    });
    return 0;
}

// Shared declarations for terzo's fuzz targets. Each fuzz/<name>_fuzz.cpp defines
// LLVMFuzzerTestOneInput. Built with clang and -DTERZO_FUZZ=ON it is a libFuzzer program;
// in every build it is also linked with replay_main.cpp into replay_<name>, which ctest runs
// over the seed corpus and saved crashers in tests/fuzz/<name>/.
#pragma once

#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>

#include "core/error.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size);

namespace terzo::fuzz {

inline std::string as_text(const std::uint8_t* data, std::size_t size) {
    return std::string(reinterpret_cast<const char*>(data), size);
}

/// A property every input must keep; a failure aborts so the fuzzer records the input.
inline void require(bool ok, const char* what) {
    if (!ok) {
        std::fprintf(stderr, "fuzz property violated: %s\n", what);
        std::abort();
    }
}

/// Runs f; InputError is the expected answer to bad input, anything else escapes and aborts.
template <class F>
void expect_clean(F&& f) {
    try {
        f();
    } catch (const InputError& e) {
        // A rejection must name a place and say something.
        require(!e.message().empty(), "an InputError without a message");
    }
}

} // namespace terzo::fuzz

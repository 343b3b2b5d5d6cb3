// Whole-number options read as signed numbers and checked here, so that "--top -1" is
// refused by name instead of wrapping around to 18446744073709551615.
#pragma once

#include <algorithm>
#include <string>
#include <thread>

#include "core/error.hpp"

namespace terzo::cli {

/// value when it lies in lo..hi; otherwise InputError at option: "<noun> 5000 is outside 1..1000".
inline long long checked_count(long long value, const char* option, const char* noun, long long lo, long long hi) {
    if (value < lo || value > hi)
        fail({option, 0, 0}, std::string(noun) + " " + std::to_string(value) + " is outside " + std::to_string(lo) +
                                 ".." + std::to_string(hi));
    return value;
}

/// --threads: the value given (1..64), or one per core when it was not given.
inline int thread_count(bool given, long long value) {
    if (given) return static_cast<int>(checked_count(value, "--threads", "thread count", 1, 64));
    unsigned n = std::thread::hardware_concurrency();
    return static_cast<int>(std::clamp(n == 0 ? 1u : n, 1u, 64u));
}

} // namespace terzo::cli

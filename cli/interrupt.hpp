// Long runs in the CLI: Ctrl-C sets a flag that core polls (the handler does nothing else),
// and progress from core is drawn as a bar on a terminal or as plain lines otherwise.
#pragma once

#include <atomic>
#include <chrono>
#include <string>

#include "core/analysis/search.hpp"

namespace terzo::cli {

/// While alive, SIGINT sets flag() instead of ending the program; the previous handler
/// comes back on destruction.
class InterruptScope {
public:
    InterruptScope();
    ~InterruptScope();
    InterruptScope(const InterruptScope&) = delete;
    InterruptScope& operator=(const InterruptScope&) = delete;
    const std::atomic<bool>* flag() const;
    bool interrupted() const { return flag()->load(); }

private:
    void (*previous_)(int);
};

/// Draws progress on stderr: a bar redrawn in place when stderr is a terminal, otherwise a
/// plain line at most every two seconds. Silent when `quiet`.
class ProgressPrinter {
public:
    ProgressPrinter(std::string what, bool quiet);
    void operator()(const SearchProgress& p);
    /// Clears the bar (on a terminal).
    void finish();

private:
    std::string what_;
    bool quiet_, terminal_, drawn_ = false;
    std::chrono::steady_clock::time_point last_;
};

} // namespace terzo::cli

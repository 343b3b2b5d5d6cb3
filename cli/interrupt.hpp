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

/// The default of --time-limit, in minutes: long runs stop after this with the best found.
inline constexpr double default_time_limit_minutes = 60;
inline constexpr double max_time_limit_minutes = 100000;

/// The flag a long run polls: set by Ctrl-C (through InterruptScope) or when the time limit
/// has passed. poll() runs in the progress callback, on the calling thread.
class StopControl {
public:
    /// minutes = 0: no time limit; InputError at "--time-limit" outside 0..max_time_limit_minutes.
    explicit StopControl(double minutes);
    const std::atomic<bool>* flag() const { return &stop_; }
    /// Copies Ctrl-C into the flag and sets it once the time is up.
    void poll();
    bool interrupted() const { return interrupt_.interrupted(); }
    bool timed_out() const { return timed_out_; }
    double minutes() const { return minutes_; }

private:
    InterruptScope interrupt_;
    std::atomic<bool> stop_{false};
    double minutes_;
    bool timed_out_ = false;
    std::chrono::steady_clock::time_point start_;
};

/// "3 h 12 min", "4 min 5 s", "12 s".
std::string duration_text(double seconds);

/// Draws progress on stderr: a bar redrawn in place when stderr is a terminal, otherwise a
/// plain line at most every two seconds, both with an estimate of the time left once two
/// seconds have passed; when that estimate passes the time limit, one line says so before
/// the long work goes on. Silent when `quiet`.
class ProgressPrinter {
public:
    ProgressPrinter(std::string what, bool quiet, double time_limit_minutes = 0);
    void operator()(const SearchProgress& p);
    /// Clears the bar (on a terminal).
    void finish();

private:
    std::string what_;
    bool quiet_, terminal_, drawn_ = false, warned_ = false;
    double limit_minutes_;
    std::chrono::steady_clock::time_point start_, last_;
};

} // namespace terzo::cli

#include "cli/interrupt.hpp"

#include <csignal>
#include <cstdio>
#include <string>

#include "core/error.hpp"
#include "core/format.hpp"
#include <unistd.h>

namespace terzo::cli {

namespace {

// The one flag a signal handler may touch: a lock-free atomic.
std::atomic<bool> interrupt_flag{false};
static_assert(std::atomic<bool>::is_always_lock_free);

extern "C" void on_interrupt(int) { interrupt_flag.store(true); }

} // namespace

InterruptScope::InterruptScope() {
    interrupt_flag.store(false);
    previous_ = std::signal(SIGINT, on_interrupt);
}

InterruptScope::~InterruptScope() { std::signal(SIGINT, previous_ == SIG_ERR ? SIG_DFL : previous_); }

const std::atomic<bool>* InterruptScope::flag() const { return &interrupt_flag; }

StopControl::StopControl(double minutes) : minutes_(minutes), start_(std::chrono::steady_clock::now()) {
    if (!(minutes >= 0 && minutes <= max_time_limit_minutes))
        fail({"--time-limit", 0, 0}, "time limit " + number_text(minutes) + " is outside 0..100000 minutes");
}

void StopControl::poll() {
    if (interrupt_.interrupted()) stop_.store(true);
    if (minutes_ > 0 && !timed_out_ &&
        std::chrono::steady_clock::now() - start_ >= std::chrono::duration<double>(60 * minutes_)) {
        timed_out_ = true;
        stop_.store(true);
    }
}

std::string duration_text(double seconds) {
    const long long s = static_cast<long long>(seconds + 0.5);
    char text[64];
    if (s >= 3600) std::snprintf(text, sizeof text, "%lld h %lld min", s / 3600, s % 3600 / 60);
    else if (s >= 60) std::snprintf(text, sizeof text, "%lld min %lld s", s / 60, s % 60);
    else std::snprintf(text, sizeof text, "%lld s", s);
    return text;
}

ProgressPrinter::ProgressPrinter(std::string what, bool quiet, double time_limit_minutes)
    : what_(std::move(what)), quiet_(quiet), terminal_(::isatty(STDERR_FILENO) == 1),
      limit_minutes_(time_limit_minutes), start_(std::chrono::steady_clock::now()), last_(start_) {}

void ProgressPrinter::operator()(const SearchProgress& p) {
    if (quiet_ || p.total == 0) return;
    double share = static_cast<double>(p.done) / static_cast<double>(p.total);
    auto now = std::chrono::steady_clock::now();
    const double elapsed = std::chrono::duration<double>(now - start_).count();
    // The rate so far predicts the rest; too early (or with nothing done) it says nothing.
    std::string left;
    if (elapsed >= 2 && p.done > 0) {
        const double rest = elapsed * static_cast<double>(p.total - p.done) / static_cast<double>(p.done);
        left = "about " + duration_text(rest) + " left";
        if (!warned_ && limit_minutes_ > 0 && elapsed + rest > 60.0 * static_cast<double>(limit_minutes_)) {
            warned_ = true;
            std::fprintf(stderr, "%s%s: at this rate the whole run takes about %s; it stops after the time limit of %s "
                                 "(--time-limit) with the best found by then\n",
                         drawn_ ? "\r\033[K" : "", what_.c_str(), duration_text(elapsed + rest).c_str(),
                         duration_text(60.0 * static_cast<double>(limit_minutes_)).c_str());
        }
    }
    if (terminal_) {
        int filled = static_cast<int>(share * 30);
        std::string bar(static_cast<std::size_t>(filled), '#');
        bar.resize(30, '-');
        std::fprintf(stderr, "\r\033[K%s [%s] %5.1f%%  %llu of %llu%s%s  (Ctrl-C stops and keeps the best so far)",
                     what_.c_str(), bar.c_str(), 100 * share, static_cast<unsigned long long>(p.done),
                     static_cast<unsigned long long>(p.total), left.empty() ? "" : ", ", left.c_str());
        drawn_ = true;
    } else {
        if (now - last_ < std::chrono::seconds(2)) return;
        last_ = now;
        std::fprintf(stderr, "%s: %.1f%% (%llu of %llu)%s%s\n", what_.c_str(), 100 * share,
                     static_cast<unsigned long long>(p.done), static_cast<unsigned long long>(p.total),
                     left.empty() ? "" : ", ", left.c_str());
    }
    std::fflush(stderr);
}

void ProgressPrinter::finish() {
    if (drawn_) std::fprintf(stderr, "\r\033[K");
    drawn_ = false;
}

} // namespace terzo::cli

#include "cli/interrupt.hpp"

#include <csignal>
#include <cstdio>
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

ProgressPrinter::ProgressPrinter(std::string what, bool quiet)
    : what_(std::move(what)), quiet_(quiet), terminal_(::isatty(STDERR_FILENO) == 1),
      last_(std::chrono::steady_clock::now()) {}

void ProgressPrinter::operator()(const SearchProgress& p) {
    if (quiet_ || p.total == 0) return;
    double share = static_cast<double>(p.done) / static_cast<double>(p.total);
    if (terminal_) {
        int filled = static_cast<int>(share * 30);
        std::string bar(static_cast<std::size_t>(filled), '#');
        bar.resize(30, '-');
        std::fprintf(stderr, "\r%s [%s] %5.1f%%  %llu of %llu  (Ctrl-C stops and keeps the best so far)", what_.c_str(),
                     bar.c_str(), 100 * share, static_cast<unsigned long long>(p.done),
                     static_cast<unsigned long long>(p.total));
        drawn_ = true;
    } else {
        auto now = std::chrono::steady_clock::now();
        if (now - last_ < std::chrono::seconds(2)) return;
        last_ = now;
        std::fprintf(stderr, "%s: %.1f%% (%llu of %llu)\n", what_.c_str(), 100 * share,
                     static_cast<unsigned long long>(p.done), static_cast<unsigned long long>(p.total));
    }
    std::fflush(stderr);
}

void ProgressPrinter::finish() {
    if (drawn_) std::fprintf(stderr, "\r\033[K");
    drawn_ = false;
}

} // namespace terzo::cli

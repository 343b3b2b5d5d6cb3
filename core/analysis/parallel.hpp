// Running independent jobs on a few threads while the calling thread reports progress:
// shared by the searches and the ranking. Jobs are handed out in order by an atomic counter;
// the first exception thrown by a job stops the rest and is rethrown here.
#pragma once

#include <algorithm>
#include <atomic>
#include <chrono>
#include <condition_variable>
#include <exception>
#include <mutex>
#include <thread>
#include <vector>

#include "core/analysis/search.hpp"

namespace terzo::detail {

/// Runs jobs 0..count-1 on `threads` threads, calling the progress callback from this thread.
template <class Work>
inline void run_parallel(int threads, std::size_t count, const SearchControl& control,
                  const std::atomic<std::uint64_t>& done, std::uint64_t total, Work work) {
    std::atomic<std::size_t> next{0};
    std::mutex m;
    std::condition_variable cv;
    int running = threads;
    std::vector<std::thread> pool;
    std::exception_ptr error;
    for (int t = 0; t < threads; ++t) {
        pool.emplace_back([&, t] {
            try {
                for (;;) {
                    std::size_t job = next.fetch_add(1);
                    if (job >= count) break;
                    if (control.cancel && control.cancel->load(std::memory_order_relaxed)) break;
                    work(t, job);
                }
            } catch (...) {
                std::lock_guard<std::mutex> lock(m);
                if (!error) error = std::current_exception();
                next.store(count);
            }
            std::lock_guard<std::mutex> lock(m);
            --running;
            cv.notify_all();
        });
    }
    {
        std::unique_lock<std::mutex> lock(m);
        while (running > 0) {
            cv.wait_for(lock, std::chrono::milliseconds(std::max(1, control.progress_interval_ms)));
            if (control.progress && running > 0) {
                lock.unlock();
                control.progress({done.load(std::memory_order_relaxed), total});
                lock.lock();
            }
        }
    }
    for (auto& th : pool) th.join();
    if (error) std::rethrow_exception(error);
}


} // namespace terzo::detail

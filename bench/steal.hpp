// How much CPU time the host took from this virtual machine during a measurement, read from
// /proc/stat. "Steal" is time the virtual CPUs wanted to run while the host ran something
// else; when it is a large share, timings in the same run are slowed by an unknown amount and
// say little. Shared by the benchmarks in bench/ and terzo-gui --bench-frames. Header-only,
// no dependencies.
#pragma once

#include <cstdio>

namespace terzo::bench {

/// Busy and stolen CPU time of the whole machine so far, in clock ticks (zeros where
/// /proc/stat cannot be read).
struct CpuTicks {
    unsigned long long busy = 0, steal = 0;
};

inline CpuTicks machine_cpu_ticks() {
    CpuTicks t;
    if (std::FILE* f = std::fopen("/proc/stat", "r")) {
        unsigned long long v[8] = {};
        if (std::fscanf(f, "cpu %llu %llu %llu %llu %llu %llu %llu %llu", &v[0], &v[1], &v[2], &v[3], &v[4], &v[5],
                        &v[6], &v[7]) == 8) {
            t.busy = v[0] + v[1] + v[2] + v[5] + v[6]; // user, nice, system, irq, softirq
            t.steal = v[7];
        }
        std::fclose(f);
    }
    return t;
}

/// Prints the share of stolen time since `before`, or nothing when it cannot be known.
inline void print_steal_since(const CpuTicks& before) {
    const CpuTicks after = machine_cpu_ticks();
    const unsigned long long busy = after.busy - before.busy, steal = after.steal - before.steal;
    if (busy + steal == 0) return;
    std::printf("CPU time taken by the host (steal) during the run: %.1f %% of the machine's busy time%s\n",
                100.0 * static_cast<double>(steal) / static_cast<double>(busy + steal),
                steal * 10 > busy + steal ? " (over 10 %: timings are unreliable, run again)" : "");
}

} // namespace terzo::bench

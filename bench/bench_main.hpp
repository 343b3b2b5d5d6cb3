// Shared main for terzo's benchmarks: runs Google Benchmark as usual, then prints each
// requested ratio "numerator / denominator" of CPU time per iteration (or of a counter),
// both measured in this same run, so the figures mean something on a noisy shared machine.
#pragma once

#include <benchmark/benchmark.h>

#include "bench/steal.hpp"

#include <cstdio>
#include <map>
#include <string>
#include <utility>
#include <vector>

namespace terzo::bench {

struct RatioSpec {
    std::string label, numerator, denominator; ///< benchmark names as reported
};

class CollectingReporter : public benchmark::ConsoleReporter {
public:
    std::map<std::string, double> cpu_ns; // per iteration
    void ReportRuns(const std::vector<Run>& runs) override {
        for (const auto& r : runs)
            if (!r.error_occurred) cpu_ns[r.benchmark_name()] = r.GetAdjustedCPUTime();
        ConsoleReporter::ReportRuns(runs);
    }
};

/// Runs the benchmarks through `reporter` (a CollectingReporter or one derived from it).
inline int run_with_ratios(int argc, char** argv, const std::vector<RatioSpec>& ratios,
                           CollectingReporter& reporter) {
    benchmark::Initialize(&argc, argv);
    const CpuTicks before = machine_cpu_ticks();
    benchmark::RunSpecifiedBenchmarks(&reporter);
    print_steal_since(before);
    std::printf("\nratios (same run, CPU time per iteration):\n");
    for (const auto& r : ratios) {
        auto a = reporter.cpu_ns.find(r.numerator), b = reporter.cpu_ns.find(r.denominator);
        if (a == reporter.cpu_ns.end() || b == reporter.cpu_ns.end() || b->second == 0) {
            std::printf("  %-40s (not run)\n", r.label.c_str());
            continue;
        }
        std::printf("  %-40s %8.2f\n", r.label.c_str(), a->second / b->second);
    }
    benchmark::Shutdown();
    return 0;
}

inline int run_with_ratios(int argc, char** argv, const std::vector<RatioSpec>& ratios) {
    CollectingReporter reporter;
    return run_with_ratios(argc, argv, ratios, reporter);
}

} // namespace terzo::bench

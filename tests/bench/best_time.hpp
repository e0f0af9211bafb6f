// Shared by the benchmarks: the best of `reps` wall-clock timings of f(), in milliseconds
// (the best, not the mean, is the figure least disturbed by other work on the machine).
#pragma once
#include <algorithm>
#include <chrono>

template <class F>
double best_ms(int reps, F&& f) {
    double best = 1e300;
    for (int r = 0; r < reps; ++r) {
        auto t0 = std::chrono::steady_clock::now();
        f();
        auto t1 = std::chrono::steady_clock::now();
        best = std::min(best, std::chrono::duration<double, std::milli>(t1 - t0).count());
    }
    return best;
}

#include <sys/resource.h>
#include <vector>

// CPU time of this process (user + system, every thread), in milliseconds.
inline double process_cpu_ms() {
    struct rusage ru {};
    getrusage(RUSAGE_SELF, &ru);
    return 1e3 * double(ru.ru_utime.tv_sec + ru.ru_stime.tv_sec) + 1e-3 * double(ru.ru_utime.tv_usec + ru.ru_stime.tv_usec);
}

// The median over `reps` runs of f()'s CPU time (all threads) and of its wall-clock time, in
// milliseconds. On a shared machine the CPU time barely moves with other work; the wall time does.
struct CpuWall {
    double cpu_ms = 0, wall_ms = 0;
};
template <class F>
CpuWall median_cpu_wall_ms(int reps, F&& f) {
    std::vector<double> cpu, wall;
    for (int r = 0; r < reps; ++r) {
        const double c0 = process_cpu_ms();
        auto t0 = std::chrono::steady_clock::now();
        f();
        auto t1 = std::chrono::steady_clock::now();
        cpu.push_back(process_cpu_ms() - c0);
        wall.push_back(std::chrono::duration<double, std::milli>(t1 - t0).count());
    }
    std::sort(cpu.begin(), cpu.end());
    std::sort(wall.begin(), wall.end());
    return {cpu[cpu.size() / 2], wall[wall.size() / 2]};
}

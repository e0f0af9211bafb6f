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

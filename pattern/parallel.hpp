// Minimal parallel loops for the core, the scene builders and the commands: plain std::thread,
// at most 4 threads (the hardware's count when lower), started only when the work pays for
// them (about 50 microseconds a thread). Writers to disjoint ranges or items need no locks.
#pragma once
#include <algorithm>
#include <atomic>
#include <cstddef>
#include <thread>
#include <utility>
#include <vector>

namespace ellipsa {

inline std::size_t parallel_threads() { return std::max(1u, std::min(4u, std::thread::hardware_concurrency())); }

// f(a, b) over contiguous blocks that split [0, n), one a thread, when each gets at least
// min_per_thread items.
template <class F>
void parallel_blocks(std::size_t n, std::size_t min_per_thread, F&& f) {
    const std::size_t threads = std::min<std::size_t>(parallel_threads(), std::max<std::size_t>(1, n / std::max<std::size_t>(min_per_thread, 1)));
    if (threads <= 1) {
        f(std::size_t(0), n);
        return;
    }
    std::vector<std::thread> pool;
    const std::size_t block = (n + threads - 1) / threads;
    for (std::size_t t = 1; t < threads; ++t) {
        const std::size_t a = std::min(n, t * block), b = std::min(n, a + block);
        pool.emplace_back([&f, a, b] { f(a, b); });
    }
    f(std::size_t(0), std::min(n, block));
    for (std::thread& th : pool) th.join();
}

// f(i) for every i in [0, n), items handed out one at a time on up to `threads` threads (for items
// of uneven cost, such as one frequency's figures each). f must not throw.
template <class F>
void parallel_each(std::size_t n, std::size_t threads, F&& f) {
    threads = std::min(threads, n);
    if (threads <= 1) {
        for (std::size_t i = 0; i < n; ++i) f(i);
        return;
    }
    std::atomic<std::size_t> next{0};
    auto work = [&] {
        for (std::size_t i = next++; i < n; i = next++) f(i);
    };
    std::vector<std::thread> pool;
    for (std::size_t t = 1; t < threads; ++t) pool.emplace_back(work);
    work();
    for (std::thread& th : pool) th.join();
}

// The same on parallel_threads() threads.
template <class F>
void parallel_each(std::size_t n, F&& f) {
    parallel_each(n, parallel_threads(), std::forward<F>(f));
}

}  // namespace ellipsa

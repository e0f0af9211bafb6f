// A minimal parallel loop for the scene builders: split [0, n) into contiguous blocks, one per
// hardware thread (at most 4), when the work is large enough to pay for starting threads (about
// 50 microseconds each). Blocks never overlap, so writers to disjoint ranges need no locks.
#pragma once
#include <algorithm>
#include <cstddef>
#include <thread>
#include <vector>

namespace ellipsa::viewer {

template <class F>
void parallel_blocks(std::size_t n, std::size_t min_per_thread, F&& f) {
    const std::size_t hw = std::max(1u, std::min(4u, std::thread::hardware_concurrency()));
    const std::size_t threads = std::min<std::size_t>(hw, std::max<std::size_t>(1, n / std::max<std::size_t>(min_per_thread, 1)));
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

}  // namespace ellipsa::viewer

// The phase centre's region queue against std::priority_queue, the order the walk is defined by.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <queue>
#include <utility>
#include <vector>

#include "pattern/power_queue.hpp"

using namespace ellipsa;

TEST_CASE("PowerQueue pops in std::priority_queue's order, ties to the higher index", "[phase_centre]") {
    // Reference: std::priority_queue<std::pair<double, std::size_t>> (the C++ standard library's
    // max-heap; pairs compare by power, then index), the queue the walk was written with. Pushes
    // and pops interleave as in the walk; the powers come with exact ties, values at the floor and
    // at the peak, values packed into one bucket and, beyond the stated range, ones that must
    // fall into the end buckets and still come out in order.
    // One queue serves every seed in turn, reset for each (as the phase centre's estimates reuse
    // one a thread), with entries of another range left in it before the reset on some seeds.
    const int columns = 37;
    PowerQueue q;
    for (unsigned seed : {1u, 2u, 3u, 4u, 5u}) {
        const double floor = seed == 5 ? 1e-30 : 0.1 * seed, peak = seed == 5 ? 1e-27 : 1.0 * seed;
        if (seed % 2 == 0)
            for (std::uint32_t k = 0; k < 50; ++k) q.push({0.5 * seed + k, k, 0});
        q.reset(floor, peak);
        std::priority_queue<std::pair<double, std::size_t>> ref;
        unsigned x = seed;
        auto next = [&] { return x = x * 1664525u + 1013904223u; };  // Numerical Recipes' LCG (value from memory)
        std::size_t pushed = 0, popped = 0, mismatches = 0;
        for (int step = 0; step < 20000; ++step) {
            if (ref.empty() || next() % 3 != 0) {
                double p = floor + (peak - floor) * double(next() >> 8) / double(1u << 24);
                switch (next() % 8) {
                    case 0: p = floor; break;
                    case 1: p = peak; break;
                    case 2: p = std::round(p * 8) / 8; break;                // exact ties
                    case 3: p = peak * (1 - 1e-6 * double(next() % 4)); break;  // one bucket
                    case 4: p = (next() % 2) ? peak * 3 : floor / 5; break;  // outside the range
                    default: break;
                }
                const std::size_t k = next() % 5000;
                q.push({p, std::uint32_t(k / columns), std::uint32_t(k % columns)});
                ref.emplace(p, k);
                ++pushed;
            } else {
                const PowerQueue::Entry e = q.pop();
                const auto r = ref.top();
                ref.pop();
                mismatches += e.power != r.first || std::size_t(e.i) * columns + e.j != r.second;
                ++popped;
            }
        }
        while (!ref.empty()) {
            REQUIRE(!q.empty());
            const PowerQueue::Entry e = q.pop();
            mismatches += e.power != ref.top().first || std::size_t(e.i) * columns + e.j != ref.top().second;
            ref.pop();
            ++popped;
        }
        INFO("seed " << seed << ", " << pushed << " pushed");
        CHECK(q.empty());
        CHECK(popped == pushed);
        CHECK(mismatches == 0);
    }
}

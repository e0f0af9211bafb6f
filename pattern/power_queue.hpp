// The queue of the phase centre's region walk (pattern/phase_centre.cpp): samples by co-polar
// power, the strongest first.
#pragma once
#include <algorithm>
#include <cstdint>
#include <cstring>
#include <vector>

namespace ellipsa {

// A max-priority queue of samples by co-polar power, ties to the higher index: the order of
// std::priority_queue<std::pair<double, std::size_t>> (the walk's definition), which any correct
// queue shares since no two entries compare equal. The powers, non-negative and meant to lie
// within [floor, peak] as given, are spread over buckets by the top bits of their
// representation (for non-negative doubles these grow with the value: 4096 buckets an octave,
// about 13 600 over the region's 10 dB; a power outside goes to the first or last bucket, which
// keeps the order). Each bucket is a small heap of its own, and a bitmap of the non-empty
// buckets finds the highest, so a pop sifts through a few entries instead of the whole frontier
// (tests/unit/test_power_queue.cpp holds it to std::priority_queue's order).
class PowerQueue {
public:
    struct Entry {  // a sample by its row and column; (i, j) orders as the index i * columns + j
        double power;
        std::uint32_t i, j;
    };
    PowerQueue() = default;
    PowerQueue(double floor, double peak) { reset(floor, peak); }
    // Empty, for the range floor..peak. The buckets keep the room they had (a queue used again
    // for the next walk allocates little); a queue still holding entries drops them.
    void reset(double floor, double peak) {
        base_ = key(floor);
        const std::uint64_t span = key(peak) >= base_ ? key(peak) - base_ + 1 : 1;
        for (std::vector<Entry>& h : buckets_) h.clear();
        buckets_.resize(std::size_t(std::min<std::uint64_t>(span, 1u << 16)));
        used_.assign((buckets_.size() + 63) / 64, 0);
        top_word_ = 0, count_ = 0;
    }
    bool empty() const { return count_ == 0; }
    void push(Entry e) {
        const std::size_t b = bucket(e.power);
        std::vector<Entry>& h = buckets_[b];
        h.push_back(e);
        std::push_heap(h.begin(), h.end(), Below{});
        used_[b / 64] |= std::uint64_t(1) << (b % 64);
        top_word_ = std::max(top_word_, b / 64);
        ++count_;
    }
    Entry pop() {  // not empty
        std::size_t w = top_word_;
        while (used_[w] == 0) --w;
        top_word_ = w;
        const std::size_t b = 64 * w + std::size_t(63 - __builtin_clzll(used_[w]));
        std::vector<Entry>& h = buckets_[b];
        std::pop_heap(h.begin(), h.end(), Below{});
        const Entry top = h.back();
        h.pop_back();
        if (h.empty()) used_[w] &= ~(std::uint64_t(1) << (b % 64));
        --count_;
        return top;
    }

private:
    static std::uint64_t key(double x) {
        std::uint64_t w;
        std::memcpy(&w, &x, sizeof w);
        return w >> 40;  // sign (0 here), exponent, the mantissa's top 12 bits
    }
    std::size_t bucket(double power) const {
        const std::uint64_t k = key(power);
        return k <= base_ ? 0 : std::size_t(std::min<std::uint64_t>(k - base_, buckets_.size() - 1));
    }
    struct Below {  // a type, not a function pointer, so that the heap's compares are inlined
        bool operator()(const Entry& x, const Entry& y) const {
            return x.power < y.power || (x.power == y.power && (x.i < y.i || (x.i == y.i && x.j < y.j)));
        }
    };
    std::uint64_t base_ = 0;
    std::vector<std::vector<Entry>> buckets_;
    std::vector<std::uint64_t> used_;
    std::size_t top_word_ = 0, count_ = 0;
};

}  // namespace ellipsa

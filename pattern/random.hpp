// Random numbers for the simulations, written out here so that a seed gives the same numbers with
// every compiler and standard library (the distributions of <random> are not specified exactly).
//
//   SplitMix64 (G. Steele, D. Lea, C. Flood, "Fast splittable pseudorandom number generators",
//   OOPSLA 2014) seeds the state; xoshiro256** (D. Blackman, S. Vigna, "Scrambled linear
//   pseudorandom number generators", ACM TOMS 47(4), 2021) draws. A uniform double in [0, 1) takes
//   the top 53 bits. Independent streams come from seeding with SplitMix64 of (seed, stream).
//   Discrete distributions are drawn in O(1) by Walker's alias method (A. J. Walker, ACM TOMS 3(3),
//   1977), tables built as M. D. Vose does (IEEE Trans. Software Eng. 17(9), 1991).
#pragma once
#include <algorithm>
#include <cstdint>
#include <vector>

namespace ellipsa {

inline std::uint64_t splitmix64(std::uint64_t& state) {
    std::uint64_t z = (state += 0x9e3779b97f4a7c15ULL);
    z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
    z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
    return z ^ (z >> 31);
}

class Xoshiro256 {
public:
    // The generator of stream `stream` for `seed`: streams are independent for practical purposes.
    Xoshiro256(std::uint64_t seed, std::uint64_t stream) {
        std::uint64_t sm = seed ^ (stream * 0xd1b54a32d192ed03ULL);
        for (std::uint64_t& w : s_) w = splitmix64(sm);
    }
    std::uint64_t next() {
        const std::uint64_t result = rotl(s_[1] * 5, 7) * 9;
        const std::uint64_t t = s_[1] << 17;
        s_[2] ^= s_[0];
        s_[3] ^= s_[1];
        s_[1] ^= s_[2];
        s_[0] ^= s_[3];
        s_[2] ^= t;
        s_[3] = rotl(s_[3], 45);
        return result;
    }
    // Uniform in [0, 1), 53 random bits.
    double uniform() { return double(next() >> 11) * 0x1.0p-53; }

private:
    static std::uint64_t rotl(std::uint64_t x, int k) { return (x << k) | (x >> (64 - k)); }
    std::uint64_t s_[4] = {};
};

// Walker's alias table over weights w_i >= 0 (not all zero): draw() returns i with probability
// w_i / sum(w). Building costs O(n); a draw one uniform number.
class AliasTable {
public:
    explicit AliasTable(const std::vector<double>& weights);
    std::size_t size() const { return prob_.size(); }
    std::size_t draw(Xoshiro256& rng) const { return draw_bits(rng.next()); }
    // The same from a given 64-bit random word; only its top 53 bits are used, so the low 11 bits
    // stay free for another use.
    std::size_t draw_bits(std::uint64_t bits) const {
        const double t = double(bits >> 11) * 0x1.0p-53 * double(prob_.size());
        const std::size_t i = std::min(std::size_t(t), prob_.size() - 1);
        return (t - double(i)) < prob_[i] ? i : alias_[i];
    }

private:
    std::vector<double> prob_;
    std::vector<std::size_t> alias_;
};

}  // namespace ellipsa

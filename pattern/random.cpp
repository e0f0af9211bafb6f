#include "pattern/random.hpp"

namespace ellipsa {

AliasTable::AliasTable(const std::vector<double>& weights) : prob_(weights.size(), 1.0), alias_(weights.size()) {
    const std::size_t n = weights.size();
    double sum = 0;
    for (double w : weights) sum += w;
    std::vector<double> scaled(n);
    std::vector<std::size_t> small, large;
    for (std::size_t i = 0; i < n; ++i) {
        alias_[i] = i;
        scaled[i] = sum > 0 ? weights[i] * double(n) / sum : 1.0;
        (scaled[i] < 1 ? small : large).push_back(i);
    }
    // Vose: pair each under-full column with an over-full one.
    while (!small.empty() && !large.empty()) {
        const std::size_t s = small.back(), l = large.back();
        small.pop_back();
        prob_[s] = scaled[s];
        alias_[s] = l;
        scaled[l] = (scaled[l] + scaled[s]) - 1;
        if (scaled[l] < 1) {
            large.pop_back();
            small.push_back(l);
        }
    }
    // What is left is full up to rounding.
    for (std::size_t i : small) prob_[i] = 1;
    for (std::size_t i : large) prob_[i] = 1;
}

}  // namespace ellipsa

// Hints that a file's conventions may have been read wrongly (issue 14): the two most common
// mistakes with foreign range files are a wrong time convention (exp(-i w t) read as exp(+j w t)
// conjugates every phase, which turns right-hand into left-hand) and a swapped polarisation pair
// (co- and cross-polar columns exchanged). Data cannot prove either; these are hints, worded as
// such, that `info` prints (text and JSON) for the user to check against what they know.
#pragma once
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/summary.hpp"

namespace ellipsa {

// A sense counts as clearly circular for the flip hint when the axial ratio at the peak is at most
// this (dB): a near-linear field may turn its sense between frequencies for real.
inline constexpr double hint_circular_ar_db = 6.0;
// The cross-polar level above the co-polar one at the peak (dB) from which co and cross look
// exchanged (common practice: a co-polar antenna's cross-polar level lies well below its co-polar).
inline constexpr double hint_swapped_margin_db = 3.0;

// The hints for the listed frequencies of s (summaries in the same order, as summarize_each
// gives them), one sentence each, each starting "hint: "; empty when nothing looks wrong.
//   - the sense at the peak flips between neighbouring listed frequencies (each side clearly
//     circular): check the time convention of each scan and a swapped RHCP/LHCP pair;
//   - the file names a Ludwig-3 reference (co/cross data) and the cross-polar level exceeds the
//     co-polar at the peak by hint_swapped_margin_db or more: co and cross may be exchanged, or
//     the reference is the other one.
// Cost: one interpolation per frequency.
std::vector<std::string> convention_hints(const FarFieldSet& s, const std::vector<std::size_t>& freq_indices,
                                          const std::vector<PatternSummary>& summaries);

}  // namespace ellipsa

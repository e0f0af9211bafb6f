// Gain transfer (the gain-comparison method, IEEE Std 149-1979, sec. 12): relative levels
// measured on a range become absolute gain through a reference antenna of known gain measured
// in the same set-up,
//
//     G_AUT (dBi) = G_ref (dBi) + P_AUT (dB) - P_ref (dB),    per frequency,
//
// so every field sample of the antenna under test is multiplied by 10^((G_ref - P_ref) / 20).
// docs/conventions.md ("Range data: gain transfer") and docs/far-field-csv.md say more.
#pragma once
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// The reference at one frequency: its known gain and its level measured in the set-up (in the
// same relative dB as the antenna under test).
struct GainReference {
    double frequency_hz = 0;
    double gain_dbi = 0;
    double measured_db = 0;
};

// The measured level of a reference pattern at one frequency: its peak of total power (the
// refined peak, pattern/peak.hpp), in dB. A reference is aligned on its boresight, which is its
// peak. Cost: one peak search.
double reference_level_db(const FarFieldSet& reference, std::size_t freq_index);

// The antenna under test turned into gain: each frequency scaled by its reference (matched within
// 0.5 %, as find_frequency does); quantity becomes gain and `note` says which reference was used
// (`reference_name`). Refused: data already in gain or directivity, a frequency without a
// reference, a reference level that is not finite (a zero reference pattern). Cost: one pass
// over the fields.
Result<FarFieldSet> transfer_gain(FarFieldSet aut, const std::vector<GainReference>& references,
                                  const std::string& reference_name);

}  // namespace ellipsa

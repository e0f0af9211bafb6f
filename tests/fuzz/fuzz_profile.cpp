// libFuzzer target for the elevation-profile reader (importers/elevation_profile_csv.cpp) and the
// environment a profile makes (pattern/environment.hpp): a table that reads must give finite,
// non-negative densities and weights, or a refusal; never NaN, a crash, a hang or a leak.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "importers/elevation_profile_csv.hpp"
#include "pattern/environment.hpp"

using namespace ellipsa;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    auto table = parse_elevation_profile(text, "fuzz.csv");
    if (!table) {
        if (table.error().message.empty()) std::abort();
        if (table.error().message.find('\0') != std::string::npos) std::abort();  // shown escaped
        return 0;
    }
    for (std::size_t k = 0; k < table->size(); ++k) {
        const ProfilePoint& p = (*table)[k];
        if (!(p.elevation_deg >= -90 && p.elevation_deg <= 90) || !(p.p_v >= 0) || !(p.p_h >= 0) ||
            !std::isfinite(p.p_v) || !std::isfinite(p.p_h))
            std::abort();
        if (k > 0 && !(p.elevation_deg > (*table)[k - 1].elevation_deg)) std::abort();
    }
    EnvironmentChoice c;
    c.profile = *table;
    c.profile_name = "fuzz.csv";
    c.profile_measure = size % 2 ? ProfileMeasure::per_solid_angle : ProfileMeasure::per_elevation;
    auto env = choose_environment(c);
    if (!env) {
        if (env.error().message.empty()) std::abort();
        return 0;
    }
    const Environment& e = env->environment;
    if (std::isnan(e.xpr_db) || !std::isfinite(e.weight_vertical()) || !std::isfinite(e.weight_horizontal())) std::abort();
    auto sampled = sample_environment(e, full_sphere_grid(15, 15));
    if (!sampled) return 0;
    for (double v : sampled->p_theta)
        if (!(v >= 0) || !std::isfinite(v)) std::abort();
    for (double v : sampled->p_phi)
        if (!(v >= 0) || !std::isfinite(v)) std::abort();
    if (!std::isfinite(sampled->sampled_share)) std::abort();
    return 0;
}

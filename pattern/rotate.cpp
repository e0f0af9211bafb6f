#include "pattern/rotate.hpp"

#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"

namespace ellipsa {

Result<FarFieldSet> rotate_pattern(const FarFieldSet& s, const Mat3& r) {
    if (!is_full_sphere(s.grid))
        return Error{"", 0, 0, "rotating a pattern needs the full sphere; this one covers only part of it"};
    if (s.content == FieldContent::magnitude_only)
        return Error{"", 0, 0,
                     "rotating a pattern needs the phase between E_theta and E_phi; this data has magnitudes only"};
    FarFieldSet out = s;
    const Grid& g = s.grid;
    for (std::size_t fi = 0; fi < s.frequencies.size(); ++fi) {
        FarField& f = out.frequencies[fi];
        for (int i = 0; i < g.theta.count; ++i) {
            const double t = g.theta.value_deg(i) * deg;
            for (int j = 0; j < g.phi.count; ++j) {
                const double p = g.phi.value_deg(j) * deg;
                const Vec3 d = direction(t, p);
                const std::size_t k = g.index(i, j);
                auto src = interpolate(s, fi, apply_transposed(r, d));
                if (!src) {
                    f.e_theta[k] = f.e_phi[k] = 0;
                    continue;
                }
                if (s.content == FieldContent::total_only) {
                    f.e_theta[k] = src->e_theta;
                    f.e_phi[k] = 0;
                    continue;
                }
                double t0, p0;
                to_spherical(apply_transposed(r, d), t0, p0);
                const CVec3 e0 = src->e_theta * theta_hat(t0, p0) + src->e_phi * phi_hat(p0);
                const CVec3 e = apply(r, e0);
                f.e_theta[k] = dot(e, theta_hat(t, p));
                f.e_phi[k] = dot(e, phi_hat(p));
            }
        }
    }
    return out;
}

}  // namespace ellipsa

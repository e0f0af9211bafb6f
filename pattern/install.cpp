#include "pattern/install.hpp"

#include <cstdio>

#include "pattern/phase_centre.hpp"
#include "pattern/rotate.hpp"

namespace ellipsa {

namespace {

Status move_reference(FarFieldSet& s, const InstallRequest& q, const Mat3& r) {
    if (!s.has_phase())
        return Error{"", 0, 0, std::string("moving the phase reference needs the phase of the field; the data are ") +
                                   to_string(s.content)};
    for (std::size_t k = 0; k < s.frequencies.size(); ++k) {
        FarField& f = s.frequencies[k];
        Vec3 c_file;  // the new reference in the file's frame, wavelengths
        if (q.reference == PhaseReference::phase_centre) {
            auto pc = estimate_phase_centre(s, k);
            if (!pc) return Error{"", 0, 0, "no phase centre to move the reference to: " + pc.error().message};
            c_file = pc->centre_wl;
        } else {
            if (!(f.frequency_hz > 0))
                return Error{"", 0, 0, "moving the phase reference by a distance in metres needs the frequency, "
                                       "and this data has none (give it with --assume frequency=...)"};
            c_file = (f.frequency_hz / speed_of_light_m_per_s) * apply_transposed(r, q.reference_point_m);
        }
        if (!(norm(c_file) <= max_reference_shift_wl)) {
            char b[160];
            std::snprintf(b, sizeof b, "expected a phase reference within %g wavelengths of the origin (beyond, the phases "
                          "would be rounding noise), found %g wavelengths at ", max_reference_shift_wl, norm(c_file));
            return Error{"", 0, 0, b + format_frequency(f.frequency_hz)};
        }
        move_phase_reference(s.grid, f, c_file);
    }
    return Ok{};
}

}  // namespace

Result<FarFieldSet> install_pattern(FarFieldSet s, const InstallRequest& q) {
    const Mounting m = resolve_mounting(s.file_mounting, q.up, q.turns);
    const Mat3 r = mounting_matrix(m);
    set_interpolation_centres(s);
    if (q.reference != PhaseReference::keep)
        if (Status st = move_reference(s, q, r); !st) return st.error();
    if (!q.turn_fields) {
        s.file_mounting = m;
        return s;
    }
    if (is_identity(r)) return s;
    const bool exact = rotation_is_exact(s.grid, r);
    auto turned = rotate_pattern(s, r);
    if (!turned) return Error{"", 0, 0, "cannot apply the mounting: " + turned.error().message};
    turned->mounting = m;
    turned->mounting_resampled = !exact;
    return turned;
}

}  // namespace ellipsa

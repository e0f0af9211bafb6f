#include "pattern/gain_transfer.hpp"

#include <cmath>
#include <cstdio>

#include "pattern/peak.hpp"

namespace ellipsa {

double reference_level_db(const FarFieldSet& reference, std::size_t freq_index) {
    return to_db(find_peak(reference, freq_index, Component::total).value);
}

namespace {
const GainReference* reference_at(const std::vector<GainReference>& refs, double f_hz) {
    for (const GainReference& r : refs)
        if (std::abs(r.frequency_hz - f_hz) <= 0.005 * std::max(f_hz, r.frequency_hz)) return &r;
    return nullptr;
}

std::string db_text(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%.2f", v);
    return b;
}
}  // namespace

Result<FarFieldSet> transfer_gain(FarFieldSet aut, const std::vector<GainReference>& refs, const std::string& name) {
    if (aut.quantity != Quantity::relative)
        return Error{aut.source, 0, 0,
                     std::string("gain transfer: expected relative levels (quantity relative), found ") + to_string(aut.quantity) +
                         " already"};
    std::string used;
    for (FarField& f : aut.frequencies) {
        const GainReference* r = reference_at(refs, f.frequency_hz);
        if (!r)
            return Error{aut.source, 0, 0, "gain transfer: expected a reference at " + format_frequency(f.frequency_hz) + ", found none"};
        if (!std::isfinite(r->measured_db) || !std::isfinite(r->gain_dbi))
            return Error{aut.source, 0, 0,
                         "gain transfer: expected a finite reference level at " + format_frequency(f.frequency_hz) +
                             " (the reference pattern holds no power?)"};
        const double k = std::pow(10.0, (r->gain_dbi - r->measured_db) / 20.0);
        for (cplx& e : f.e_theta) e *= k;
        for (cplx& e : f.e_phi) e *= k;
        used += (used.empty() ? "" : "; ") + format_frequency(f.frequency_hz) + ": " + db_text(r->gain_dbi) + " dBi against " +
                db_text(r->measured_db) + " dB measured";
    }
    aut.quantity = Quantity::gain;
    const std::string line = "gain by comparison with " + name + " (IEEE Std 149 sec. 12): " + used;
    aut.note += (aut.note.empty() ? "" : "\n") + line;
    return aut;
}

}  // namespace ellipsa

// libFuzzer target for the far-field CSV reader (tests/fuzz/run.sh builds and runs it).
//
// Any input must give either a set or an Error with a message; never a crash, hang, leak or
// undefined behaviour (the target is built with ASan + UBSan). A set that loads must also
// survive the writer: formatted in its own family it reads back to the same grid. The read in
// one pass on a grid guessed from samples (csv_passes.hpp, one_pass) must give exactly what two
// passes give: the same refusal, or the same set bit for bit.
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <string_view>

#include "importers/csv_passes.hpp"
#include "importers/far_field_csv.hpp"

using namespace ellipsa;

namespace {

bool same_bits(const std::vector<cplx>& a, const std::vector<cplx>& b) {
    return a.size() == b.size() && (a.empty() || std::memcmp(a.data(), b.data(), a.size() * sizeof(cplx)) == 0);
}

// The two ways of reading agree: the same refusal (message and place) or the same set.
void same_reads(const Result<FarFieldSet>& a, const Result<FarFieldSet>& b) {
    if (a.ok() != b.ok()) std::abort();
    if (!a) {
        if (a.error().format() != b.error().format()) {
            std::fprintf(stderr, "one pass: %s\ntwo passes: %s\n", a.error().format().c_str(), b.error().format().c_str());
            std::abort();
        }
        return;
    }
    const Grid &g = a->grid, &h = b->grid;
    if (g.theta.start_deg != h.theta.start_deg || g.theta.step_deg != h.theta.step_deg || g.theta.count != h.theta.count ||
        g.phi.start_deg != h.phi.start_deg || g.phi.step_deg != h.phi.step_deg || g.phi.count != h.phi.count ||
        g.sampling != h.sampling || a->frequencies.size() != b->frequencies.size() || a->reading_notes != b->reading_notes)
        std::abort();
    for (std::size_t k = 0; k < a->frequencies.size(); ++k) {
        const FarField &x = a->frequencies[k], &y = b->frequencies[k];
        if (x.frequency_hz != y.frequency_hz || !same_bits(x.e_theta, y.e_theta) || !same_bits(x.e_phi, y.e_phi)) std::abort();
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    CsvReadOptions o;
    o.threads = 1 + int(size % 2);          // both the one-worker and the two-worker paths
    // No memory limit of ours: the reader's own bound (arrays at most about 4 points a row) must
    // keep every allocation small; run.sh caps single allocations (-malloc_limit_mb) to catch it.
    o.memory_limit_bytes = std::size_t(1) << 40;
    if (size > 0 && data[0] == 'M') {       // now and then, a foreign-layout read
        o.column_map = {{"Level", "e_total_db"}, {"Az", "azimuth"}, {"El", "elevation"}, {"x", "ignore"}};
        o.settings = {{"angle-unit", "rad", {"fuzz", 1}}};
    }
    csv::one_pass_min_bytes = 0;  // one pass whenever samples give a grid
    auto r = parse_far_field_csv(text, "fuzz.csv", o);
    csv::one_pass_min_bytes = ~std::size_t(0);
    same_reads(r, parse_far_field_csv(text, "fuzz.csv", o));
    if (!r) {
        if (r.error().message.empty()) std::abort();  // every refusal says what was expected
        return 0;
    }
    const FarFieldSet& s = *r;
    if (s.frequencies.empty() || s.grid.size() == 0) std::abort();
    for (const FarField& f : s.frequencies)
        if (f.e_theta.size() != s.grid.size() || f.e_phi.size() != s.grid.size()) std::abort();
    if (s.grid.size() * s.frequencies.size() > 20000) return 0;  // keep each run fast
    CsvWriteOptions w;
    w.family = natural_family(s);
    auto text2 = format_far_field_csv(s, w);
    if (!text2) std::abort();
    CsvReadOptions o2;
    o2.threads = 1;
    auto r2 = parse_far_field_csv(*text2, "fuzz-rewritten.csv", o2);
    if (!r2) {
        std::fprintf(stderr, "rewritten set does not read back: %s\n", r2.error().format().c_str());
        std::abort();
    }
    if (r2->grid.theta.count != s.grid.theta.count || r2->grid.phi.count != s.grid.phi.count ||
        r2->frequencies.size() != s.frequencies.size())
        std::abort();
    return 0;
}

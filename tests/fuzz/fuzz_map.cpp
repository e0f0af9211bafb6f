// libFuzzer target for the column-map file reader (importers/csv_map.cpp) and for what the CSV
// reader makes of the options a map file gives (repeated keys, unknown names, settings values).
// Any input must give Ok or an Error with a message and a place; never a crash, hang, leak or
// undefined behaviour (built with ASan + UBSan by tests/fuzz/run.sh).
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>
#include <string_view>

#include "importers/far_field_csv.hpp"

using namespace ellipsa;

namespace {

// A small foreign file whose column names the corpus and dictionary use.
constexpr const char* foreign =
    "Sample;Az/deg;El/deg;Level re horn/dB;Remark\n"
    "1;0;-90;-38,1;\n2;0;0;-31,6;x\n3;180;-90;-38,1;\n4;180;0;-30;\n";

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    CsvReadOptions o;
    o.threads = 1;
    o.memory_limit_bytes = std::size_t(1) << 40;  // only the reader's own bounds apply
    auto st = parse_csv_map_text(text, "fuzz.map", o);
    if (!st) {
        if (st.error().message.empty() || st.error().file != "fuzz.map" || st.error().line < 1) std::abort();
        return 0;
    }
    // Every entry knows where it came from.
    for (const auto& m : o.column_map)
        if (m.origin.name != "fuzz.map" || m.origin.line < 1) std::abort();
    for (const auto& s : o.settings)
        if (s.origin.name != "fuzz.map" || s.origin.line < 1) std::abort();
    for (const char* csv : {foreign, "theta,phi,e_total_db\n0,0,0\n0,180,-3\n"}) {
        auto r = parse_far_field_csv(csv, "fuzz.csv", o);
        if (!r && r.error().message.empty()) std::abort();
        if (r && (r->frequencies.empty() || r->grid.size() == 0)) std::abort();
    }
    return 0;
}

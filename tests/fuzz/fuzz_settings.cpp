// libFuzzer target for the viewer's settings reader (viewer/scene/settings.hpp, pure): any text
// gives settings whose every value is within the limits the viewer accepts (finite, in range),
// at most max_settings_warnings + 1 warnings, and settings that survive their own text form.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>
#include <vector>

#include "viewer/scene/settings.hpp"

using namespace ellipsa::viewer;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string text(reinterpret_cast<const char*>(data), size);
    std::vector<std::string> warnings;
    const ViewerSettings s = parse_settings(text, &warnings);
    if (warnings.size() > max_settings_warnings + 1) std::abort();
    if (!(within_limits(s, ViewerSettings{}) == s)) std::abort();  // nothing out of range got through
    if (s.recent_files.size() > ViewerSettings::max_recent) std::abort();
    std::vector<std::string> again_warnings;
    const ViewerSettings again = parse_settings(format_settings(s), &again_warnings);
    if (!(again == s) || !again_warnings.empty()) std::abort();
    return 0;
}

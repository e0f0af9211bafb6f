// The one PNG encoder of every raster file ellipsa writes (cut plots, maps, report figures through
// render.hpp, the viewer's 3D snapshots): 8-bit RGB or RGBA rows, each row filtered by its
// difference from the row above (PNG filter type 2, "Up": plot backgrounds and flat regions turn
// into runs of zeros) and deflated by zlib at its fastest level. PNG encoding was the largest
// single cost of writing a cut PNG and of a report (DEVELOPERS.md, "Measured"); this writes
// about the same file size in a third to a quarter of the time of the libraries it replaced.
// The same pixels always give the same bytes.
#pragma once
#include <cstddef>
#include <cstdint>
#include <string>

#include "pattern/result.hpp"

namespace ellipsa::exports {

// rows: height rows of width * channels bytes each, `stride` bytes apart; channels 3 (RGB) or
// 4 (RGBA, not premultiplied). Error only for a size PNG cannot hold or zlib's own failure.
Result<std::string> encode_png(const std::uint8_t* rows, int width, int height, int channels, std::size_t stride);

}  // namespace ellipsa::exports

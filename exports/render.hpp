// One drawing, three file formats: render a Cairo drawing into the bytes of an SVG, PDF or PNG
// file in memory. Callers write the bytes with write_file_atomically(), so a failed or
// interrupted export never leaves a broken file in place of a good one.
//
// Size: the figure is width_px x height_px pixels at `dpi`; SVG and PDF pages get the same
// physical size (width_px * 72 / dpi points), so text has the same size in all three formats.
#pragma once
#include <functional>
#include <optional>
#include <string>
#include <string_view>

#include <cairo.h>

#include "pattern/result.hpp"

namespace ellipsa::exports {

enum class FileFormat { svg, pdf, png, csv };
const char* to_string(FileFormat f);
// By the extension of a path, case-insensitive (.svg, .pdf, .png, .csv); nullopt otherwise.
std::optional<FileFormat> format_from_path(std::string_view path);

struct RenderSize {
    int width_px = 1200;
    int height_px = 900;
    double dpi = 150;
    double width_pt() const { return width_px * 72.0 / dpi; }
    double height_pt() const { return height_px * 72.0 / dpi; }
};
// "1200x900" -> size (each side min_size_px..max_size_px pixels, dpi min_dpi..max_dpi); an Error
// says what was expected otherwise.
Result<RenderSize> parse_size(std::string_view text, double dpi);
// The limits parse_size checks: dots per inch and pixels on a side.
inline constexpr double min_dpi = 36, max_dpi = 2400;
inline constexpr int min_size_px = 16, max_size_px = 20000;

// The one syntax of every --size: "WIDTHxHEIGHT" in whole pixels (digits only, x or X between),
// WIDTH from min_width and HEIGHT from min_height, each at most max_side. The Error's file is
// "--size" and its message says the allowed range and what was found.
struct PixelLimits {
    int min_width, min_height, max_side;
};
struct PixelSize {
    int width_px, height_px;
};
Result<PixelSize> parse_pixel_size(std::string_view text, const PixelLimits& limits);

// Draws into [0, width_pt] x [0, height_pt] in points.
using Drawing = std::function<void(cairo_t*, double width_pt, double height_pt)>;

// The file bytes. title goes into the PDF metadata. csv is not an image format (Error).
Result<std::string> render_image(const Drawing& draw, FileFormat format, const RenderSize& size,
                                 const std::string& title = {});

// Decode a PNG in memory into 8-bit RGB rows (for tests and golden comparisons).
struct RgbImage {
    int width = 0, height = 0;
    std::string rgb;  // width * height * 3 bytes, row-major
};
Result<RgbImage> decode_png(std::string_view png_bytes);

}  // namespace ellipsa::exports

#include "exports/render.hpp"

#include <cairo-pdf.h>
#include <cairo-svg.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdint>
#include <cstring>
#include <utility>
#include <vector>

#include "exports/png.hpp"

namespace ellipsa::exports {

const char* to_string(FileFormat f) {
    switch (f) {
        case FileFormat::svg: return "svg";
        case FileFormat::pdf: return "pdf";
        case FileFormat::png: return "png";
        case FileFormat::csv: return "csv";
    }
    return "?";
}

std::optional<FileFormat> format_from_path(std::string_view path) {
    const std::size_t dot = path.rfind('.');
    const std::size_t slash = path.rfind('/');
    if (dot == std::string_view::npos || (slash != std::string_view::npos && dot < slash)) return std::nullopt;
    std::string ext(path.substr(dot + 1));
    for (char& c : ext) c = char(std::tolower(static_cast<unsigned char>(c)));
    if (ext == "svg") return FileFormat::svg;
    if (ext == "pdf") return FileFormat::pdf;
    if (ext == "png") return FileFormat::png;
    if (ext == "csv") return FileFormat::csv;
    return std::nullopt;
}

Result<PixelSize> parse_pixel_size(std::string_view text, const PixelLimits& lim) {
    auto bad = [&] {
        const std::string m = std::to_string(lim.max_side);
        const std::string range = lim.min_width == lim.min_height
                                      ? "each from " + std::to_string(lim.min_width) + " to " + m
                                      : "WIDTH from " + std::to_string(lim.min_width) + " and HEIGHT from " +
                                            std::to_string(lim.min_height) + ", each up to " + m;
        return Error{"--size", 0, 0, "expected WIDTHxHEIGHT in whole pixels, " + range + " (e.g. 1200x900), found \"" +
                                         std::string(text) + "\""};
    };
    // Digits only (no sign, point or exponent), at most 6 of them: no overflow.
    auto whole = [](std::string_view s, int& out) {
        if (s.empty() || s.size() > 6) return false;
        int v = 0;
        for (char c : s) {
            if (c < '0' || c > '9') return false;
            v = v * 10 + (c - '0');
        }
        out = v;
        return true;
    };
    const std::size_t x = text.find_first_of("xX");
    PixelSize r{0, 0};
    if (x == std::string_view::npos || !whole(text.substr(0, x), r.width_px) || !whole(text.substr(x + 1), r.height_px))
        return bad();
    if (r.width_px < lim.min_width || r.height_px < lim.min_height || r.width_px > lim.max_side || r.height_px > lim.max_side)
        return bad();
    return r;
}

namespace {
// A limit as the user types it ("36", "2400", "0.5").
std::string limit_text(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%.15g", v);
    return b;
}
}  // namespace

Result<RenderSize> parse_size(std::string_view text, double dpi) {
    auto px = parse_pixel_size(text, {min_size_px, min_size_px, max_size_px});
    if (!px) return px.error();
    RenderSize r;
    r.width_px = px->width_px, r.height_px = px->height_px;
    if (!(dpi >= min_dpi && dpi <= max_dpi))
        return Error{"--dpi", 0, 0, "expected a number of dots per inch from " + limit_text(min_dpi) + " to " + limit_text(max_dpi)};
    r.dpi = dpi;
    return r;
}

namespace {

cairo_status_t append(void* closure, const unsigned char* data, unsigned int length) {
    static_cast<std::string*>(closure)->append(reinterpret_cast<const char*>(data), length);
    return CAIRO_STATUS_SUCCESS;
}

Error cairo_error(const char* what, cairo_status_t s) {
    return Error{"", 0, 0, std::string(what) + ": " + cairo_status_to_string(s)};
}

// The pixels of an RGB24 image surface (one native-endian 0x00RRGGBB word a pixel) as a PNG.
Result<std::string> surface_png(cairo_surface_t* surface) {
    cairo_surface_flush(surface);
    const int w = cairo_image_surface_get_width(surface), h = cairo_image_surface_get_height(surface);
    const int stride = cairo_image_surface_get_stride(surface);
    const unsigned char* data = cairo_image_surface_get_data(surface);
    std::vector<std::uint8_t> rgb(std::size_t(w) * std::size_t(h) * 3);
    for (int y = 0; y < h; ++y) {
        const unsigned char* row = data + std::size_t(y) * std::size_t(stride);
        std::uint8_t* d = rgb.data() + std::size_t(y) * std::size_t(w) * 3;
        for (int x = 0; x < w; ++x) {
            std::uint32_t px;
            std::memcpy(&px, row + 4 * std::size_t(x), 4);
            d[3 * x] = std::uint8_t(px >> 16);
            d[3 * x + 1] = std::uint8_t(px >> 8);
            d[3 * x + 2] = std::uint8_t(px);
        }
    }
    return encode_png(rgb.data(), w, h, 3, std::size_t(w) * 3);
}

// Cairo 1.16 names an SVG's page group and its embedded images after the surfaces' unique ids,
// which count every Cairo surface the process has made ("surface1" in a fresh command,
// "surface241" in a Python session after a PNG). Those names are renumbered in order of first
// appearance, in their definitions (id="...") and references (#...), so the same figure gives
// the same bytes whatever was drawn before it. Glyph, clip and pattern names count per document.
void renumber_svg_ids(std::string& svg) {
    std::string out;
    out.reserve(svg.size());
    std::vector<std::pair<std::string, std::string>> seen;  // old name -> new name
    std::size_t i = 0;
    while (i < svg.size()) {
        const bool opens = svg[i] == '#' || (svg[i] == '"' && i >= 3 && svg.compare(i - 3, 3, "id=") == 0);
        std::size_t stem = 0;
        for (const char* p : {"surface", "image"})
            if (opens && svg.compare(i + 1, std::strlen(p), p) == 0) stem = std::strlen(p);
        std::size_t end = i + 1 + stem;
        while (stem && end < svg.size() && std::isdigit(static_cast<unsigned char>(svg[end]))) ++end;
        if (!stem || end == i + 1 + stem || end >= svg.size() || (svg[end] != '"' && svg[end] != ')')) {
            out += svg[i++];
            continue;
        }
        const std::string name = svg.substr(i + 1, end - i - 1), prefix = svg.substr(i + 1, stem);
        auto it = std::find_if(seen.begin(), seen.end(), [&](const auto& kv) { return kv.first == name; });
        if (it == seen.end()) {
            const auto count = std::count_if(seen.begin(), seen.end(),
                                             [&](const auto& kv) { return kv.first.compare(0, stem, prefix) == 0; });
            it = seen.insert(seen.end(), {name, prefix + std::to_string(count + 1)});
        }
        out += svg[i];
        out += it->second;
        i = end;
    }
    svg.swap(out);
}

}  // namespace

Result<std::string> render_image(const Drawing& draw, FileFormat format, const RenderSize& size,
                                 const std::string& title) {
    std::string out;
    const double w = size.width_pt(), h = size.height_pt();
    cairo_surface_t* surface = nullptr;
    switch (format) {
        case FileFormat::svg:
            surface = cairo_svg_surface_create_for_stream(append, &out, w, h);
            cairo_svg_surface_restrict_to_version(surface, CAIRO_SVG_VERSION_1_1);
            cairo_svg_surface_set_document_unit(surface, CAIRO_SVG_UNIT_PT);
            break;
        case FileFormat::pdf:
            surface = cairo_pdf_surface_create_for_stream(append, &out, w, h);
            cairo_pdf_surface_set_metadata(surface, CAIRO_PDF_METADATA_CREATOR, "ellipsa");
            if (!title.empty()) cairo_pdf_surface_set_metadata(surface, CAIRO_PDF_METADATA_TITLE, title.c_str());
            // A fixed date keeps the file reproducible: the same input gives the same bytes.
            cairo_pdf_surface_set_metadata(surface, CAIRO_PDF_METADATA_CREATE_DATE, "2000-01-01T00:00:00Z");
            break;
        case FileFormat::png:
            surface = cairo_image_surface_create(CAIRO_FORMAT_RGB24, size.width_px, size.height_px);
            break;
        case FileFormat::csv: return Error{"", 0, 0, "csv is not an image format"};
    }
    if (cairo_surface_status(surface) != CAIRO_STATUS_SUCCESS) {
        Error e = cairo_error("cannot create the drawing surface", cairo_surface_status(surface));
        cairo_surface_destroy(surface);
        return e;
    }
    cairo_t* cr = cairo_create(surface);
    if (format == FileFormat::png) cairo_scale(cr, size.dpi / 72.0, size.dpi / 72.0);
    draw(cr, w, h);
    cairo_status_t st = cairo_status(cr);
    cairo_destroy(cr);
    Result<std::string> png = std::string();
    if (st == CAIRO_STATUS_SUCCESS && format == FileFormat::png) png = surface_png(surface);
    cairo_surface_finish(surface);
    if (st == CAIRO_STATUS_SUCCESS) st = cairo_surface_status(surface);
    cairo_surface_destroy(surface);
    if (st != CAIRO_STATUS_SUCCESS) return cairo_error("drawing failed", st);
    if (format == FileFormat::png) return png;
    if (format == FileFormat::svg) renumber_svg_ids(out);
    return out;
}

namespace {
struct Reader {
    std::string_view data;
    std::size_t pos = 0;
};
cairo_status_t read_chunk(void* closure, unsigned char* data, unsigned int length) {
    Reader* r = static_cast<Reader*>(closure);
    if (r->data.size() - r->pos < length) return CAIRO_STATUS_READ_ERROR;
    std::memcpy(data, r->data.data() + r->pos, length);
    r->pos += length;
    return CAIRO_STATUS_SUCCESS;
}
}  // namespace

Result<RgbImage> decode_png(std::string_view bytes) {
    Reader rd{bytes};
    cairo_surface_t* s = cairo_image_surface_create_from_png_stream(read_chunk, &rd);
    if (cairo_surface_status(s) != CAIRO_STATUS_SUCCESS) {
        Error e = cairo_error("not a readable PNG", cairo_surface_status(s));
        cairo_surface_destroy(s);
        return e;
    }
    cairo_surface_flush(s);
    RgbImage img;
    img.width = cairo_image_surface_get_width(s);
    img.height = cairo_image_surface_get_height(s);
    const int stride = cairo_image_surface_get_stride(s);
    const unsigned char* p = cairo_image_surface_get_data(s);
    img.rgb.resize(std::size_t(img.width) * std::size_t(img.height) * 3);
    for (int y = 0; y < img.height; ++y)
        for (int x = 0; x < img.width; ++x) {
            std::uint32_t v;
            std::memcpy(&v, p + std::size_t(y) * std::size_t(stride) + std::size_t(x) * 4, 4);
            // Native-endian 0xAARRGGBB; premultiplied, but exports are opaque.
            char* o = &img.rgb[(std::size_t(y) * std::size_t(img.width) + std::size_t(x)) * 3];
            o[0] = char((v >> 16) & 0xff);
            o[1] = char((v >> 8) & 0xff);
            o[2] = char(v & 0xff);
        }
    cairo_surface_destroy(s);
    return img;
}

}  // namespace ellipsa::exports

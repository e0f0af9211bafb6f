// PNG writer (png.hpp): signature, IHDR, one IDAT, IEND (PNG specification, ISO/IEC 15948,
// sections 5 and 11); the chunk CRCs and the deflate stream from zlib.
#include "exports/png.hpp"

#include <zlib.h>

#include <cstring>
#include <vector>

namespace ellipsa::exports {

namespace {

void put_u32(std::string& out, std::uint32_t v) {
    const char b[4] = {char(v >> 24), char(v >> 16), char(v >> 8), char(v)};
    out.append(b, 4);
}

// Length, type, data, CRC of type and data.
void put_chunk(std::string& out, const char type[4], const unsigned char* data, std::size_t n) {
    put_u32(out, std::uint32_t(n));
    const std::size_t at = out.size();
    out.append(type, 4);
    if (n) out.append(reinterpret_cast<const char*>(data), n);
    const uLong crc = crc32(0L, reinterpret_cast<const Bytef*>(out.data() + at), uInt(n + 4));
    put_u32(out, std::uint32_t(crc));
}

// The filtered image: per row the filter byte 2 ("Up") and each byte minus the one above it.
std::vector<unsigned char> filter_up(const std::uint8_t* rows, int height, std::size_t row_bytes, std::size_t stride) {
    std::vector<unsigned char> f((row_bytes + 1) * std::size_t(height));
    for (int y = 0; y < height; ++y) {
        unsigned char* d = f.data() + std::size_t(y) * (row_bytes + 1);
        const std::uint8_t* s = rows + std::size_t(y) * stride;
        d[0] = 2;
        if (y == 0) {
            std::memcpy(d + 1, s, row_bytes);
            continue;
        }
        const std::uint8_t* u = s - stride;
        for (std::size_t i = 0; i < row_bytes; ++i) d[1 + i] = static_cast<unsigned char>(s[i] - u[i]);
    }
    return f;
}

}  // namespace

Result<std::string> encode_png(const std::uint8_t* rows, int width, int height, int channels, std::size_t stride) {
    if (width < 1 || height < 1 || width > (1 << 24) || height > (1 << 24) || (channels != 3 && channels != 4))
        return Error{"", 0, 0,
                     "cannot encode a PNG of " + std::to_string(width) + "x" + std::to_string(height) + " pixels with " +
                         std::to_string(channels) + " channels"};
    const std::size_t row_bytes = std::size_t(width) * std::size_t(channels);
    if ((row_bytes + 1) * std::size_t(height) > (std::size_t(1) << 31))
        return Error{"", 0, 0, "cannot encode a PNG of more than 2 GiB of pixels"};
    const std::vector<unsigned char> filtered = filter_up(rows, height, row_bytes, stride);

    z_stream z{};
    if (deflateInit(&z, 1) != Z_OK) return Error{"", 0, 0, "cannot start the PNG compressor (zlib)"};
    std::vector<unsigned char> idat(deflateBound(&z, uLong(filtered.size())));
    z.next_in = const_cast<Bytef*>(filtered.data());
    z.avail_in = uInt(filtered.size());
    z.next_out = idat.data();
    z.avail_out = uInt(idat.size());
    const int st = deflate(&z, Z_FINISH);
    const std::size_t idat_size = z.total_out;
    deflateEnd(&z);
    if (st != Z_STREAM_END) return Error{"", 0, 0, "the PNG compressor (zlib) failed"};

    std::string out("\x89PNG\r\n\x1a\n", 8);
    out.reserve(idat_size + 64);
    unsigned char ihdr[13];
    for (int i = 0; i < 4; ++i) {
        ihdr[i] = static_cast<unsigned char>(std::uint32_t(width) >> (24 - 8 * i));
        ihdr[4 + i] = static_cast<unsigned char>(std::uint32_t(height) >> (24 - 8 * i));
    }
    ihdr[8] = 8;                          // bit depth
    ihdr[9] = channels == 4 ? 6 : 2;      // colour type: RGBA or RGB
    ihdr[10] = ihdr[11] = ihdr[12] = 0;   // deflate, adaptive filtering, no interlace
    put_chunk(out, "IHDR", ihdr, sizeof ihdr);
    put_chunk(out, "IDAT", idat.data(), idat_size);
    put_chunk(out, "IEND", nullptr, 0);
    return out;
}

}  // namespace ellipsa::exports

// The PNG writer (exports/png.hpp) against the PNG specification (ISO/IEC 15948, W3C PNG 2nd ed.):
// the 8-byte signature, the IHDR fields (sec. 11.2.2), chunk CRCs by the
// specification's own bitwise CRC-32 (sec. 5.5, Annex D), and a lossless round trip through an independent decoder (libpng inside Cairo).
#include <catch2/catch.hpp>

#include <cstdint>
#include <string>
#include <vector>

#include "exports/png.hpp"
#include "exports/render.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

namespace {

std::uint32_t be32(const std::string& s, std::size_t at) {
    return std::uint32_t((unsigned char)s[at]) << 24 | std::uint32_t((unsigned char)s[at + 1]) << 16 |
           std::uint32_t((unsigned char)s[at + 2]) << 8 | std::uint32_t((unsigned char)s[at + 3]);
}

// CRC-32 of PNG (ISO 3309 polynomial, reflected 0xEDB88320), bit by bit as in Annex D.
std::uint32_t crc32_png(const char* p, std::size_t n) {
    std::uint32_t c = 0xFFFFFFFFu;
    for (std::size_t i = 0; i < n; ++i) {
        c ^= (unsigned char)p[i];
        for (int k = 0; k < 8; ++k) c = (c & 1) ? 0xEDB88320u ^ (c >> 1) : c >> 1;
    }
    return c ^ 0xFFFFFFFFu;
}

// A test card: gradients, a flat band and noise-like values, rows `stride` bytes apart.
std::vector<std::uint8_t> card(int w, int h, int ch, std::size_t stride) {
    std::vector<std::uint8_t> px(stride * std::size_t(h), 0xEE);  // padding bytes must be ignored
    for (int y = 0; y < h; ++y)
        for (int x = 0; x < w; ++x)
            for (int c = 0; c < ch; ++c) {
                const std::size_t i = std::size_t(y) * stride + std::size_t(x * ch + c);
                px[i] = c == 3 ? 255 : y > h / 2 ? 250 : std::uint8_t((x * 7 + y * 13 + c * 101 + x * y) & 0xFF);
            }
    return px;
}

}  // namespace

TEST_CASE("PNG writer: signature, IHDR and chunk CRCs as the PNG specification lays them out", "[export]") {
    const int w = 37, h = 21;
    const auto px = card(w, h, 3, std::size_t(w) * 3);
    auto png = encode_png(px.data(), w, h, 3, std::size_t(w) * 3);
    REQUIRE(png.ok());
    const std::string& s = *png;
    REQUIRE(s.size() > 8 + 25 + 12 + 12);
    CHECK(s.compare(0, 8, std::string("\x89PNG\r\n\x1a\n", 8)) == 0);  // sec. 5.2
    CHECK(be32(s, 8) == 13);
    CHECK(s.compare(12, 4, "IHDR") == 0);
    CHECK(be32(s, 16) == std::uint32_t(w));
    CHECK(be32(s, 20) == std::uint32_t(h));
    CHECK((unsigned char)s[24] == 8);  // bit depth
    CHECK((unsigned char)s[25] == 2);  // colour type 2: truecolour (RGB)
    // Every chunk's CRC covers its type and data (sec. 5.3); the last chunk is an empty IEND.
    std::size_t at = 8;
    std::string last;
    while (at + 12 <= s.size()) {
        const std::uint32_t n = be32(s, at);
        REQUIRE(at + 12 + n <= s.size());
        CHECK(be32(s, at + 8 + n) == crc32_png(s.data() + at + 4, n + 4));
        last = s.substr(at + 4, 4);
        at += 12 + n;
    }
    CHECK(at == s.size());
    CHECK(last == "IEND");
    // The same pixels give the same bytes.
    CHECK(*encode_png(px.data(), w, h, 3, std::size_t(w) * 3) == s);
}

TEST_CASE("PNG writer: RGB and opaque RGBA decode to the same pixels (padded rows too)", "[export]") {
    const int w = 53, h = 40;
    for (int ch : {3, 4}) {
        const std::size_t stride = std::size_t(w * ch) + 7;
        const auto px = card(w, h, ch, stride);
        auto png = encode_png(px.data(), w, h, ch, stride);
        REQUIRE(png.ok());
        CHECK((unsigned char)(*png)[25] == (ch == 4 ? 6 : 2));
        auto img = decode_png(*png);
        REQUIRE(img.ok());
        REQUIRE(img->width == w);
        REQUIRE(img->height == h);
        std::size_t differ = 0;
        for (int y = 0; y < h; ++y)
            for (int x = 0; x < w; ++x)
                for (int c = 0; c < 3; ++c)
                    differ += (unsigned char)img->rgb[std::size_t((y * w + x) * 3 + c)] != px[std::size_t(y) * stride + std::size_t(x * ch + c)];
        CHECK(differ == 0);
    }
}

TEST_CASE("PNG writer refuses what PNG cannot hold", "[export]") {
    const std::uint8_t px[12] = {};
    CHECK_FALSE(encode_png(px, 0, 1, 3, 3).ok());
    CHECK_FALSE(encode_png(px, 1, 1, 2, 2).ok());
    auto e = encode_png(px, 1, 0, 4, 4);
    REQUIRE_FALSE(e.ok());
    CHECK(e.error().message.find("cannot encode a PNG") != std::string::npos);
}

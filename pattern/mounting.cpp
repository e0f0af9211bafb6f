#include "pattern/mounting.hpp"

#include <charconv>
#include <algorithm>
#include <cmath>

namespace ellipsa {

namespace {

// cos and sin of an angle in degrees, exact (0, +-1) at multiples of 90 deg.
void cos_sin_deg(double angle_deg, double& c, double& s) {
    const double q = angle_deg / 90.0;
    if (q == std::round(q) && std::abs(q) < 1e15) {
        const long long k = ((static_cast<long long>(q) % 4) + 4) % 4;
        const double cs[4] = {1, 0, -1, 0};
        c = cs[k];
        s = cs[(k + 3) % 4];
        return;
    }
    c = std::cos(angle_deg * deg);
    s = std::sin(angle_deg * deg);
}

std::string_view trim(std::string_view t) {
    while (!t.empty() && (t.front() == ' ' || t.front() == '\t')) t.remove_prefix(1);
    while (!t.empty() && (t.back() == ' ' || t.back() == '\t')) t.remove_suffix(1);
    return t;
}

// A whole cell as a finite number, or nothing.
std::optional<double> number(std::string_view t) {
    t = trim(t);
    if (!t.empty() && t.front() == '+') t.remove_prefix(1);
    double v = 0;
    auto [end, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
    if (t.empty() || ec != std::errc() || end != t.data() + t.size() || !std::isfinite(v)) return std::nullopt;
    return v;
}

// Appended piece by piece: `"\"" + std::string(t)` makes g++ 12 -O3 warn -Wrestrict (GCC bug 105329).
std::string quoted(std::string_view t) { return std::string("\"").append(t).append("\""); }

std::string number_text(double v) {
    if (v == 0) v = 0;  // no "-0"
    char buf[32];
    auto r = std::to_chars(buf, buf + sizeof buf, v);
    return std::string(buf, r.ptr);
}

std::optional<Axis> axis_letter(std::string_view t) {
    if (t == "x" || t == "X") return Axis::x;
    if (t == "y" || t == "Y") return Axis::y;
    if (t == "z" || t == "Z") return Axis::z;
    return std::nullopt;
}

}  // namespace

Result<Vec3> parse_up(std::string_view text) {
    const std::string_view t = trim(text);
    const std::string expected = "expected an axis (+x, -x, +y, -y, +z, -z) or a direction THETA,PHI in degrees, found ";
    if (const std::size_t comma = t.find(','); comma != std::string_view::npos) {
        const auto th = number(t.substr(0, comma)), ph = number(t.substr(comma + 1));
        if (!th || !ph) return Error{"", 0, 0, expected + quoted(text)};
        if (*th < 0 || *th > 180)
            return Error{"", 0, 0, "expected theta from 0 to 180 deg in the up direction, found " + quoted(text)};
        return direction_deg(*th, *ph);
    }
    std::string_view a = t;
    double sign = 1;
    if (!a.empty() && (a.front() == '+' || a.front() == '-')) {
        sign = a.front() == '-' ? -1 : 1;
        a.remove_prefix(1);
    }
    const auto axis = axis_letter(a);
    if (!axis) return Error{"", 0, 0, expected + quoted(text)};
    Vec3 v{};
    (*axis == Axis::x ? v.x : *axis == Axis::y ? v.y : v.z) = sign;
    return v;
}

Result<std::vector<AxisTurn>> parse_turns(std::string_view text) {
    std::vector<AxisTurn> out;
    if (trim(text).empty()) return out;
    std::size_t pos = 0;
    while (true) {
        const std::size_t comma = text.find(',', pos);
        const std::string_view item = trim(text.substr(pos, comma == std::string_view::npos ? std::string_view::npos : comma - pos));
        const std::size_t colon = item.find(':');
        const auto axis = colon == std::string_view::npos ? std::nullopt : axis_letter(trim(item.substr(0, colon)));
        const auto angle = colon == std::string_view::npos ? std::nullopt : number(item.substr(colon + 1));
        if (!axis || !angle)
            return Error{"", 0, 0, "expected turns AXIS:DEG separated by commas (AXIS x, y or z; for example z:30,x:10), found " +
                                       quoted(item) + (item == trim(text) ? "" : " in " + quoted(text))};
        out.push_back({*axis, *angle});
        if (comma == std::string_view::npos) break;
        pos = comma + 1;
    }
    return out;
}

std::string format_up(Vec3 up) {
    const Vec3 u = normalized(up);
    const double c[3] = {u.x, u.y, u.z};
    for (int i = 0; i < 3; ++i)
        if (std::abs(c[i]) == 1) return std::string(c[i] > 0 ? "+" : "-") + "xyz"[i];
    const double theta = std::acos(std::clamp(u.z, -1.0, 1.0)) / deg;
    const double phi = wrap360(std::atan2(u.y, u.x) / deg);
    // Rounded to 1e-9 deg, so "60,30" reads back as written despite the round trip's last bits.
    auto r = [](double a) { return number_text(std::round(a * 1e9) / 1e9); };
    return r(theta) + "," + r(phi == 360 ? 0 : phi);
}

std::string format_turns(const std::vector<AxisTurn>& turns) {
    std::string s;
    for (const AxisTurn& t : turns) {
        if (!s.empty()) s += ',';
        s.append(to_string(t.axis)).append(":").append(number_text(t.angle_deg));
    }
    return s;
}

const char* to_string(Axis a) {
    switch (a) {
        case Axis::x: return "x";
        case Axis::y: return "y";
        case Axis::z: return "z";
    }
    return "z";
}

Vec3 direction_deg(double theta_deg, double phi_deg) {
    double ct, st, cp, sp;
    cos_sin_deg(theta_deg, ct, st);
    cos_sin_deg(phi_deg, cp, sp);
    return {st * cp, st * sp, ct};
}

Mat3 axis_rotation_deg(Axis a, double angle_deg) {
    double c, s;
    cos_sin_deg(angle_deg, c, s);
    Mat3 r;
    switch (a) {
        case Axis::x: r.m[1][1] = c, r.m[1][2] = -s, r.m[2][1] = s, r.m[2][2] = c; break;
        case Axis::y: r.m[0][0] = c, r.m[0][2] = s, r.m[2][0] = -s, r.m[2][2] = c; break;
        case Axis::z: r.m[0][0] = c, r.m[0][1] = -s, r.m[1][0] = s, r.m[1][1] = c; break;
    }
    return r;
}

Mat3 up_rotation(Vec3 up) {
    const Vec3 a = normalized(up);
    const Vec3 z{0, 0, 1};
    const double c = dot(a, z);
    const Vec3 axis = cross(a, z);  // |axis| = sin of the angle
    const double s = norm(axis);
    Mat3 r;
    if (s == 0) {
        if (c < 0) r = axis_rotation_deg(Axis::x, 180);
        return r;
    }
    // Rodrigues from cos and sin directly (no angle round trip): R = c I + s [k]x + (1 - c) k k^T.
    const Vec3 k = (1.0 / s) * axis;
    const double kk[3] = {k.x, k.y, k.z};
    const double kx[3][3] = {{0, -k.z, k.y}, {k.z, 0, -k.x}, {-k.y, k.x, 0}};
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) r.m[i][j] = (i == j ? c : 0.0) + s * kx[i][j] + (1 - c) * kk[i] * kk[j];
    return r;
}

Mat3 mounting_matrix(const Mounting& m) {
    Mat3 r = up_rotation(m.up);
    for (const AxisTurn& t : m.turns) r = axis_rotation_deg(t.axis, t.angle_deg) * r;
    return r;
}

bool is_identity(const Mat3& r) {
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            if (std::abs(r.m[i][j] - (i == j ? 1.0 : 0.0)) > 1e-12) return false;
    return true;
}

bool is_identity(const Mounting& m) { return is_identity(mounting_matrix(m)); }

Mounting resolve_mounting(const Mounting& from_file, const std::optional<Vec3>& up,
                          const std::vector<AxisTurn>& turns) {
    Mounting m = from_file;
    if (up) m = Mounting{*up, {}};
    m.turns.insert(m.turns.end(), turns.begin(), turns.end());
    return m;
}

}  // namespace ellipsa

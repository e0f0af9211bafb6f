// Report folder: the files it holds, self-contained HTML, the same figures in HTML and Markdown,
// handbook figures in the table, and folder publishing that never leaves a half-written folder.
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <regex>
#include <set>
#include <string>

#include "io/atomic_folder.hpp"
#include "exports/report.hpp"
#include "io/atomic_write.hpp"
#include "pattern/environment.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;
namespace fs = std::filesystem;

namespace {

ReportInput reference_input(ReferenceKind kind, const std::string& name, double rx_deg = 0) {
    ReferenceAntenna a;
    a.kind = kind;
    a.length_wl = 0.5;
    a.orientation = rotation_xyz_deg(rx_deg, 0, 0);
    ReportInput in;
    in.set = synthesize(a, 2.0, 2.45e9);
    in.set.name = name;
    in.path = name + ".csv";
    return in;
}

const ReportFile* find(const std::vector<ReportFile>& fs, const std::string& name) {
    for (const ReportFile& f : fs)
        if (f.name == name) return &f;
    return nullptr;
}

std::string read_file(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    return std::string((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
}

std::size_t count_of(const std::string& hay, const std::string& needle) {
    std::size_t n = 0;
    for (std::size_t p = hay.find(needle); p != std::string::npos; p = hay.find(needle, p + 1)) ++n;
    return n;
}

fs::path scratch(const std::string& name) {
    fs::path p = fs::temp_directory_path() / ("ellipsa-test-" + name + "-" + std::to_string(::getpid()));
    fs::remove_all(p);
    fs::create_directories(p);
    return p;
}

}  // namespace

TEST_CASE("report: files, self-contained HTML, same figures in HTML and Markdown", "[export][report]") {
    std::vector<ReportInput> in{reference_input(ReferenceKind::dipole, "Half-wave dipole"),
                                reference_input(ReferenceKind::crossed_dipoles, "Turnstile tilted", 40)};
    ReportOptions o;
    o.size = RenderSize{400, 300, 50};  // small figures keep the test quick
    o.environment = *environment_preset("uniform");
    auto files = build_report(in, o);
    REQUIRE(files.ok());
    const ReportFile* html = find(*files, "index.html");
    const ReportFile* md = find(*files, "report.md");
    REQUIRE(html);
    REQUIRE(md);
    std::set<std::string> names;
    for (const ReportFile& f : *files) names.insert(f.name);
    for (const char* cut : {"phi0", "phi90", "theta90"})
        for (const char* ext : {"svg", "png", "csv"}) {
            CHECK(names.count(std::string("p1-half-wave-dipole-2450MHz-") + cut + "." + ext) == 1);
            CHECK(names.count(std::string("p2-turnstile-tilted-2450MHz-") + cut + "." + ext) == 1);
        }
    // Tilted 40 deg about x, the turnstile's peak leaves the principal planes' phi = 0/90 only
    // through phi = 270 (the yz-plane), so no extra peak cut; the dipole's peak is in phi = 0.
    CHECK(names.count("compare-phi0.svg") == 1);
    CHECK(names.count("compare-theta90.png") == 1);

    // Self-contained: no URL schemes, and every image or link points at a file of the report.
    CHECK(html->bytes.find("<h1>Antenna pattern report</h1>") != std::string::npos);
    CHECK(md->bytes.rfind("# Antenna pattern report\n", 0) == 0);
    CHECK(html->bytes.find("http") == std::string::npos);
    CHECK(html->bytes.find("<script") == std::string::npos);
    std::regex ref(R"re((?:src|href)="([^"]+)")re");
    int refs = 0;
    for (auto it = std::sregex_iterator(html->bytes.begin(), html->bytes.end(), ref); it != std::sregex_iterator(); ++it) {
        ++refs;
        CHECK(names.count((*it)[1]) == 1);
    }
    CHECK(refs >= 2 * 3 * 3);
    std::regex mdref(R"(\]\(([^)]+)\))");
    for (auto it = std::sregex_iterator(md->bytes.begin(), md->bytes.end(), mdref); it != std::sregex_iterator(); ++it)
        CHECK(names.count((*it)[1]) == 1);

    // Figures from the handbook in both documents: half-wave dipole 2.15 dBi, HPBW 78 deg
    // (Balanis sec. 4.6); short-dipole pair D = 1.5 (1.76 dBi, Balanis sec. 4.2); turnstile
    // circular at its peak: AR 0 dB, right-hand with a -90 deg y current (conventions.md).
    for (const std::string* doc : {&html->bytes, &md->bytes}) {
        CHECK((doc->find("| 2.15 |") != std::string::npos || doc->find(">2.15<") != std::string::npos));
        CHECK(doc->find("78.0") != std::string::npos);
        CHECK(doc->find("1.76") != std::string::npos);
        CHECK(doc->find("right-hand, axial ratio 0.00 dB") != std::string::npos);
        CHECK(doc->find("Comparison") != std::string::npos);
        // Uniform environment, XPR 0 dB: MEG = efficiency / 2 = -3.01 dB for a lossless antenna
        // (Taga 1990; conventions.md), for both antennas.
        CHECK(doc->find("MEG, uniform environment (dB)") != std::string::npos);
        CHECK(count_of(*doc, "-3.01") >= 2);
        // Link reliability: the fading curves, the ranking against the reference dipole and the
        // cautions beside them. The half-wave dipole is the reference itself: advantage 0.00 dB.
        CHECK(doc->find("Link reliability") != std::string::npos);
        CHECK(doc->find("Ranking") != std::string::npos);
        CHECK(doc->find("lossless vertical half-wave dipole") != std::string::npos);
        CHECK(doc->find("not a survey of your site") != std::string::npos);
        CHECK(doc->find("local regulations") != std::string::npos);
    }
    CHECK(names.count("link-fading.svg") == 1);
    CHECK(names.count("link-fading.png") == 1);
    CHECK(names.count("link-fading.csv") == 1);
    // Both lossless, both at -3.01 dBi in the isotropic environment: the ranking's scores are 0.
    INFO(md->bytes.substr(md->bytes.find("| Rank |"), 400));
    CHECK(md->bytes.find("| A. Half-wave dipole | Half-wave dipole.csv | 2.45 GHz | 0.00 |") != std::string::npos);
    CHECK(md->bytes.find("| B. Turnstile tilted | Turnstile tilted.csv | 2.45 GHz | 0.00 |") != std::string::npos);
}

TEST_CASE("report: the curves chosen follow the polarisation at the peak", "[export][report]") {
    const ReportInput d = reference_input(ReferenceKind::dipole, "d");
    const ReportInput t = reference_input(ReferenceKind::crossed_dipoles, "t");
    const std::vector<Component> lin{Component::total, Component::theta, Component::phi};
    const std::vector<Component> circ{Component::total, Component::rhcp, Component::lhcp};
    CHECK((report_components(d.set, summarize(d.set, 0)) == lin));
    CHECK((report_components(t.set, summarize(t.set, 0)) == circ));
    FarFieldSet tot = d.set;
    tot.content = FieldContent::total_only;
    CHECK((report_components(tot, summarize(tot, 0)) == std::vector<Component>{Component::total}));
}

TEST_CASE("report: a missing frequency is refused with the list of what the file holds", "[export][report]") {
    std::vector<ReportInput> in{reference_input(ReferenceKind::dipole, "d")};
    ReportOptions o;
    o.frequency_hz = 5e9;
    auto r = build_report(in, o);
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().message.find("5 GHz") != std::string::npos);
    CHECK(r.error().message.find("2.45 GHz") != std::string::npos);
}

TEST_CASE("publish_folder: new, refused, replaced, failed fill, file in the way", "[export][report]") {
    const fs::path root = scratch("folder");
    const std::string target = (root / "out").string();
    auto writer = [](const std::string& text) {
        return [text](const std::string& dir) { return io::write_file_atomically(dir + "/a.txt", text); };
    };
    REQUIRE(io::publish_folder(target, writer("one"), false).ok());
    CHECK(read_file(root / "out" / "a.txt") == "one");

    auto refused = io::publish_folder(target, writer("two"), false);
    REQUIRE_FALSE(refused.ok());
    CHECK(refused.error().message.find("--force") != std::string::npos);
    CHECK(read_file(root / "out" / "a.txt") == "one");

    REQUIRE(io::publish_folder(target, writer("three"), true).ok());
    CHECK(read_file(root / "out" / "a.txt") == "three");

    // A fill that fails half-way leaves the old folder as it was and no temporary folder.
    auto failed = io::publish_folder(
        target,
        [](const std::string& dir) -> Status {
            (void)io::write_file_atomically(dir + "/a.txt", "partial");
            return Error{"", 0, 0, "simulated failure"};
        },
        true);
    REQUIRE_FALSE(failed.ok());
    CHECK(read_file(root / "out" / "a.txt") == "three");
    std::size_t entries = 0;
    for (auto& e : fs::directory_iterator(root)) {
        (void)e;
        ++entries;
    }
    CHECK(entries == 1);  // only out/: no .tmp- or .old- folders left

    // A regular file where the folder (or its parent) should be.
    std::ofstream(root / "plain") << "keep";
    CHECK_FALSE(io::publish_folder((root / "plain").string(), writer("x"), true).ok());
    auto under = io::publish_folder((root / "plain" / "sub").string(), writer("x"), true);
    REQUIRE_FALSE(under.ok());
    CHECK(under.error().message.find("is not a folder") != std::string::npos);  // names the file in the way
    CHECK(read_file(root / "plain") == "keep");
    fs::remove_all(root);
}

TEST_CASE("report: 3D snapshots come in through the callback, failures become a note", "[export][report]") {
    std::vector<ReportInput> in{reference_input(ReferenceKind::dipole, "d")};
    ReportOptions o;
    o.size = RenderSize{320, 240, 40};
    int calls = 0;
    o.snapshot = [&](const FarFieldSet&, std::size_t fi) -> Result<std::string> {
        ++calls;
        CHECK(fi == 0);
        return std::string("\x89PNG fake");
    };
    auto ok = build_report(in, o);
    REQUIRE(ok.ok());
    CHECK(calls == 1);
    const ReportFile* snap = find(*ok, "p1-d-2450MHz-3d.png");
    REQUIRE(snap);
    CHECK(snap->bytes == "\x89PNG fake");
    CHECK(find(*ok, "index.html")->bytes.find("p1-d-2450MHz-3d.png") != std::string::npos);
    CHECK(find(*ok, "report.md")->bytes.find("p1-d-2450MHz-3d.png") != std::string::npos);

    // The axial-ratio view is asked for only when the data have phase.
    int ar_calls = 0;
    o.polarisation_snapshot = [&](const FarFieldSet&, std::size_t) -> Result<std::string> {
        ++ar_calls;
        return std::string("\x89PNG ar");
    };
    auto with_ar = build_report(in, o);
    REQUIRE(with_ar.ok());
    CHECK(ar_calls == 1);
    CHECK(find(*with_ar, "p1-d-2450MHz-3d-axial-ratio.png"));
    std::vector<ReportInput> mag = in;
    mag[0].set.content = FieldContent::magnitude_only;
    REQUIRE(build_report(mag, o).ok());
    CHECK(ar_calls == 1);
    o.polarisation_snapshot = nullptr;

    o.snapshot = [](const FarFieldSet&, std::size_t) -> Result<std::string> { return Error{"", 0, 0, "no EGL display"}; };
    auto noted = build_report(in, o);
    REQUIRE(noted.ok());
    CHECK_FALSE(find(*noted, "p1-d-2450MHz-3d.png"));
    CHECK(find(*noted, "report.md")->bytes.find("3D view unavailable: no EGL display") != std::string::npos);
}

// A beam at the zenith (issue 17): the figures table names the beam planes phi = 0 and phi = 90
// through exports::beam_plane_text, never "elevation plane" (both are elevation planes there and
// the peak's phi means nothing); a beam off the poles keeps the elevation and azimuth planes.
// Quadrature crossed dipoles in the xy-plane peak on the z axis (Balanis sec. 4.7, turnstile:
// common practice); a half-wave dipole along z peaks on the horizon.
TEST_CASE("report: beam planes of a zenith beam are named by their phi", "[report][pole]") {
    ReportOptions o;
    o.size = RenderSize{320, 240, 40};
    o.environment = *environment_preset("uniform");
    auto zen = build_report({reference_input(ReferenceKind::crossed_dipoles, "turnstile")}, o);
    REQUIRE(zen.ok());
    for (const char* name : {"report.md", "index.html"}) {
        INFO(name);
        const std::string& b = find(*zen, name)->bytes;
        CHECK(b.find("HPBW, plane \u03c6 = 0\u00b0 through the peak") != std::string::npos);
        CHECK(b.find("HPBW, plane \u03c6 = 90\u00b0 through the peak") != std::string::npos);
        CHECK(b.find("Side lobe, plane \u03c6 = 0\u00b0 (dB)") != std::string::npos);
        CHECK(b.find("elevation plane") == std::string::npos);
        CHECK(b.find("azimuth plane") == std::string::npos);
    }
    auto dip = build_report({reference_input(ReferenceKind::dipole, "dipole")}, o);
    REQUIRE(dip.ok());
    const std::string& md = find(*dip, "report.md")->bytes;
    CHECK(md.find("HPBW, elevation plane through the peak") != std::string::npos);
    CHECK(md.find("HPBW, azimuth plane through the peak") != std::string::npos);
    CHECK(md.find("Side lobe, elevation plane (dB)") != std::string::npos);
    CHECK(md.find("plane \u03c6 = 0\u00b0 through") == std::string::npos);
}

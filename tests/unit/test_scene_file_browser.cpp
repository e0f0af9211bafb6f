// The file browser's pure part (viewer/scene/file_browser.hpp): listing order, the filter for
// pattern files, hidden entries, unreadable and missing folders, a folder of 100k files, the
// type-to-filter match, parent folders, recent folders and the check of a desktop dialog's answer.
// Common practice (no published source): what a file chooser is expected to do.
#include <catch2/catch.hpp>

#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <string>

#include "viewer/scene/file_browser.hpp"

using namespace ellipsa::viewer;
namespace fs = std::filesystem;

namespace {
struct TempFolder {
    fs::path root;
    TempFolder() {
        char t[] = "/tmp/ellipsa-browse-XXXXXX";
        root = ::mkdtemp(t);
    }
    ~TempFolder() {
        std::error_code ec;
        fs::permissions(root / "locked", fs::perms::owner_all, ec);
        fs::remove_all(root, ec);
    }
    void file(const std::string& name) const { std::ofstream(root / name) << "x"; }
};

std::vector<std::string> names(const FolderListing& l) {
    std::vector<std::string> out;
    for (const FolderEntry& e : l.entries) out.push_back(e.name + (e.folder ? "/" : ""));
    return out;
}
}  // namespace

TEST_CASE("a folder lists folders first, then pattern files, each by name ignoring case", "[scene][browser]") {
    TempFolder t;
    for (const char* f : {"b.csv", "A.CSV", "range.map", "notes.txt", ".hidden.csv", "c.Csv"}) t.file(f);
    fs::create_directory(t.root / "zeta");
    fs::create_directory(t.root / "Alpha");
    fs::create_directory(t.root / ".cache");
    const FolderListing l = list_folder(t.root.string(), BrowseFilter::patterns, false);
    CHECK(l.error.empty());
    CHECK(l.folder == t.root.string());
    CHECK(names(l) == std::vector<std::string>{"Alpha/", "zeta/", "A.CSV", "b.csv", "c.Csv", "range.map"});
    CHECK(l.scanned == 9);
    CHECK_FALSE(l.truncated);
    const FolderListing all = list_folder(t.root.string() + "/", BrowseFilter::all_files, true);
    CHECK(all.folder == t.root.string());  // the trailing slash goes
    CHECK(names(all) == std::vector<std::string>{".cache/", "Alpha/", "zeta/", ".hidden.csv", "A.CSV", "b.csv", "c.Csv", "notes.txt", "range.map"});
}

TEST_CASE("a missing or unreadable folder gives a message, not a crash", "[scene][browser]") {
    TempFolder t;
    const FolderListing missing = list_folder((t.root / "nowhere").string(), BrowseFilter::patterns, false);
    CHECK(missing.entries.empty());
    CHECK(missing.error.find("cannot read " + (t.root / "nowhere").string()) == 0);
    t.file("plain.csv");
    const FolderListing file = list_folder((t.root / "plain.csv").string(), BrowseFilter::patterns, false);
    CHECK_FALSE(file.error.empty());
    fs::create_directory(t.root / "locked");
    fs::permissions(t.root / "locked", fs::perms::none);
    const FolderListing locked = list_folder((t.root / "locked").string(), BrowseFilter::patterns, false);
    if (::geteuid() != 0) CHECK_FALSE(locked.error.empty());  // root reads any folder
    CHECK(locked.entries.empty());
}

TEST_CASE("a folder of 100k files is listed within the scan bound", "[scene][browser]") {
    TempFolder t;
    for (int i = 0; i < 100000; ++i) std::ofstream(t.root / std::string("f").append(std::to_string(i)).append(i % 2 ? ".csv" : ".dat"));
    const FolderListing l = list_folder(t.root.string(), BrowseFilter::patterns, false);
    CHECK(l.scanned == 100000);
    CHECK(l.entries.size() == 50000);
    CHECK_FALSE(l.truncated);
    const FolderListing bounded = list_folder(t.root.string(), BrowseFilter::all_files, false, 1000);
    CHECK(bounded.truncated);
    CHECK(bounded.scanned == 1000);
    CHECK(bounded.entries.size() == 1000);
}

TEST_CASE("typing filters by name, prefix matches first", "[scene][browser]") {
    FolderListing l;
    for (const char* n : {"dipole.csv", "measured-loop.csv", "Loop.csv", "turnstile.csv"}) l.entries.push_back({n, false});
    const std::vector<std::size_t> m = matching_entries(l, "LOOP");
    REQUIRE(m.size() == 2);
    CHECK(l.entries[m[0]].name == "Loop.csv");
    CHECK(l.entries[m[1]].name == "measured-loop.csv");
    CHECK(matching_entries(l, "").size() == 4);
    CHECK(matching_entries(l, "xyz").empty());
}

TEST_CASE("parent folders, joined paths and recent folders", "[scene][browser]") {
    CHECK(parent_folder("/home/user/data") == "/home/user");
    CHECK(parent_folder("/home/user/data/") == "/home/user");
    CHECK(parent_folder("/home") == "/");
    CHECK(parent_folder("/") == "/");
    CHECK(join_path("/", "a.csv") == "/a.csv");
    CHECK(join_path("/data", "a.csv") == "/data/a.csv");
    const std::vector<std::string> r = recent_folders({"/data/a.csv", "/data/b.csv", "/range/m.csv", "/x/y.csv"}, 2);
    CHECK(r == std::vector<std::string>{"/data", "/range"});
    // A joined pattern's entry counts its first file's folder, not a folder inside the option.
    CHECK(recent_folders({"/range/co.csv::join=/other/cross.csv"}, 2) == std::vector<std::string>{"/range"});
}

TEST_CASE("a desktop dialog's answer is one absolute path to a regular file", "[scene][browser]") {
    TempFolder t;
    t.file("a.csv");
    const std::string a = (t.root / "a.csv").string();
    CHECK(chosen_path(a + "\n") == a);
    CHECK(chosen_path(a) == a);
    CHECK_FALSE(chosen_path(""));                       // cancelled
    CHECK_FALSE(chosen_path("a.csv\n"));                // relative
    CHECK_FALSE(chosen_path(t.root.string() + "\n"));   // a folder
    CHECK_FALSE(chosen_path(a + "\n" + a + "\n"));      // several lines
    CHECK_FALSE(chosen_path(a + std::string(1, '\0')));  // a NUL byte
    CHECK_FALSE(chosen_path((t.root / "gone.csv").string()));
}

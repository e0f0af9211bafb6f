// Write semantics of io/ (atomic_write.hpp, atomic_folder.hpp): nothing the user had is lost or
// replaced without --force, the umask is honoured and a replaced file keeps its mode, the refusal
// to replace cannot be raced, and --force replaces only a folder ellipsa made. (Expected
// behaviour: POSIX open(2)/mkdir(2) apply the umask to the mode asked for, common practice for
// tools that write files; rename(2), renameat2(2) RENAME_NOREPLACE and link(2) man pages.)
#include <catch2/catch.hpp>

#include <atomic>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <sys/stat.h>
#include <thread>
#include <unistd.h>

#include "io/atomic_folder.hpp"
#include "io/atomic_write.hpp"

using namespace ellipsa;
namespace fs = std::filesystem;
using Catch::Matchers::Contains;

namespace {

fs::path scratch(const char* name) {
    const fs::path p = fs::path("ellipsa_io_test") / name;
    fs::remove_all(p);
    fs::create_directories(p);
    return p;
}

std::string read_file(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::stringstream ss;
    ss << in.rdbuf();
    return ss.str();
}

unsigned mode_of(const fs::path& p) {
    struct stat st {};
    REQUIRE(::lstat(p.c_str(), &st) == 0);
    return unsigned(st.st_mode & 07777);
}

// Sets a umask for the scope of a test and puts the old one back.
struct Umask {
    mode_t old;
    explicit Umask(mode_t m) : old(::umask(m)) {}
    ~Umask() { ::umask(old); }
};

Status write_a(const std::string& dir, const std::string& text) {
    return io::write_file_atomically(dir + "/a.txt", text, false);
}

}  // namespace

TEST_CASE("new files and folders get the permissions the umask leaves", "[io]") {
    const fs::path root = scratch("umask");
    Umask u(077);
    REQUIRE(io::write_file_atomically((root / "f.txt").string(), "x", false).ok());
    CHECK(mode_of(root / "f.txt") == 0600u);  // was 0644 whatever the umask
    REQUIRE(io::publish_folder((root / "d").string(), [](const std::string& d) { return write_a(d, "x"); }, false).ok());
    CHECK(mode_of(root / "d") == 0700u);  // was 0755
    CHECK(mode_of(root / "d" / "a.txt") == 0600u);
    Umask v(022);
    REQUIRE(io::write_file_atomically((root / "g.txt").string(), "x", false).ok());
    CHECK(mode_of(root / "g.txt") == 0644u);
    fs::remove_all(root);
}

TEST_CASE("a replaced file keeps its mode", "[io]") {
    const fs::path root = scratch("mode");
    const std::string f = (root / "secret.txt").string();
    REQUIRE(io::write_file_atomically(f, "one", false).ok());
    REQUIRE(::chmod(f.c_str(), 0600) == 0);
    REQUIRE(io::write_file_atomically(f, "two", true).ok());
    CHECK(read_file(f) == "two");
    CHECK(mode_of(f) == 0600u);  // --force once widened it to 0644
    REQUIRE(::chmod(f.c_str(), 0640) == 0);
    REQUIRE(io::write_file_atomically(f, "three", true).ok());
    CHECK(mode_of(f) == 0640u);
    fs::remove_all(root);
}

TEST_CASE("without overwrite, anything at the target is kept, even a dangling link", "[io]") {
    const fs::path root = scratch("link");
    const fs::path link = root / "out.csv";
    fs::create_symlink("nowhere/at/all.csv", link);
    auto st = io::write_file_atomically(link.string(), "new", false);
    REQUIRE_FALSE(st.ok());
    CHECK_THAT(st.error().message, Contains("already exists"));
    CHECK(fs::is_symlink(link));
    CHECK(fs::read_symlink(link) == fs::path("nowhere/at/all.csv"));
    auto folder = io::publish_folder(link.string(), [](const std::string& d) { return write_a(d, "x"); }, false);
    CHECK_FALSE(folder.ok());
    CHECK(fs::is_symlink(link));
    std::size_t entries = 0;
    for (auto& e : fs::directory_iterator(root)) {
        (void)e;
        ++entries;
    }
    CHECK(entries == 1);  // no temporary file or folder left behind
    fs::remove_all(root);
}

TEST_CASE("two writers racing for one new name: exactly one succeeds", "[io]") {
    // The old check-then-rename let both pass the check and both rename: the second silently
    // replaced the first's file. A write takes an fsync, so the window was wide.
    const fs::path root = scratch("race");
    int both = 0, none = 0;
    for (int round = 0; round < 40; ++round) {
        const std::string target = (root / "f").string() + std::to_string(round);
        std::atomic<int> ready{0};
        bool ok[2] = {false, false};
        auto run = [&](int k) {
            ++ready;
            while (ready < 2) std::this_thread::yield();
            ok[k] = io::write_file_atomically(target, "writer " + std::to_string(k), false).ok();
        };
        std::thread t(run, 1);
        run(0);
        t.join();
        both += ok[0] && ok[1];
        none += !ok[0] && !ok[1];
        if (ok[0] != ok[1]) CHECK(read_file(target) == (ok[0] ? "writer 0" : "writer 1"));
    }
    CHECK(both == 0);
    CHECK(none == 0);
    fs::remove_all(root);
}

TEST_CASE("with overwrite, only a folder ellipsa made is replaced, never one holding the inputs", "[io]") {
    const fs::path root = scratch("marker");
    // A user's folder that merely holds an index.html and report.md, their notes and a .git.
    const fs::path mine = root / "site";
    fs::create_directories(mine / ".git");
    std::ofstream(mine / "index.html") << "my page";
    std::ofstream(mine / "report.md") << "my report";
    std::ofstream(mine / "notes.txt") << "my notes";
    auto st = io::publish_folder(mine.string(), [](const std::string& d) { return write_a(d, "x"); }, true);
    REQUIRE_FALSE(st.ok());
    CHECK_THAT(st.error().message, Contains("not made by ellipsa") && Contains("even with --force"));
    CHECK(read_file(mine / "notes.txt") == "my notes");
    CHECK(fs::is_directory(mine / ".git"));

    // A folder ellipsa made is replaced, and says so with its marker.
    const fs::path made = root / "rep";
    REQUIRE(io::publish_folder(made.string(), [](const std::string& d) { return write_a(d, "one"); }, false).ok());
    CHECK(fs::is_regular_file(made / io::folder_marker));
    REQUIRE(io::publish_folder(made.string(), [](const std::string& d) { return write_a(d, "two"); }, true).ok());
    CHECK(read_file(made / "a.txt") == "two");

    // ... but not while it holds a file the new content is made from.
    std::ofstream(made / "input.csv") << "theta,phi,e_total_db\n";
    const std::string input = (root / "." / "rep" / "input.csv").string();
    st = io::publish_folder(made.string(), [](const std::string& d) { return write_a(d, "three"); }, true, {input});
    REQUIRE_FALSE(st.ok());
    CHECK_THAT(st.error().message, Contains("an input of this run"));
    CHECK(read_file(made / "a.txt") == "two");
    CHECK(fs::exists(made / "input.csv"));
    fs::remove_all(root);
}

TEST_CASE("a folder, a device or a FIFO at the path is refused up front, even with overwrite", "[io]") {
    const fs::path root = scratch("kinds");
    fs::create_directories(root / "dir.csv");
    REQUIRE(::mkfifo((root / "pipe.csv").c_str(), 0644) == 0);
    for (bool overwrite : {false, true}) {
        auto dir = io::write_file_atomically((root / "dir.csv").string(), "x", overwrite);
        REQUIRE_FALSE(dir.ok());
        CHECK_THAT(dir.error().message, Contains("is a folder"));
        auto pipe = io::write_file_atomically((root / "pipe.csv").string(), "x", overwrite);
        REQUIRE_FALSE(pipe.ok());  // never opened: opening a FIFO for writing would wait for a reader
        CHECK_THAT(pipe.error().message, Contains("FIFO"));
        // /dev/null: a rename over it would remove the node, a write through it is not atomic.
        auto dev = io::write_file_atomically("/dev/null", "x", overwrite);
        REQUIRE_FALSE(dev.ok());
        CHECK_THAT(dev.error().message, Contains("character device"));
        CHECK(io::check_destination("/dev/null", overwrite).error().message == dev.error().message);
    }
    CHECK(fs::is_directory(root / "dir.csv"));
    CHECK(fs::is_fifo(root / "pipe.csv"));
    CHECK(fs::is_character_file("/dev/null"));
    fs::remove_all(root);
}

TEST_CASE("a missing folder or a file in the path: the message names the folder", "[io]") {
    const fs::path root = scratch("parent");
    auto missing = io::write_file_atomically((root / "no" / "a.csv").string(), "x", true);
    REQUIRE_FALSE(missing.ok());
    CHECK(missing.error().file == (root / "no" / "a.csv").string());
    CHECK_THAT(missing.error().message, Contains("the folder " + (root / "no").string() + " does not exist"));
    std::ofstream(root / "f") << "keep";
    auto through_file = io::write_file_atomically((root / "f" / "a.csv").string(), "x", true);
    REQUIRE_FALSE(through_file.ok());
    CHECK_THAT(through_file.error().message, Contains("is not a folder"));
    CHECK(read_file(root / "f") == "keep");
    CHECK_FALSE(io::write_file_atomically("", "x", true).ok());
    CHECK_FALSE(io::write_file_atomically((root / "end/").string(), "x", true).ok());
    CHECK_FALSE(fs::exists(root / "no"));
    fs::remove_all(root);
}

TEST_CASE("with overwrite a link is replaced, never followed", "[io]") {
    const fs::path root = scratch("follow");
    std::ofstream(root / "target.csv") << "theirs";
    fs::create_symlink("target.csv", root / "out.csv");
    fs::create_symlink("nowhere.csv", root / "dangling.csv");
    REQUIRE(io::write_file_atomically((root / "out.csv").string(), "new", true).ok());
    REQUIRE(io::write_file_atomically((root / "dangling.csv").string(), "new", true).ok());
    CHECK_FALSE(fs::is_symlink(root / "out.csv"));
    CHECK(read_file(root / "out.csv") == "new");
    CHECK(read_file(root / "target.csv") == "theirs");
    CHECK_FALSE(fs::is_symlink(root / "dangling.csv"));
    CHECK_FALSE(fs::exists(root / "nowhere.csv"));
    fs::remove_all(root);
}

// Where the viewer keeps its settings: the XDG Base Directory Specification (freedesktop.org,
// version 0.8): $XDG_CONFIG_HOME when it is set to an absolute path, else $HOME/.config; "If an
// implementation encounters a relative path in any of these variables it should consider the path
// invalid and ignore it."
#include <catch2/catch.hpp>

#include <cstdlib>
#include <optional>
#include <string>

#include "viewer/settings_file.hpp"

namespace {
// Sets an environment variable for one scope and puts the old value back.
struct ScopedEnv {
    std::string name;
    std::optional<std::string> old;
    ScopedEnv(const char* n, const char* value) : name(n) {
        if (const char* o = std::getenv(n)) old = o;
        if (value) setenv(n, value, 1);
        else unsetenv(n);
    }
    ~ScopedEnv() {
        if (old) setenv(name.c_str(), old->c_str(), 1);
        else unsetenv(name.c_str());
    }
};
}  // namespace

TEST_CASE("settings follow XDG_CONFIG_HOME when absolute, else HOME/.config", "[viewer][settings]") {
    using ellipsa::viewer::settings_place;
    ScopedEnv home("HOME", "/home/someone");
    {
        ScopedEnv xdg("XDG_CONFIG_HOME", "/tmp/elsewhere");
        CHECK(settings_place(false).dir == "/tmp/elsewhere/ellipsa");
    }
    {
        ScopedEnv xdg("XDG_CONFIG_HOME", "relative/config");  // invalid: ignored
        CHECK(settings_place(false).dir == "/home/someone/.config/ellipsa");
    }
    {
        ScopedEnv xdg("XDG_CONFIG_HOME", "");  // empty: as if unset
        CHECK(settings_place(false).dir == "/home/someone/.config/ellipsa");
    }
    {
        ScopedEnv xdg("XDG_CONFIG_HOME", nullptr);
        ScopedEnv nohome("HOME", nullptr);
        const auto p = settings_place(false);
        CHECK(p.dir.empty());
        CHECK_FALSE(p.can_save());
    }
}

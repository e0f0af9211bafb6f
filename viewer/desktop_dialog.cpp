#include "viewer/desktop_dialog.hpp"

#include <fcntl.h>
#include <signal.h>
#include <spawn.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cstdlib>
#include <vector>

#include "viewer/scene/file_browser.hpp"

extern char** environ;

namespace ellipsa::viewer {

namespace {
// The first executable `name` in PATH's folders; "" when there is none.
std::string on_path(const char* name) {
    const char* path = std::getenv("PATH");
    std::string dirs = path ? path : "";
    std::size_t start = 0;
    while (start <= dirs.size()) {
        std::size_t end = dirs.find(':', start);
        if (end == std::string::npos) end = dirs.size();
        const std::string dir = dirs.substr(start, end - start);
        if (!dir.empty() && dir.front() == '/') {
            const std::string full = dir + "/" + name;
            if (::access(full.c_str(), X_OK) == 0) return full;
        }
        start = end + 1;
    }
    return "";
}

std::vector<std::string> arguments(const std::string& program, const std::string& folder) {
    const std::string dir = folder.empty() || folder.back() == '/' ? folder : folder + "/";
    if (program.size() >= 7 && program.compare(program.size() - 7, 7, "kdialog") == 0)
        return {program, "--title", "Open a far-field pattern", "--getopenfilename", dir,
                "*.csv *.CSV *.map *.MAP|Far-field CSV and map files\n*|All files"};
    return {program, "--file-selection", "--title=Open a far-field pattern", "--filename=" + dir,
            "--file-filter=Far-field CSV and map files | *.csv *.CSV *.map *.MAP", "--file-filter=All files | *"};
}
}  // namespace

DesktopDialog::DesktopDialog() {
    const char* off = std::getenv("ELLIPSA_NO_DESKTOP_DIALOG");
    if (off && *off && std::string(off) != "0") return;
    program_ = on_path("zenity");
    if (program_.empty()) program_ = on_path("kdialog");
}

DesktopDialog::~DesktopDialog() {
    if (pid_ > 0) {
        ::kill(pid_, SIGTERM);
        ::waitpid(pid_, nullptr, 0);
    }
    if (out_ >= 0) ::close(out_);
}

bool DesktopDialog::start(const std::string& folder) {
    if (!available() || pid_ > 0) return false;
    int fds[2];
    if (::pipe2(fds, O_CLOEXEC) != 0) return false;
    posix_spawn_file_actions_t fa;
    posix_spawn_file_actions_init(&fa);
    posix_spawn_file_actions_adddup2(&fa, fds[1], STDOUT_FILENO);
    posix_spawn_file_actions_addopen(&fa, STDIN_FILENO, "/dev/null", O_RDONLY, 0);
    posix_spawn_file_actions_addopen(&fa, STDERR_FILENO, "/dev/null", O_WRONLY, 0);  // toolkit chatter
    const std::vector<std::string> args = arguments(program_, folder);
    std::vector<char*> argv;
    for (const std::string& a : args) argv.push_back(const_cast<char*>(a.c_str()));
    argv.push_back(nullptr);
    const int rc = ::posix_spawn(&pid_, program_.c_str(), &fa, nullptr, argv.data(), environ);
    posix_spawn_file_actions_destroy(&fa);
    ::close(fds[1]);
    if (rc != 0) {
        pid_ = -1;
        ::close(fds[0]);
        return false;
    }
    out_ = fds[0];
    ::fcntl(out_, F_SETFL, ::fcntl(out_, F_GETFL) | O_NONBLOCK);
    folder_ = folder;
    answer_.clear();
    return true;
}

Intents DesktopDialog::poll() {
    Intents in;
    if (pid_ <= 0) return in;
    char buf[4096];
    for (ssize_t n; (n = ::read(out_, buf, sizeof buf)) > 0;)
        if (answer_.size() < 65536) answer_.append(buf, std::size_t(n));  // a path is short: more is refused below
    int status = 0;
    if (::waitpid(pid_, &status, WNOHANG) != pid_) return in;
    for (ssize_t n; (n = ::read(out_, buf, sizeof buf)) > 0;)
        if (answer_.size() < 65536) answer_.append(buf, std::size_t(n));
    ::close(out_);
    out_ = -1;
    pid_ = -1;
    in.push_back(intent::DesktopDialogClosed{});
    const int code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
    if (code == 0) {
        if (const std::optional<std::string> p = chosen_path(answer_)) {
            if (is_map_file_name(*p)) in.push_back(intent::EditMap{*p});
            else in.push_back(intent::OpenFiles{{*p}, ""});
        }
    } else if (code != 1) {  // 1 is Cancel; anything else: the dialog could not run here
        in.push_back(intent::ShowBrowser{BrowserView::at(folder_)});
    }
    return in;
}

}  // namespace ellipsa::viewer

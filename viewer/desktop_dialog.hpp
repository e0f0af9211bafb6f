// The desktop's own file dialog for File > Open: zenity or kdialog when one is found on PATH,
// started directly (posix_spawn, no shell; its standard output a pipe read without blocking the
// window), its answer checked (viewer/scene/file_browser.hpp chosen_path) before it becomes an
// OpenFiles intent. ELLIPSA_NO_DESKTOP_DIALOG=1 turns it off. When none is there or it cannot run,
// the window shows its own browser instead.
#pragma once
#include <string>
#include <sys/types.h>

#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

class DesktopDialog {
public:
    DesktopDialog();  // looks for zenity, then kdialog, on PATH
    ~DesktopDialog();  // a dialog still open is closed
    DesktopDialog(const DesktopDialog&) = delete;
    DesktopDialog& operator=(const DesktopDialog&) = delete;

    bool available() const { return !program_.empty(); }
    // Show the dialog in `folder`; false when it cannot be started (the caller falls back).
    bool start(const std::string& folder);
    // Once the dialog has ended: DesktopDialogClosed, and OpenFiles (or EditMap for a .map file)
    // when a valid file was chosen; when it failed to run, ShowBrowser in its folder. Nothing while it runs.
    Intents poll();

private:
    std::string program_;  // full path of zenity or kdialog; empty: none
    std::string folder_;
    pid_t pid_ = -1;
    int out_ = -1;       // read end of its standard output
    std::string answer_;  // what it printed so far (bounded)
};

}  // namespace ellipsa::viewer

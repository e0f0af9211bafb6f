// Reads far-field files one after the other on a worker thread, so a large file never freezes
// the window. The loop hands it the files that apply() asks for (Effects::load) and polls it
// each frame; what happened comes back as intents (LoadStatus, LoadFinished).
#pragma once
#include <deque>
#include <memory>
#include <string>

#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

class FileLoader {
public:
    FileLoader();
    ~FileLoader();  // cancels and waits for the file being read
    FileLoader(const FileLoader&) = delete;
    FileLoader& operator=(const FileLoader&) = delete;

    void enqueue(std::string path, std::string map);
    void cancel_current();
    bool idle() const;
    // Start the next file when none is being read; report the status and every finished read.
    Intents poll();

private:
    struct Job;
    std::unique_ptr<Job> current_;
    std::deque<std::pair<std::string, std::string>> waiting_;  // (path, map file)
    bool reported_idle_ = true;
};

}  // namespace ellipsa::viewer

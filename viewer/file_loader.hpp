// Reads far-field files one after the other on a worker thread, so a large file never freezes
// the window. The loop hands it the files that apply() asks for (Effects::load) and polls it
// each frame; what happened comes back as intents (LoadStatus, LoadFinished).
#pragma once
#include <deque>
#include <memory>
#include <optional>
#include <string>

#include "importers/far_field_csv.hpp"
#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

class FileLoader {
public:
    FileLoader();
    ~FileLoader();  // cancels and waits for the file being read
    FileLoader(const FileLoader&) = delete;
    FileLoader& operator=(const FileLoader&) = delete;

    // A file from the UI: `map` is its map file ("" looks beside it).
    void enqueue(std::string path, std::string map);
    // A file from the command line, with the reader options and the mounting the command line
    // made for it (the mounting comes back with the file's LoadFinished).
    void enqueue(std::string path, CsvReadOptions options, InstallRequest install = {});
    void cancel_current();
    bool idle() const;
    // Start the next file when none is being read; report the status and every finished read.
    Intents poll();

private:
    struct Job;
    std::unique_ptr<Job> current_;
    struct Waiting {
        std::string path, map;
        std::optional<CsvReadOptions> options;  // set: read with these (map unused)
        InstallRequest install;
    };
    std::deque<Waiting> waiting_;
    bool reported_idle_ = true;
};

}  // namespace ellipsa::viewer

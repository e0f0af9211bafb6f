// Reads far-field files one after the other on a worker thread, so a large file never freezes
// the window. The loop hands it the files that apply() asks for (Effects::load) and polls it
// each frame; what happened comes back as intents (LoadStatus, LoadFinished).
#pragma once
#include <deque>
#include <functional>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "importers/far_field_csv.hpp"
#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

// One pattern to read: the file, the files that hold the rest of it (FILE::join=OTHER, read with
// the same options and merged: importers/far_field_csv.hpp read_joined_far_field_csv), the
// reader options and the mounting to install it with.
struct FileRequest {
    std::string path;
    std::vector<std::string> join;
    CsvReadOptions options;
    InstallRequest install;
};
// How the window reads a file named in it (typed, picked from the recent list, dropped, chosen in
// a dialog or the browser) with the map file typed beside it ("" none): `ellipsa view` gives the
// command line's own reading of a FILE argument (cli/load.hpp prepare_load), so "a.csv::join=b.csv"
// and the other per-file options mean there what they mean on the command line. Unset: the file
// alone, with its map file or the one beside it.
using PrepareFile = std::function<Result<FileRequest>(const std::string& text, const std::string& map)>;


class FileLoader {
public:
    FileLoader();
    ~FileLoader();  // cancels and waits for the file being read
    FileLoader(const FileLoader&) = delete;
    FileLoader& operator=(const FileLoader&) = delete;

    // A file from the UI: `map` is its map file ("" looks beside it).
    void enqueue(std::string path, std::string map);
    // A file from the command line (or PrepareFile), with the reader options, the files it joins
    // and the mounting the command line made for it (they come back with the file's LoadFinished).
    void enqueue(FileRequest request);
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
        std::vector<std::string> join;
    };
    std::deque<Waiting> waiting_;
    bool reported_idle_ = true;
};

}  // namespace ellipsa::viewer

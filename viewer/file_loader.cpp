#include "viewer/file_loader.hpp"

#include <atomic>
#include <filesystem>
#include <optional>
#include <thread>

#include "viewer/pattern_files.hpp"
#include "viewer/scene/settings.hpp"

namespace ellipsa::viewer {

// One read. The worker touches only this object; poll() takes the result once `done` is set.
struct FileLoader::Job {
    std::string path, map;
    std::optional<CsvReadOptions> options;
    InstallRequest install;
    std::vector<std::string> join;
    std::atomic<double> progress{0};
    std::atomic<bool> cancel{false}, done{false};
    std::optional<Result<FarFieldSet>> result;
    std::thread worker;
    ~Job() {
        cancel = true;
        if (worker.joinable()) worker.join();
    }
};

namespace {
CsvReadOptions with_progress(CsvReadOptions o, std::function<bool(double)> progress) {
    o.progress = std::move(progress);
    return o;
}
}  // namespace

FileLoader::FileLoader() = default;
FileLoader::~FileLoader() = default;

void FileLoader::enqueue(std::string path, std::string map) { waiting_.push_back({std::move(path), std::move(map), {}, {}, {}}); }
void FileLoader::enqueue(FileRequest r) {
    waiting_.push_back({std::move(r.path), "", std::move(r.options), std::move(r.install), std::move(r.join)});
}

void FileLoader::cancel_current() {
    if (current_) current_->cancel = true;
}

bool FileLoader::idle() const { return !current_ && waiting_.empty(); }

Intents FileLoader::poll() {
    Intents out;
    if (current_ && current_->done) {
        current_->worker.join();
        Job& j = *current_;
        std::error_code ec;
        std::vector<std::string> abs_join;
        for (const std::string& f : j.join) abs_join.push_back(std::filesystem::absolute(f, ec).string());
        const std::string abs = recent_entry(std::filesystem::absolute(j.path, ec).string(), abs_join);
        if (j.cancel)
            out.push_back(intent::LoadFinished{j.path, abs, Error{j.path, 0, 0, "loading cancelled"}});
        else if (j.result)
            out.push_back(intent::LoadFinished{j.path, abs, std::move(*j.result), j.install, j.join});
        current_.reset();
    }
    if (!current_ && !waiting_.empty()) {
        current_ = std::make_unique<Job>();
        current_->path = std::move(waiting_.front().path);
        current_->map = std::move(waiting_.front().map);
        current_->options = std::move(waiting_.front().options);
        current_->install = std::move(waiting_.front().install);
        current_->join = std::move(waiting_.front().join);
        waiting_.pop_front();
        Job* raw = current_.get();
        raw->worker = std::thread([raw] {
            auto progress = [raw](double f) {
                raw->progress = f;
                return !raw->cancel.load();
            };
            auto r = raw->options ? load_pattern_file(raw->path, with_progress(*raw->options, progress), raw->join)
                                  : load_pattern_file(raw->path, raw->map, progress);
            raw->result.emplace(std::move(r));
            raw->done = true;
        });
    }
    if (current_) {
        out.push_back(intent::LoadStatus{LoadingView{current_->path, current_->progress.load(), waiting_.size()}});
        reported_idle_ = false;
    } else if (!reported_idle_) {
        out.push_back(intent::LoadStatus{std::nullopt});
        reported_idle_ = true;
    }
    return out;
}

}  // namespace ellipsa::viewer

#include "viewer/scene/file_browser.hpp"

#include <algorithm>
#include <cctype>
#include <filesystem>
#include <system_error>

namespace fs = std::filesystem;

namespace ellipsa::viewer {

namespace {
std::string lower(std::string s) {
    for (char& c : s) c = char(std::tolower(static_cast<unsigned char>(c)));
    return s;
}

bool ends_with(const std::string& s, const char* tail) {
    const std::string t(tail);
    return s.size() >= t.size() && s.compare(s.size() - t.size(), t.size(), t) == 0;
}

std::string without_trailing_slash(const std::string& p) {
    const std::size_t last = p.find_last_not_of('/');
    if (last == std::string::npos) return p.empty() ? std::string() : std::string("/");
    return p.substr(0, last + 1);
}

// Folders first, then by name ignoring case (ties by the exact bytes, so the order is total);
// each name lowered once, not once per comparison.
void sort_entries(std::vector<FolderEntry>& entries) {
    struct Keyed {
        std::string key;
        FolderEntry e;
    };
    std::vector<Keyed> k;
    k.reserve(entries.size());
    for (FolderEntry& e : entries) k.push_back({lower(e.name), std::move(e)});
    std::sort(k.begin(), k.end(), [](const Keyed& a, const Keyed& b) {
        if (a.e.folder != b.e.folder) return a.e.folder;
        return a.key != b.key ? a.key < b.key : a.e.name < b.e.name;
    });
    for (std::size_t i = 0; i < k.size(); ++i) entries[i] = std::move(k[i].e);
}
}  // namespace

bool is_pattern_file_name(const std::string& name) {
    const std::string l = lower(name);
    return ends_with(l, ".csv") || ends_with(l, ".map");
}

bool is_map_file_name(const std::string& name) { return ends_with(lower(name), ".map"); }

FolderListing list_folder(const std::string& folder, BrowseFilter filter, bool hidden, std::size_t max_scan) {
    FolderListing out;
    std::error_code ec;
    fs::path p = fs::absolute(folder.empty() ? fs::path(".") : fs::path(folder), ec);
    const std::string f = without_trailing_slash((ec ? fs::path(folder) : p.lexically_normal()).string());
    out.folder = f.empty() ? std::string(1, '/') : f;
    fs::directory_iterator it(out.folder, fs::directory_options::skip_permission_denied, ec);
    if (ec) {
        out.error = std::string("cannot read ").append(out.folder).append(": ").append(ec.message());
        return out;
    }
    for (const fs::directory_iterator end; it != end; it.increment(ec)) {
        if (ec) {
            out.error = std::string("stopped reading ").append(out.folder).append(": ").append(ec.message());
            break;
        }
        if (out.scanned == max_scan) {
            out.truncated = true;
            break;
        }
        ++out.scanned;
        std::string name = it->path().filename().string();
        if (!hidden && !name.empty() && name[0] == '.') continue;
        std::error_code dec;
        const bool dir = it->is_directory(dec);  // follows links: a link to a folder is a folder
        if (!dir && filter == BrowseFilter::patterns && !is_pattern_file_name(name)) continue;
        out.entries.push_back({std::move(name), dir});
    }
    sort_entries(out.entries);
    return out;
}

std::vector<std::size_t> matching_entries(const FolderListing& l, const std::string& typed) {
    std::vector<std::size_t> starts, contains;
    const std::string t = lower(typed);
    for (std::size_t i = 0; i < l.entries.size(); ++i) {
        if (t.empty()) {
            starts.push_back(i);
            continue;
        }
        const std::size_t at = lower(l.entries[i].name).find(t);
        if (at == 0) starts.push_back(i);
        else if (at != std::string::npos) contains.push_back(i);
    }
    starts.insert(starts.end(), contains.begin(), contains.end());
    return starts;
}

std::string parent_folder(const std::string& folder) {
    const std::string f = without_trailing_slash(folder);
    const std::size_t slash = f.find_last_of('/');
    if (slash == std::string::npos) return f.empty() ? "/" : ".";
    return slash == 0 ? "/" : f.substr(0, slash);
}

std::string join_path(const std::string& folder, const std::string& name) {
    return folder.empty() || folder.back() == '/' ? folder + name : folder + "/" + name;
}

std::vector<std::string> recent_folders(const std::vector<std::string>& recent_files, std::size_t max) {
    std::vector<std::string> out;
    for (const std::string& f : recent_files) {
        if (out.size() == max) break;
        std::error_code ec;
        // A joined pattern is kept as "PATH::join=OTHER" (viewer/file_loader.hpp): its folder is
        // PATH's. A path that exists as given is taken whole, as the command line takes it.
        const std::size_t options = f.find("::");
        const fs::path file = options == std::string::npos || fs::exists(fs::path(f), ec) ? fs::path(f) : fs::path(f.substr(0, options));
        const fs::path abs = fs::absolute(file, ec);
        if (ec || !abs.has_parent_path()) continue;
        const std::string d = without_trailing_slash(abs.lexically_normal().parent_path().string());
        if (!d.empty() && std::find(out.begin(), out.end(), d) == out.end()) out.push_back(d);
    }
    return out;
}

std::optional<std::string> chosen_path(const std::string& dialog_output) {
    std::string p = dialog_output;
    if (!p.empty() && p.back() == '\n') p.pop_back();
    if (p.empty() || p.front() != '/' || p.find('\n') != std::string::npos || p.find('\0') != std::string::npos) return std::nullopt;
    std::error_code ec;
    if (!fs::is_regular_file(fs::path(p), ec) || ec) return std::nullopt;
    return p;
}

}  // namespace ellipsa::viewer

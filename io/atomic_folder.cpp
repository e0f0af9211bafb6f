#include "io/atomic_folder.hpp"

#include <algorithm>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <filesystem>
#include <sys/stat.h>
#include <unistd.h>

#include "io/atomic_write.hpp"
#include "io/place.hpp"

namespace ellipsa::io {

namespace {

namespace fs = std::filesystem;

std::string reason(int e) { return std::strerror(e); }

std::string strip_slashes(std::string p) {
    while (p.size() > 1 && p.back() == '/') p.pop_back();
    return p;
}

void remove_tree(const std::string& p) {
    std::error_code ec;
    fs::remove_all(p, ec);
}

// Whether an existing folder may be replaced: it holds the marker and none of the inputs.
Status may_replace(const std::string& target, const std::vector<std::string>& inputs) {
    struct stat st {};
    const std::string marker = target + "/" + folder_marker;
    if (::lstat(marker.c_str(), &st) != 0 || !S_ISREG(st.st_mode))
        return Error{target, 0, 0,
                     std::string("exists and was not made by ellipsa (it has no ") + folder_marker +
                         " file); not replacing it, even with --force: choose another name or remove it yourself"};
    std::error_code ec;
    const fs::path dir = fs::canonical(target, ec);
    if (ec) return Error{target, 0, 0, "cannot resolve the folder's path: " + ec.message()};
    for (const std::string& in : inputs) {
        const fs::path p = fs::weakly_canonical(in, ec);
        if (ec) continue;
        const auto [d, q] = std::mismatch(dir.begin(), dir.end(), p.begin(), p.end());
        if (d == dir.end())
            return Error{target, 0, 0,
                         "holds " + in + ", an input of this run; not replacing it, even with --force"};
    }
    return Ok{};
}

// A fresh temporary folder beside `target`, created with 0777 so the umask applies.
Result<std::string> create_temporary(const std::string& target) {
    for (int attempt = 0; attempt < 100; ++attempt) {
        std::string tmp = detail::temporary_name(target);
        if (::mkdir(tmp.c_str(), 0777) == 0) return tmp;
        if (errno != EEXIST) break;
    }
    return Error{target, 0, 0, detail::parent_problem(target, errno)};
}

// Swap the finished folder with the old one (renameat2 RENAME_EXCHANGE), then delete the old
// content; without exchange: move the old folder aside, the new one in, then delete the old one
// (putting it back when the second move fails).
Status swap_in(const std::string& tmp, const std::string& target) {
    if (::renameat2(AT_FDCWD, tmp.c_str(), AT_FDCWD, target.c_str(), RENAME_EXCHANGE) == 0) {
        detail::sync_parent(target);
        remove_tree(tmp);
        return Ok{};
    }
    const std::string old = detail::temporary_name(target);
    if (::rename(target.c_str(), old.c_str()) != 0) {
        const int e = errno;
        remove_tree(tmp);
        return Error{target, 0, 0, "cannot replace the existing folder: " + reason(e)};
    }
    if (::rename(tmp.c_str(), target.c_str()) != 0) {
        const int e = errno;
        ::rename(old.c_str(), target.c_str());
        remove_tree(tmp);
        return Error{target, 0, 0, "cannot move the finished folder into place: " + reason(e)};
    }
    detail::sync_parent(target);
    remove_tree(old);
    return Ok{};
}

}  // namespace

Status publish_folder(const std::string& target_in, const std::function<Status(const std::string&)>& fill,
                      bool overwrite, const std::vector<std::string>& inputs) {
    const std::string target = strip_slashes(target_in);
    if (target.empty()) return Error{target_in, 0, 0, "expected a folder name"};
    struct stat st {};
    const bool exists = ::lstat(target.c_str(), &st) == 0;
    if (exists && !S_ISDIR(st.st_mode)) {
        const std::string kind = detail::unreplaceable_kind(st.st_mode);
        return Error{target, 0, 0, "exists and is " + (kind.empty() ? std::string("not a folder") : kind) + "; not replacing it"};
    }
    if (exists && !overwrite) return Error{target, 0, 0, detail::exists_message};
    if (exists)
        if (Status ok = may_replace(target, inputs); !ok) return ok;

    auto tmp = create_temporary(target);
    if (!tmp) return tmp.error();
    if (exists) ::chmod(tmp->c_str(), st.st_mode & 07777);
    Status filled = fill(*tmp);
    if (filled)
        filled = write_file_atomically(*tmp + "/" + folder_marker,
                                       "This folder was made by ellipsa; it replaces it (with --force) only while "
                                       "this file is here.\n",
                                       false);
    if (!filled) {
        remove_tree(*tmp);
        Error e = filled.error();
        // Name the file as it would have been in the folder, not under the temporary name.
        if (e.file.compare(0, tmp->size() + 1, *tmp + "/") == 0) e.file = target + e.file.substr(tmp->size());
        return e;
    }
    if (exists) return swap_in(*tmp, target);
    if (const int e = detail::rename_no_replace(*tmp, target, true); e != 0) {
        remove_tree(*tmp);
        if (e == EEXIST) return Error{target, 0, 0, detail::exists_message};
        return Error{target, 0, 0, "cannot move the finished folder into place: " + reason(e)};
    }
    detail::sync_parent(target);
    return Ok{};
}

}  // namespace ellipsa::io

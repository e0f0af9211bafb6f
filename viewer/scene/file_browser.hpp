// The pure part of File > Open: a folder's listing for the in-window file browser (sorted,
// filtered, hidden entries on request, bounded in time and memory), the type-to-filter match,
// the parent folder, the recent folders (from the recent files the settings keep), and the check
// of a path that a desktop dialog (zenity, kdialog) printed. No ImGui, no GL: unit-tested.
#pragma once
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace ellipsa::viewer {

struct FolderEntry {
    std::string name;     // the entry's own name, no folder
    bool folder = false;  // a folder (or a link to one): Enter goes into it
};

// What the browser lists: far-field CSV and map files (.csv, .map, any case), or every file.
// Folders are always listed.
enum class BrowseFilter { patterns, all_files };

struct FolderListing {
    std::string folder;                // absolute, without a trailing slash (except "/")
    std::vector<FolderEntry> entries;  // folders first, then files; each case-insensitively by name
    std::size_t scanned = 0;           // entries read from the folder (before filtering)
    bool truncated = false;            // the folder held more than the scan bound: the rest is not listed
    std::string error;                 // why the folder cannot be listed ("cannot read /root: Permission denied")
};

// At most this many entries are read from one folder (a folder of millions of files stays a
// bounded wait and a bounded list; the path field still opens any file in it).
inline constexpr std::size_t max_folder_scan = 200000;

// The listing of `folder` (made absolute); hidden entries (names starting with '.') only when
// `hidden`. Never throws: an unreadable or missing folder gives `error` and no entries.
FolderListing list_folder(const std::string& folder, BrowseFilter filter, bool hidden,
                          std::size_t max_scan = max_folder_scan);

// A far-field CSV or map file by its name's extension (.csv, .map, any case).
bool is_pattern_file_name(const std::string& name);
// A column-map file by its name (.map, any case).
bool is_map_file_name(const std::string& name);

// The indices of the entries whose name contains `typed` (case-insensitive), those that start
// with it first, each group in listing order. Empty `typed`: every entry.
std::vector<std::size_t> matching_entries(const FolderListing& l, const std::string& typed);

// The folder above `folder` ("/" stays "/").
std::string parent_folder(const std::string& folder);
// `name` inside `folder`.
std::string join_path(const std::string& folder, const std::string& name);

// The folders of the recent files, most recent first, each once, at most `max`; an entry with
// options ("PATH::join=OTHER", a joined pattern) counts PATH's folder.
std::vector<std::string> recent_folders(const std::vector<std::string>& recent_files, std::size_t max);

// The file a desktop dialog printed on its standard output: one line (a final newline dropped),
// an absolute path to a regular file. nullopt for anything else (cancelled, empty, several lines,
// a NUL byte, a relative path, a folder, a missing file).
std::optional<std::string> chosen_path(const std::string& dialog_output);

}  // namespace ellipsa::viewer
